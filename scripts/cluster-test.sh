#!/usr/bin/env bash
# The command line on a real scheduler: stands up a one-node Slurm (scripts/slurm-one-node.sh),
# submits the example experiment (runs and three studies) as a 4-task job array with a dependent
# merge (examples/slurm/), and checks every merged file is byte-identical to a single-process run. Tears the daemons down by their
# PIDs on exit. Run as root (CI is); prints what each shard cost.
set -euo pipefail
cd "$(dirname "$0")/.."
root=$(pwd)
experiment=${EXPERIMENT:-examples/camel-ridge-studies.fall.json}
shards=${SHARDS:-4}
export FALL_SLURM_DIR=${FALL_SLURM_DIR:-/tmp/fall-slurm}
work=$(mktemp -d /tmp/fall-cluster-test-XXXXXX)

cleanup() {
  scripts/slurm-one-node.sh down || true
}
trap cleanup EXIT

[ -f dist-cli/fall.mjs ] || npm run build:cli
eval "export $(scripts/slurm-one-node.sh up | tail -n 1)" # SLURM_CONF=...

echo "cluster-test: single-process run" >&2
npx --no-install fall run "$experiment" --out "$work/single" --threads 1 2>"$work/single.log"

echo "cluster-test: submitting a $shards-task array and a dependent merge" >&2
started=$(date +%s.%N)
read -r array merge < <(SHARDS=$shards LOGS=$work/logs examples/slurm/submit.sh "$experiment" "$work/shards")
echo "cluster-test: array job $array, merge job $merge" >&2
for _ in $(seq 600); do
  [ -z "$(squeue -h -j "$array,$merge" 2>/dev/null)" ] && break
  sleep 0.5
done
finished=$(date +%s.%N)
if [ -n "$(squeue -h -j "$array,$merge" 2>/dev/null)" ]; then
  echo "cluster-test: FAIL: jobs still queued after 300 s" >&2
  squeue >&2
  exit 1
fi

status=0
for k in $(seq 0 $((shards - 1))); do
  for f in fall-line-trajectories fall-line-results; do
    [ -f "$work/shards/$f.shard-$k-of-$shards.csv" ] || { echo "cluster-test: FAIL: shard $k/$shards wrote no $f" >&2; status=1; }
  done
done
for f in $(ls "$work/single"); do
  if cmp -s "$work/single/$f" "$work/shards/$f"; then
    echo "cluster-test: $f identical ($(wc -c <"$work/single/$f") bytes)" >&2
  else
    echo "cluster-test: FAIL: merged $f differs from the single-process run (or is missing)" >&2
    status=1
  fi
done

echo "cluster-test: submit to merged: $(awk "BEGIN { printf \"%.1f\", $finished - $started }") s for $shards shards" >&2
grep -hE "^(wrote|shard )" "$work/logs"/fall-shard-"$array"_*.out | sed 's/^/cluster-test: shard: /' >&2 || true
grep -h "^wrote" "$work/single.log" | sed 's/^/cluster-test: single: /' >&2 || true
[ "$status" -eq 0 ] && echo "cluster-test: PASS" >&2
exit "$status"
