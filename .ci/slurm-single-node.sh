# Sourced by .ci/run: a throwaway single-node Slurm cluster on this machine, for the test that
# submits a sweep as a real array job. Needs root and Debian's slurm-wlm and munge.
# slurm_up starts munged (fresh key, own socket), slurmctld and slurmd with a configuration in a
# temporary folder and exports SLURM_CONF; slurm_down stops them and removes the folder.

slurm_up() {
  SLURM_CI_DIR="$(mktemp -d /tmp/spindrift-slurm.XXXXXX)"
  chmod 755 "$SLURM_CI_DIR"
  local d="$SLURM_CI_DIR" host cpus mem
  host="$(hostname -s)"
  cpus="$(nproc)"
  mem=$(( $(awk '/^MemTotal:/ {print $2}' /proc/meminfo) / 1024 * 7 / 10 ))
  mkdir -p "$d/munge" "$d/state" "$d/spool"
  chmod 700 "$d/munge"
  # a fresh MUNGE key: 1024 random bytes, readable by its owner only
  head -c 1024 /dev/urandom > "$d/munge/munge.key"
  chmod 400 "$d/munge/munge.key"
  munged --force --key-file="$d/munge/munge.key" --socket="$d/munge/munge.socket" \
    --pid-file="$d/munge/munged.pid" --log-file="$d/munge/munged.log" --seed-file="$d/munge/munged.seed"
  cat > "$d/slurm.conf" <<CONF
ClusterName=spindrift-ci
SlurmctldHost=$host
SlurmUser=root
SlurmdUser=root
AuthType=auth/munge
AuthInfo=socket=$d/munge/munge.socket
CredType=cred/munge
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
SelectType=select/cons_tres
SelectTypeParameters=CR_Core_Memory
SchedulerType=sched/backfill
JobAcctGatherType=jobacct_gather/none
AccountingStorageType=accounting_storage/none
MpiDefault=none
ReturnToService=2
StateSaveLocation=$d/state
SlurmdSpoolDir=$d/spool
SlurmctldPidFile=$d/slurmctld.pid
SlurmdPidFile=$d/slurmd.pid
SlurmctldLogFile=$d/slurmctld.log
SlurmdLogFile=$d/slurmd.log
NodeName=$host CPUs=$cpus RealMemory=$mem State=UNKNOWN
PartitionName=ci Nodes=$host Default=YES MaxTime=INFINITE State=UP
CONF
  export SLURM_CONF="$d/slurm.conf"
  slurmctld -f "$SLURM_CONF"
  slurmd -f "$SLURM_CONF"
  local i
  for i in $(seq 1 60); do
    if sinfo -h -o '%T' 2>/dev/null | grep -qE '^(idle|mixed|allocated)'; then
      echo "slurm: single-node cluster up on $host ($cpus CPUs, ${mem} MB), SLURM_CONF=$SLURM_CONF"
      return 0
    fi
    sleep 1
  done
  echo "slurm: the node did not come up; logs:" >&2
  tail -n 20 "$d/slurmctld.log" "$d/slurmd.log" "$d/munge/munged.log" >&2 || true
  return 1
}

slurm_down() {
  local d="${SLURM_CI_DIR:-}" f
  [ -n "$d" ] && [ -d "$d" ] || return 0
  for f in "$d/slurmd.pid" "$d/slurmctld.pid" "$d/munge/munged.pid"; do
    if [ -f "$f" ]; then
      kill "$(cat "$f")" 2>/dev/null || true
    fi
  done
  sleep 1
  rm -rf "$d"
  SLURM_CI_DIR=""
}
