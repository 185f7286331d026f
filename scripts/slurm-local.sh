#!/usr/bin/env bash
# Single-node Slurm on this machine, for integration tests and CI.
#
#   scripts/slurm-local.sh start     install Slurm + MUNGE if missing, start munged, slurmctld and slurmd
#                                    (or reuse the ones this script already started); last stdout line is
#                                    SLURM_CONF=/path/to/slurm.conf
#   scripts/slurm-local.sh status    exit 0 and print "idle" when the node is idle; exit 1 when the
#                                    daemons run but the node is not idle; exit 3 when they are not running
#   scripts/slurm-local.sh selftest  submit a 4-task array and a dependent job, wait, verify outputs
#   scripts/slurm-local.sh stop      stop the daemons this script started (by recorded PIDs), nothing else
#
# Everything (config, munge key and socket, state, spool, logs, pid files) lives under the state dir,
# $REPRISE_SLURM_DIR (default /tmp/reprise-slurm). After `start`, `source $STATE_DIR/env` sets
# SLURM_CONF and PATH for sbatch/squeue/scontrol/scancel.
#
# Only loopback addresses are used: the controller and the node are both 127.0.0.1.
# Tunables (environment): REPRISE_SLURM_DIR, REPRISE_SLURM_CTLD_PORT (6817), REPRISE_SLURM_NODE_PORT
# (6818), REPRISE_SLURM_START_TIMEOUT (60 s), REPRISE_SLURM_SELFTEST_TIMEOUT (120 s),
# REPRISE_SLURM_DEBUG (daemon log level, default info), REPRISE_SLURM_PROBE (0 skips the probe job that
# `start` runs to prove that jobs really run).
#
# Note: with process tracking misconfigured, srun and `sbatch --wait` exit 0 even though every step
# fails, so the selftest never trusts exit codes alone; it checks job states and output files.

set -euo pipefail

STATE_DIR=${REPRISE_SLURM_DIR:-/tmp/reprise-slurm}
CTLD_PORT=${REPRISE_SLURM_CTLD_PORT:-6817}
NODE_PORT=${REPRISE_SLURM_NODE_PORT:-6818}
START_TIMEOUT=${REPRISE_SLURM_START_TIMEOUT:-60}
SELFTEST_TIMEOUT=${REPRISE_SLURM_SELFTEST_TIMEOUT:-120}

ETC_DIR=$STATE_DIR/etc
RUN_DIR=$STATE_DIR/run
LOG_DIR=$STATE_DIR/log
MUNGE_DIR=$STATE_DIR/munge
SLURM_CONF_FILE=$ETC_DIR/slurm.conf
ENV_FILE=$STATE_DIR/env
MUNGE_SOCKET=$MUNGE_DIR/socket/munge.socket.2
DAEMONS=(munged slurmctld slurmd)   # start order; stop goes in reverse

PACKAGES=(slurmctld slurmd slurm-client munge)
REQUIRED_PROGRAMS=(munged mungekey munge unmunge slurmctld slurmd sbatch squeue scontrol scancel sinfo)

export PATH="/usr/sbin:/usr/bin:/sbin:/bin:$PATH"
export SLURM_CONF=$SLURM_CONF_FILE
# Do not let settings from a calling Slurm job or user environment leak into ours.
unset SLURM_CLUSTERS SLURM_JOB_ID SLURM_ARRAY_JOB_ID 2>/dev/null || true

log() { printf 'slurm-local: %s\n' "$*" >&2; }
die() { printf 'slurm-local: ERROR: %s\n' "$*" >&2; exit 1; }
now() { date +%s.%N; }
elapsed() { awk -v a="$1" -v b="$(now)" 'BEGIN { printf "%.2f", b - a }'; }

log_file() {
  case $1 in
    munged) echo "$LOG_DIR/munged.stderr" ;;   # in --foreground mode munged logs to stderr
    slurmctld) echo "$LOG_DIR/slurmctld.log" ;;
    slurmd) echo "$LOG_DIR/slurmd.log" ;;
  esac
}
pid_file() { echo "$RUN_DIR/$1.pid"; }

