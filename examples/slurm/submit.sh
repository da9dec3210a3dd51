#!/usr/bin/env bash
# Submits a sharded Fall Line run to Slurm: an array of SHARDS tasks, then a merge that waits for all.
#   examples/slurm/submit.sh EXPERIMENT.fall.json OUTDIR
# The shards share the file's runs and every study in it (e.g. examples/camel-ridge-studies.fall.json);
# the merge writes the same files, study CSVs included, as one `fall run`.
# Settings (environment): SHARDS (default 4), PARTITION (default: the cluster's), TIME (per shard,
# default 00:30:00), CPUS (threads per shard, default 1), LOGS (folder for the jobs' output, default
# logs). Prints the two job ids, array first.
set -euo pipefail
cd "$(dirname "$0")/../.."
experiment=$1
out=$2
shards=${SHARDS:-4}
npx --no-install fall check "$experiment" >/dev/null # refuse a bad file before queueing anything
logs=${LOGS:-logs}
mkdir -p "$logs"
common=(--parsable ${PARTITION:+--partition="$PARTITION"})
array=$(sbatch "${common[@]}" --array="0-$((shards - 1))" --time="${TIME:-00:30:00}" --cpus-per-task="${CPUS:-1}" \
  --output="$logs/fall-shard-%A_%a.out" examples/slurm/fall-shard.sbatch "$experiment" "$out")
array=${array%%;*}
merge=$(sbatch "${common[@]}" --dependency="afterok:$array" --output="$logs/fall-merge-%j.out" examples/slurm/fall-merge.sbatch "$out")
merge=${merge%%;*}
echo "$array $merge"
