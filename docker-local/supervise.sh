#!/usr/bin/env bash
# Keeps one Sagline process (web or worker) running. Started by start_supervised in processes.sh
# as its own process group; the command runs in a group of its own, its pid in RUN_DIR/NAME.child.pid.
# When the command ends without being asked to, the supervisor logs how (exit status or signal) to
# the process's log and, with the last lines of that log, to crashes.log beside it, then restarts it
# after 1 s, doubling up to 30 s; a run that lasted 60 s or more resets the delay. SIGTERM (what
# npm run stop sends) is passed to the command's group and the supervisor exits when it has ended.
# Usage: supervise.sh NAME RUN_DIR LOGFILE COMMAND...   (stdout and stderr already go to LOGFILE)
set -uo pipefail
name="$1" run_dir="$2" logfile="$3"
shift 3
crash_log="$(dirname "$logfile")/crashes.log"
child_pidfile="$run_dir/$name.child.pid"
first_delay_s="${SAGLINE_RESTART_FIRST_DELAY_S:-1}"
max_delay_s="${SAGLINE_RESTART_MAX_DELAY_S:-30}"
stable_after_s="${SAGLINE_RESTART_STABLE_AFTER_S:-60}"

say() { printf '[supervisor %s] %s %s\n' "$name" "$(date -u +%Y-%m-%dT%H:%M:%SZ)" "$*"; }

stopping=0
child=""
on_stop() {
  stopping=1
  if [ -n "$child" ]; then kill -TERM -- "-$child" 2>/dev/null || true; fi
}
trap on_stop TERM INT HUP

describe_status() {
  if [ "$1" -gt 128 ]; then echo "was killed by SIG$(kill -l $(($1 - 128)) 2>/dev/null || echo $(($1 - 128)))"; else echo "exited with status $1"; fi
}

delay_s="$first_delay_s"
restarts=0
while :; do
  started_s=$SECONDS
  # Its own group, so leftovers of a crashed run can be ended without touching the supervisor.
  setsid "$@" &
  child=$!
  echo "$child" > "$child_pidfile"
  say "started pid $child: $*"
  while :; do
    wait "$child"
    status=$?
    # wait also returns when a trapped signal arrives; the command may still be running.
    kill -0 "$child" 2>/dev/null || break
  done
  kill -KILL -- "-$child" 2>/dev/null || true
  if [ "$stopping" = 1 ]; then
    say "stopped ($(describe_status "$status"))"
    rm -f "$child_pidfile"
    exit 0
  fi
  ran_s=$((SECONDS - started_s))
  [ "$ran_s" -ge "$stable_after_s" ] && delay_s="$first_delay_s"
  restarts=$((restarts + 1))
  cause="$(describe_status "$status")"
  say "pid $child $cause after ${ran_s} s; restarting in ${delay_s} s (restart $restarts)"
  {
    echo "$(date -u +%Y-%m-%dT%H:%M:%SZ) $name: pid $child $cause after ${ran_s} s; restarting in ${delay_s} s (restart $restarts)"
    echo "  last lines of $logfile:"
    # Without the supervisor's own lines and bash's job notice ("...: line N: PID Killed ...").
    tail -n 25 "$logfile" | grep -v -e '^\[supervisor ' -e 'supervise\.sh: line [0-9]*: *[0-9]* ' | sed 's/^/    /'
  } >> "$crash_log"
  child=""
  sleep "$delay_s" &
  wait $! || true
  if [ "$stopping" = 1 ]; then say "stopped while waiting to restart"; rm -f "$child_pidfile"; exit 0; fi
  delay_s=$((delay_s * 2 > max_delay_s ? max_delay_s : delay_s * 2))
done