show_log_tails() {
  # slurmctld/slurmd in -D mode write the same lines to their log file and to stderr; the .stderr file
  # matters when they die before opening the log file.
  local d f
  for d in "${DAEMONS[@]}"; do
    f=$(log_file "$d")
    [[ -s $f ]] || f=$LOG_DIR/$d.stderr
    if [[ -s $f ]]; then
      printf -- '----- last lines of %s -----\n' "$f" >&2
      tail -n 25 "$f" >&2 || true
    fi
  done
}
STARTING=0
fail() {
  printf 'slurm-local: ERROR: %s\n' "$*" >&2
  show_log_tails
  if [[ $STARTING -eq 1 ]]; then
    STARTING=0
    log "start failed: stopping the daemons it had started"
    cmd_stop || true
  fi
  printf 'slurm-local: ERROR: %s (daemon logs above, in %s)\n' "$*" "$LOG_DIR" >&2
  exit 1
}

# True if PID is alive, runs program NAME, and its command line mentions our state dir
# (so a recycled PID or somebody else's daemon is never mistaken for ours).
is_our_daemon() {
  local pid=$1 name=$2 comm cmdline
  [[ $pid =~ ^[0-9]+$ ]] || return 1
  [[ -r /proc/$pid/comm ]] || return 1
  comm=$(cat "/proc/$pid/comm" 2>/dev/null) || return 1
  [[ $comm == "$name" ]] || return 1
  cmdline=$({ tr '\0' ' ' <"/proc/$pid/cmdline"; } 2>/dev/null) || return 1
  [[ $cmdline == *"$STATE_DIR/"* ]]
}

# Prints the PID of our running daemon NAME, or nothing (and removes a stale pid file).
running_pid() {
  local name=$1 f pid
  f=$(pid_file "$name")
  [[ -f $f ]] || return 0
  pid=$(tr -dc '0-9' <"$f" 2>/dev/null || true)
  if [[ -n $pid ]] && is_our_daemon "$pid" "$name"; then
    echo "$pid"
  else
    log "removing stale pid file $f (pid '${pid}' is not our $name)"
    rm -f "$f"
  fi
}

port_listener() {   # prints "yes" if something listens on TCP port $1 (IPv4 or IPv6)
  local hex
  hex=$(printf '%04X' "$1")
  if awk -v p=":$hex" '$4 == "0A" && substr($2, length($2) - 4) == p { found = 1 } END { exit !found }' \
      /proc/net/tcp /proc/net/tcp6 2>/dev/null; then
    echo yes
  fi
}

# ---------------------------------------------------------------------------------------------- install
missing_programs() {
  local p out=()
  for p in "${REQUIRED_PROGRAMS[@]}"; do command -v "$p" >/dev/null 2>&1 || out+=("$p"); done
  echo "${out[*]:-}"
}

install_packages() {
  local missing t0 created_policy=0
  missing=$(missing_programs)
  [[ -z $missing ]] && return 0
  [[ $(id -u) -eq 0 ]] || die "programs missing ($missing) and not root, so cannot apt-get install ${PACKAGES[*]}"
  t0=$(now)
  log "installing ${PACKAGES[*]} (missing: $missing)"
  # Keep the packages' init scripts from starting system-wide daemons during installation.
  if [[ ! -e /usr/sbin/policy-rc.d ]]; then
    printf '#!/bin/sh\nexit 101\n' >/usr/sbin/policy-rc.d
    chmod 755 /usr/sbin/policy-rc.d
    created_policy=1
  fi
  local apt_log=$STATE_DIR/apt.log ok=0
  export DEBIAN_FRONTEND=noninteractive
  if ! compgen -G '/var/lib/apt/lists/*_Packages*' >/dev/null; then
    log "package lists are empty: apt-get update"
    apt-get update -q </dev/null >"$apt_log" 2>&1 || { tail -n 20 "$apt_log" >&2; die "apt-get update failed"; }
  fi
  if apt-get install -y -q --no-install-recommends "${PACKAGES[@]}" </dev/null >>"$apt_log" 2>&1; then
    ok=1
  else
    log "apt-get install failed; package lists may be stale: apt-get update and retry"
    if apt-get update -q </dev/null >>"$apt_log" 2>&1 &&
       apt-get install -y -q --no-install-recommends "${PACKAGES[@]}" </dev/null >>"$apt_log" 2>&1; then
      ok=1
    fi
  fi
  [[ $created_policy -eq 1 ]] && rm -f /usr/sbin/policy-rc.d
  if [[ $ok -ne 1 ]]; then
    tail -n 20 "$apt_log" >&2
    die "could not install ${PACKAGES[*]} (full log: $apt_log)"
  fi
  missing=$(missing_programs)
  [[ -z $missing ]] || die "still missing after install: $missing"
  log "installed in $(elapsed "$t0") s"
}

