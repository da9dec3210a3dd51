#!/usr/bin/env bash
# A real one-node Slurm cluster on this machine, for the command line's cluster test.
#   scripts/slurm-one-node.sh up     installs Debian's slurmctld, slurmd, slurm-client and munge if
#                                    missing (as root), writes a config under $FALL_SLURM_DIR and starts
#                                    munged (unless running), slurmctld and slurmd
#   scripts/slurm-one-node.sh down   stops the daemons it started, by the PIDs it recorded
# Callers export SLURM_CONF=$FALL_SLURM_DIR/slurm.conf (printed by `up`). Nothing under /etc/slurm is
# touched; munge uses its standard key (/etc/munge/munge.key, created only if missing).
set -euo pipefail
state=${FALL_SLURM_DIR:-/tmp/fall-slurm}
conf=$state/slurm.conf

need_root() {
  if [ "$(id -u)" -ne 0 ]; then
    echo "slurm-one-node: must run as root (it installs packages and starts daemons); try: sudo $0 $*" >&2
    exit 1
  fi
}

install_packages() {
  if command -v slurmctld >/dev/null && command -v slurmd >/dev/null && command -v sbatch >/dev/null && command -v munged >/dev/null; then return; fi
  echo "slurm-one-node: installing slurmctld slurmd slurm-client munge" >&2
  apt-get update -q >&2
  DEBIAN_FRONTEND=noninteractive apt-get install -y -q --no-install-recommends slurmctld slurmd slurm-client munge </dev/null >&2
}

munge_pid() {
  local f=/run/munge/munged.pid
  [ -f "$f" ] && kill -0 "$(cat "$f")" 2>/dev/null && cat "$f"
}

start_munge() {
  if munge -n 2>/dev/null | unmunge >/dev/null 2>&1; then return; fi # a munged is already serving
  if [ ! -f /etc/munge/munge.key ]; then
    mkdir -p /etc/munge
    dd if=/dev/urandom of=/etc/munge/munge.key bs=1024 count=1 status=none
    chown munge:munge /etc/munge/munge.key
    chmod 400 /etc/munge/munge.key
  fi
  mkdir -p /run/munge /var/log/munge /var/lib/munge
  chown munge:munge /run/munge /var/log/munge /var/lib/munge
  runuser -u munge -- /usr/sbin/munged
  for _ in $(seq 50); do munge_pid >/dev/null && break; sleep 0.1; done
  munge_pid >"$state/munged.pid"
  munge -n | unmunge >/dev/null
}

write_config() {
  local host cpus
  host=$(hostname -s)
  cpus=$(nproc)
  mkdir -p "$state/ctld" "$state/d" "$state/log"
  cat >"$conf" <<CONF
# Written by scripts/slurm-one-node.sh: a one-node cluster for tests.
ClusterName=fall-test
SlurmctldHost=$host
SlurmUser=root
AuthType=auth/munge
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
SchedulerType=sched/backfill
SelectType=select/cons_tres
SelectTypeParameters=CR_Core
StateSaveLocation=$state/ctld
SlurmdSpoolDir=$state/d
SlurmctldPidFile=$state/slurmctld.pid
SlurmdPidFile=$state/slurmd.pid
SlurmctldLogFile=$state/log/slurmctld.log
SlurmdLogFile=$state/log/slurmd.log
ReturnToService=2
JobAcctGatherType=jobacct_gather/none
MpiDefault=none
NodeName=$host CPUs=$cpus State=UNKNOWN
PartitionName=main Nodes=$host Default=YES MaxTime=INFINITE State=UP
CONF
}

wait_for_node() {
  for _ in $(seq 100); do
    if SLURM_CONF=$conf sinfo -h -o '%t' 2>/dev/null | grep -qE '^(idle|mix|alloc)'; then return; fi
    sleep 0.3
  done
  echo "slurm-one-node: the node did not come up; logs in $state/log" >&2
  exit 1
}

up() {
  need_root up
  install_packages
  mkdir -p "$state"
  start_munge
  write_config
  /usr/sbin/slurmctld -f "$conf"
  /usr/sbin/slurmd -f "$conf"
  wait_for_node
  echo "SLURM_CONF=$conf"
}

stop_pid_file() {
  local f=$1
  [ -s "$f" ] || return 0
  local pid
  pid=$(cat "$f")
  if kill -0 "$pid" 2>/dev/null; then
    kill "$pid"
    for _ in $(seq 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
  fi
  rm -f "$f"
}

down() {
  stop_pid_file "$state/slurmd.pid"
  stop_pid_file "$state/slurmctld.pid"
  stop_pid_file "$state/munged.pid" # only present when `up` started munged
}

case "${1:-}" in
  up) up ;;
  down) down ;;
  *) echo "usage: $0 up|down" >&2; exit 1 ;;
esac