# ----------------------------------------------------------------------------------------------- config
write_config() {
  local host node_line
  host=$(hostname -s 2>/dev/null || uname -n)
  host=${host%%.*}
  # First line of `slurmd -C` is e.g. "NodeName=vm CPUs=2 Boards=1 ... RealMemory=24000".
  node_line=$(slurmd -C 2>/dev/null | head -n 1)
  [[ $node_line == NodeName=* ]] || die "unexpected output of 'slurmd -C': $node_line"
  local node_name=${node_line%% *}
  node_name=${node_name#NodeName=}

  mkdir -p "$ETC_DIR" "$RUN_DIR" "$LOG_DIR" "$STATE_DIR/ctld-state" "$STATE_DIR/slurmd-spool"
  cat >"$SLURM_CONF_FILE.tmp" <<EOF
# Written by scripts/slurm-local.sh; single node, loopback only, no accounting.
ClusterName=reprise
SlurmctldHost=$host(127.0.0.1)
SlurmctldPort=$CTLD_PORT
SlurmdPort=$NODE_PORT
SlurmUser=root
SlurmdUser=root
AuthType=auth/munge
CredType=cred/munge
AuthInfo=socket=$MUNGE_SOCKET
StateSaveLocation=$STATE_DIR/ctld-state
SlurmdSpoolDir=$STATE_DIR/slurmd-spool
SlurmctldPidFile=$(pid_file slurmctld)
SlurmdPidFile=$(pid_file slurmd)
SlurmctldLogFile=$(log_file slurmctld)
SlurmdLogFile=$(log_file slurmd)
SlurmctldDebug=${REPRISE_SLURM_DEBUG:-info}
SlurmdDebug=${REPRISE_SLURM_DEBUG:-info}
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
JobAcctGatherType=jobacct_gather/none
AccountingStorageType=accounting_storage/none
JobCompType=jobcomp/none
SelectType=select/cons_tres
SelectTypeParameters=CR_CPU
SchedulerType=sched/builtin
# A job whose afterok dependency failed stays PENDING with reason DependencyNeverSatisfied (here
# kill_invalid_depend did not cancel it within 75 s), so pollers must treat that reason as a failure.
SchedulerParameters=batch_sched_delay=0
MailProg=/bin/true
ReturnToService=2
# Finished jobs stay visible to squeue/scontrol for an hour (there is no accounting to ask later).
MinJobAge=3600
MaxArraySize=10001
MaxJobCount=100000
InactiveLimit=0
KillWait=5
SlurmctldTimeout=30
SlurmdTimeout=60
MpiDefault=none
$node_line NodeAddr=127.0.0.1 State=UNKNOWN
PartitionName=local Nodes=$node_name Default=YES MaxTime=INFINITE State=UP
EOF
  mv "$SLURM_CONF_FILE.tmp" "$SLURM_CONF_FILE"
  # slurmd 22.05 dies on hosts with cgroup v2 unless told to use v1; proctrack/task do not use it.
  printf 'CgroupPlugin=cgroup/v1\nIgnoreSystemd=yes\n' >"$ETC_DIR/cgroup.conf"
  echo "$node_name" >"$STATE_DIR/nodename"

  cat >"$ENV_FILE.tmp" <<EOF
# Source this file to use the local Slurm started by scripts/slurm-local.sh
export SLURM_CONF=$SLURM_CONF_FILE
export PATH=/usr/bin:/usr/sbin:\${PATH}
EOF
  mv "$ENV_FILE.tmp" "$ENV_FILE"
}

# ------------------------------------------------------------------------------------------------ munge
start_munged() {
  mkdir -p "$MUNGE_DIR/socket" "$MUNGE_DIR/lib"
  chmod 700 "$MUNGE_DIR/lib"
  chmod 755 "$MUNGE_DIR" "$MUNGE_DIR/socket"   # clients need to reach the socket folder
  if [[ ! -s $MUNGE_DIR/munge.key ]]; then
    mungekey --create --keyfile="$MUNGE_DIR/munge.key" >>"$LOG_DIR/munged.stderr" 2>&1 ||
      fail "mungekey --create failed"
  fi
  chmod 600 "$MUNGE_DIR/munge.key"
  rm -f "$MUNGE_SOCKET" "$MUNGE_SOCKET.lock"
  launch munged munged --foreground \
    --key-file="$MUNGE_DIR/munge.key" \
    --socket="$MUNGE_SOCKET" \
    --pid-file="$(pid_file munged)" \
    --seed-file="$MUNGE_DIR/lib/munged.seed"
  local i
  for ((i = 0; i < 100; i++)); do
    [[ -S $MUNGE_SOCKET ]] && break
    check_alive munged
    sleep 0.05
  done
  [[ -S $MUNGE_SOCKET ]] || fail "munged did not create its socket $MUNGE_SOCKET"
  munge -n -S "$MUNGE_SOCKET" 2>>"$LOG_DIR/munged.stderr" | unmunge -S "$MUNGE_SOCKET" >/dev/null 2>&1 ||
    fail "munge/unmunge round trip through $MUNGE_SOCKET failed"
}

# launch NAME PROGRAM ARGS...: run PROGRAM in the foreground mode of its own session, detached from our
# stdin/stdout, and record its PID.
launch() {
  local name=$1
  shift
  setsid "$@" </dev/null >>"$LOG_DIR/$name.stderr" 2>&1 &
  local pid=$!
  echo "$pid" >"$(pid_file "$name")"
  echo "$pid" >"$RUN_DIR/$name.launched"
}

check_alive() {
  local name=$1 pid
  pid=$(cat "$RUN_DIR/$name.launched" 2>/dev/null || true)
  if [[ -z $pid ]] || ! kill -0 "$pid" 2>/dev/null; then
    fail "$name exited right after starting"
  fi
}

# ------------------------------------------------------------------------------------------- node state
node_state() {   # prints the node state, e.g. IDLE, MIXED, ALLOCATED, DOWN+NOT_RESPONDING; or nothing
  local node
  node=$(cat "$STATE_DIR/nodename" 2>/dev/null || true)
  [[ -n $node ]] || return 0
  timeout 10 scontrol show node -o "$node" 2>/dev/null | sed -n 's/.* State=\([^ ]*\).*/\1/p' | head -n 1
}

all_running() {
  local d
  for d in "${DAEMONS[@]}"; do
    [[ -n $(running_pid "$d") ]] || return 1
  done
}

any_running() {
  local d
  for d in "${DAEMONS[@]}"; do
    [[ -n $(running_pid "$d") ]] && return 0
  done
  return 1
}

print_env_line() {
  echo "SLURM_CONF=$SLURM_CONF_FILE"
}

# ------------------------------------------------------------------------------------------------ start
cmd_start() {
  local t0 state
  t0=$(now)
  mkdir -p "$STATE_DIR"
  chmod 755 "$STATE_DIR"
  install_packages

  if all_running; then
    state=$(node_state)
    if [[ $state == IDLE* || $state == MIXED* || $state == ALLOCATED* ]]; then
      log "already running (node state $state); reusing the daemons started earlier"
      print_env_line
      return 0
    fi
    log "daemons run but node state is '${state:-unknown}'; restarting them"
  fi
  if any_running; then
    cmd_stop
  fi

  local port
  for port in "$CTLD_PORT" "$NODE_PORT"; do
    if [[ -n $(port_listener "$port") ]]; then
      die "TCP port $port is already in use by a program this script did not start; stop it or set REPRISE_SLURM_CTLD_PORT / REPRISE_SLURM_NODE_PORT"
    fi
  done

  STARTING=1
  # Fresh start: forget jobs and logs from any earlier run.
  rm -rf "$STATE_DIR/ctld-state" "$STATE_DIR/slurmd-spool" "$LOG_DIR" "$RUN_DIR"
  mkdir -p "$LOG_DIR" "$RUN_DIR"
  write_config

  start_munged
  launch slurmctld slurmctld -D -c -f "$SLURM_CONF_FILE"
  local i
  for ((i = 0; i < 200; i++)); do
    timeout 5 scontrol ping >/dev/null 2>&1 && break
    check_alive slurmctld
    sleep 0.1
  done
  timeout 5 scontrol ping >/dev/null 2>&1 || fail "slurmctld does not answer 'scontrol ping'"

  launch slurmd slurmd -D -f "$SLURM_CONF_FILE"
  local deadline
  deadline=$(($(date +%s) + START_TIMEOUT))
  while :; do
    check_alive slurmctld
    check_alive slurmd
    state=$(node_state)
    [[ $state == IDLE ]] && break
    if (($(date +%s) > deadline)); then
      fail "node not idle after $START_TIMEOUT s (state '${state:-unknown}')"
    fi
    sleep 0.1
  done
  local t_idle
  t_idle=$(elapsed "$t0")
  [[ ${REPRISE_SLURM_PROBE:-1} == 0 ]] || probe_job "$deadline"
  STARTING=0
  log "started in $(elapsed "$t0") s (node idle after $t_idle s${probe_note:-}): munged $(running_pid munged), slurmctld $(running_pid slurmctld), slurmd $(running_pid slurmd); node $(cat "$STATE_DIR/nodename") idle; env file $ENV_FILE"
  print_env_line
}

# Run one tiny batch job end to end and check its output file, so that `start` returns only when jobs
# really run (exit codes alone can look fine while every step fails). Just after slurmctld starts, its
# first scheduling pass comes about 3 s late; the probe absorbs that too.
probe_job() {
  local deadline=$1 t0 id st out=$RUN_DIR/probe.out
  t0=$(now)
  rm -f "$out"
  id=$(sbatch --parsable --job-name=slurm-local-probe --output="$out" --chdir="$RUN_DIR" \
    --wrap 'echo "probe ok on $SLURMD_NODENAME"' </dev/null 2>>"$LOG_DIR/probe.stderr") ||
    fail "sbatch of the probe job failed: $(cat "$LOG_DIR/probe.stderr")"
  id=${id%%;*}
  while :; do
    st=$(job_states "$id" | awk '{ print $2 }')
    is_terminal "${st:-PENDING}" && break
    (($(date +%s) <= deadline)) || fail "probe job $id not finished in time (state '${st:-unknown}')"
    sleep 0.2
  done
  [[ $st == COMPLETED ]] || fail "probe job $id ended $st"
  grep -q '^probe ok on ' "$out" 2>/dev/null || fail "probe job $id COMPLETED but wrote no correct output to $out"
  probe_note=", probe job ran in $(elapsed "$t0") s"
}

# ------------------------------------------------------------------------------------------------- stop
stop_one() {
  local name=$1 pid i
  pid=$(running_pid "$name")
  [[ -n $pid ]] || return 0
  kill -TERM "$pid" 2>/dev/null || true
  for ((i = 0; i < 100; i++)); do
    is_our_daemon "$pid" "$name" || break
    sleep 0.1
  done
  if is_our_daemon "$pid" "$name"; then
    log "$name ($pid) ignored SIGTERM for 10 s; sending SIGKILL"
    kill -KILL "$pid" 2>/dev/null || true
    sleep 0.2
  fi
  rm -f "$(pid_file "$name")" "$RUN_DIR/$name.launched"
  log "stopped $name ($pid)"
}

cmd_stop() {
  mkdir -p "$STATE_DIR"
  if ! any_running; then
    log "nothing to stop in $STATE_DIR"
    return 0
  fi
  # Cancel jobs left on our own cluster so their slurmstepd helpers end too.
  if [[ -n $(running_pid slurmctld) ]] && [[ -n $(timeout 5 squeue -h -o %i 2>/dev/null || true) ]]; then
    log "cancelling jobs left on the local cluster"
    timeout 10 scancel --full --quiet -u "$(id -un)" 2>/dev/null || true
    local i
    for ((i = 0; i < 50; i++)); do
      [[ -z $(timeout 5 squeue -h -t R,CG,CF -o %i 2>/dev/null || true) ]] && break
      sleep 0.2
    done
  fi
  local k
  for ((k = ${#DAEMONS[@]} - 1; k >= 0; k--)); do
    stop_one "${DAEMONS[k]}"
  done
}

# ----------------------------------------------------------------------------------------------- status
cmd_status() {
  local d pid state
  for d in "${DAEMONS[@]}"; do
    pid=$(running_pid "$d")
    if [[ -z $pid ]]; then
      echo "not running ($d is not running under $STATE_DIR)"
      return 3
    fi
  done
  state=$(node_state)
  if [[ $state == IDLE ]]; then
    echo "idle (node $(cat "$STATE_DIR/nodename"), SLURM_CONF=$SLURM_CONF_FILE)"
    return 0
  fi
  echo "not idle (node state '${state:-unknown}', SLURM_CONF=$SLURM_CONF_FILE)"
  return 1
}

# --------------------------------------------------------------------------------------------- selftest
# job_states JOBID: one "JobId State ExitCode" line per job (array tasks one line each), from scontrol.
job_states() {
  timeout 10 scontrol show job -o "$1" 2>/dev/null |
    awk '{ id = ""; st = ""; ec = ""
           for (i = 1; i <= NF; i++) {
             if ($i ~ /^JobId=/) id = substr($i, 7)
             else if ($i ~ /^ArrayJobId=/) aj = substr($i, 12)
             else if ($i ~ /^ArrayTaskId=/) at = substr($i, 13)
             else if ($i ~ /^JobState=/) st = substr($i, 10)
             else if ($i ~ /^ExitCode=/) ec = substr($i, 10)
           }
           if (at != "") id = aj "_" at
           print id, st, ec; aj = ""; at = "" }'
}

is_terminal() {
  case $1 in
    COMPLETED | FAILED | CANCELLED* | TIMEOUT | NODE_FAIL | OUT_OF_MEMORY | PREEMPTED | BOOT_FAIL | DEADLINE) return 0 ;;
    *) return 1 ;;
  esac
}

cmd_selftest() {
  cmd_status >/dev/null || fail "the local Slurm is not running and idle; run '$0 start' first ($(cmd_status || true))"
  local t0 out
  t0=$(now)
  out=$STATE_DIR/selftest/$(date +%Y%m%d-%H%M%S)-$$
  mkdir -p "$out"
  cat >"$out/task.sh" <<'EOF'
#!/bin/bash
set -eu
start=$(date +%s.%N)
env | grep '^SLURM' | sort >"$OUT/env-$SLURM_ARRAY_TASK_ID.txt"
sleep 2
end=$(date +%s.%N)
printf 'task %s of %s\nstart %s\nend %s\n' "$SLURM_ARRAY_TASK_ID" "$SLURM_ARRAY_TASK_COUNT" "$start" "$end" \
  >"$OUT/task-$SLURM_ARRAY_TASK_ID.txt.tmp"
mv "$OUT/task-$SLURM_ARRAY_TASK_ID.txt.tmp" "$OUT/task-$SLURM_ARRAY_TASK_ID.txt"
EOF
  cat >"$out/merge.sh" <<'EOF'
#!/bin/bash
set -eu
start=$(date +%s.%N)
{ echo "merged"; echo "start $start"; cat "$OUT"/task-*.txt; } >"$OUT/merged.txt.tmp"
mv "$OUT/merged.txt.tmp" "$OUT/merged.txt"
EOF
  chmod 755 "$out/task.sh" "$out/merge.sh"

  # OUT reaches the jobs through sbatch's own environment (default --export=ALL). Do not use
  # --export=ALL,OUT=...: any --export list makes slurmd fetch root's login environment (su -) for each
  # task, which costs about a second per task here.
  local array_id merge_id
  array_id=$(OUT=$out sbatch --parsable --array=0-3 --ntasks=1 --cpus-per-task=1 --job-name=selftest-array \
    --chdir="$out" --output="$out/slurm-%A_%a.out" "$out/task.sh" </dev/null) ||
    fail "sbatch of the array failed"
  array_id=${array_id%%;*}
  merge_id=$(OUT=$out sbatch --parsable --dependency=afterok:"$array_id" --ntasks=1 --job-name=selftest-merge \
    --chdir="$out" --output="$out/slurm-%j.out" "$out/merge.sh" </dev/null) ||
    fail "sbatch of the dependent job failed"
  merge_id=${merge_id%%;*}

  # Poll every half second until every job record is in a terminal state.
  local deadline states pending
  deadline=$(($(date +%s) + SELFTEST_TIMEOUT))
  while :; do
    states=$(job_states "$array_id"; job_states "$merge_id")
    pending=$(awk '{ print $2 }' <<<"$states" | while read -r s; do is_terminal "$s" || echo "$s"; done)
    # 4 array task records + 1 dependent job record, all terminal
    if [[ -z $pending && $(wc -l <<<"$states") -eq 5 ]]; then break; fi
    if timeout 10 squeue -h -j "$merge_id" -o %r 2>/dev/null | grep -q DependencyNeverSatisfied; then
      printf '%s\n' "$states" >&2
      timeout 5 scancel "$merge_id" 2>/dev/null || true
      fail "an array task failed, so the dependent job $merge_id can never start ($out)"
    fi
    if (($(date +%s) > deadline)); then
      printf '%s\n' "$states" >&2
      timeout 5 scancel "$array_id" "$merge_id" 2>/dev/null || true
      fail "jobs not finished after $SELFTEST_TIMEOUT s"
    fi
    sleep 0.5
  done
  local wall
  wall=$(elapsed "$t0")

  # Verify states, then output files (exit codes alone are not trusted).
  local problems=()
  while read -r id st ec; do
    [[ $st == COMPLETED && $ec == 0:0 ]] || problems+=("job $id ended $st exit $ec")
  done <<<"$states"
  local i f
  for i in 0 1 2 3; do
    f=$out/task-$i.txt
    if [[ ! -f $f ]]; then problems+=("missing $f"); continue; fi
    [[ $(head -n 1 "$f") == "task $i of 4" ]] || problems+=("$f starts with '$(head -n 1 "$f")', expected 'task $i of 4'")
  done
  if [[ ! -f $out/merged.txt ]]; then
    problems+=("missing $out/merged.txt")
  else
    [[ $(head -n 1 "$out/merged.txt") == merged ]] || problems+=("merged.txt does not start with 'merged'")
    [[ $(grep -c '^task ' "$out/merged.txt") -eq 4 ]] || problems+=("merged.txt does not hold 4 task results")
  fi
  if ((${#problems[@]} > 0)); then
    printf 'selftest FAILED: %s\n' "${problems[@]}" >&2
    for f in "$out"/slurm-*.out; do [[ -s $f ]] && { echo "----- $f" >&2; cat "$f" >&2; }; done
    fail "selftest failed ($out)"
  fi

  # Parallelism: the largest number of tasks running at one instant must be 2 (2 CPUs, 1 CPU per task);
  # the dependent job must start after the last task ended.
  local concurrency last_end merge_start
  concurrency=$(for i in 0 1 2 3; do
      awk '/^start /{ print $2, 1 } /^end /{ print $2, -1 }' "$out/task-$i.txt"
    done | sort -k1,1g -k2,2n | awk '{ c += $2; if (c > m) m = c } END { print m + 0 }')
  last_end=$(awk '/^end /{ print $2 }' "$out"/task-*.txt | sort -g | tail -n 1)
  merge_start=$(awk '/^start /{ print $2; exit }' "$out/merged.txt")
  [[ $concurrency -ge 2 ]] || fail "array tasks did not run in parallel (at most $concurrency at once; $out)"
  awk -v a="$merge_start" -v b="$last_end" 'BEGIN { exit !(a >= b) }' ||
    fail "dependent job started ($merge_start) before the last array task ended ($last_end)"

  local array_env
  array_env=$(grep -h '^SLURM_ARRAY' "$out/env-1.txt" | tr '\n' ' ')
  echo "selftest env of task 1: $array_env"
  echo "selftest OK: array $array_id (4 tasks, up to $concurrency at once) + dependent job $merge_id all COMPLETED with correct files in ${wall} s; output in $out"
}

# ------------------------------------------------------------------------------------------------- main
usage() { echo "usage: $0 start|stop|status|selftest" >&2; exit 2; }
[[ $# -eq 1 ]] || usage
case $1 in
  start) cmd_start ;;
  stop) cmd_stop ;;
  status) cmd_status ;;
  selftest) cmd_selftest ;;
  *) usage ;;
esac
