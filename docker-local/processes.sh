# Starting and stopping Sagline's own processes by pid file. Sourced by start.sh, stop.sh, test.sh,
# bench-pipeline.sh.

# start_process NAME RUN_DIR LOG COMMAND...: starts in the background unless already running.
# With START_PORT set (the port the process itself listens on, not APP_URL's, which may name a
# proxy), refuses to start when something else already listens there, so a health check can never
# be answered by a stranger's server; START_PORT_VAR names the variable that moves that port.
start_process() {
  local name="$1" run_dir="$2" logfile="$3"
  shift 3
  mkdir -p "$run_dir"
  if pid_alive "$run_dir/$name.pid"; then return 0; fi
  if [ -n "${START_PORT:-}" ] && port_taken "$START_PORT"; then
    echo "$name: port $START_PORT on 127.0.0.1 is taken by another program (another checkout?)." >&2
    echo "Set ${START_PORT_VAR:-the port variable (README, Configuration)} to a free port, or stop that program." >&2
    exit 1
  fi
  # setsid gives each process its own group, so stop can end it with its children.
  setsid nohup "$@" >>"$logfile" 2>&1 < /dev/null &
  echo $! > "$run_dir/$name.pid"
}

# start_supervised NAME RUN_DIR LOG COMMAND...: as start_process, under docker-local/supervise.sh,
# which restarts the command with a backoff when it crashes (its pid: RUN_DIR/NAME.child.pid).
start_supervised() {
  local name="$1" run_dir="$2" logfile="$3"
  shift 3
  start_process "$name" "$run_dir" "$logfile" bash "$ROOT/docker-local/supervise.sh" "$name" "$run_dir" "$logfile" "$@"
}

# Ends what start_process or start_supervised started: TERM to its group (a supervisor passes it
# on to its command), up to 10 s to finish, then KILL to both groups.
stop_process() {
  local name="$1" run_dir="$2" pidfile="$2/$1.pid" childfile="$2/$1.child.pid"
  if pid_alive "$pidfile"; then
    local pid
    pid="$(cat "$pidfile")"
    kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
    for _ in $(seq 1 100); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
    kill -KILL -- "-$pid" 2>/dev/null || true
  fi
  if [ -f "$childfile" ]; then kill -KILL -- "-$(cat "$childfile")" 2>/dev/null || true; fi
  rm -f "$pidfile" "$childfile"
}

wait_for_url() {
  local url="$1" seconds="${2:-60}"
  for _ in $(seq 1 $((seconds * 5))); do
    if curl -fsS -o /dev/null "$url" 2>/dev/null; then return 0; fi
    sleep 0.2
  done
  return 1
}

# The hash of everything a build can read: every tracked or new (not ignored) file except tests,
# docs and these scripts, so a change anywhere the app may import (lib, db, workers, examples,
# schemas, configuration) rebuilds. Deleted-but-tracked files are skipped, not an error.
list_source_files() {
  if git -C "$ROOT" rev-parse --git-dir >/dev/null 2>&1; then
    git ls-files -co --exclude-standard -z -- . ':!tests/' ':!docs/' ':!docker-local/' ':!.ci/' ':!*.md'
  else # an exported tree without .git
    find . \( -name node_modules -o -name '.next*' -o -name .local -o -name .git -o -path ./tests -o -path ./docs -o -path ./docker-local -o -path ./.ci \) -prune \
      -o -type f ! -name '*.md' -printf '%P\0'
  fi
}
source_hash() {
  (cd "$ROOT" && list_source_files \
    | while IFS= read -r -d '' f; do [ -f "$f" ] && printf '%s\0' "$f"; done \
    | sort -z | xargs -0 -r sha1sum | sha1sum | cut -d' ' -f1)
}

# Builds the web app only when its sources changed since the last build into DIST.
build_web_if_needed() {
  local dist="$1" stamp="$1/.sagline-source-hash" hash
  hash="$(source_hash)"
  if [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$hash" ]; then return 0; fi
  log "building the web app (next build)"
  (cd "$ROOT" && SAGLINE_DIST_DIR="$dist" NEXT_TELEMETRY_DISABLED=1 npx next build >"$LOCAL_DIR/build-$(basename "$dist").log" 2>&1) || { tail -40 "$LOCAL_DIR/build-$(basename "$dist").log"; exit 1; }
  echo "$hash" > "$stamp"
}

# Secrets generated once per checkout and kept in the ignored folder.
ensure_secret() {
  local file="$LOCAL_DIR/$1.secret"
  mkdir -p "$LOCAL_DIR"
  [ -s "$file" ] || (umask 077 && head -c 48 /dev/urandom | base64 | tr -d '\n/+=' > "$file")
  cat "$file"
}

# export_app_env DB REDIS_DB PREFIX APP_URL SECRET_NAME: the environment every Sagline process
# of one set-up (start, test, bench) shares: its database, Redis database and queue prefix, its
# public address and its session secret.
export_app_env() {
  export NODE_ENV=production NEXT_TELEMETRY_DISABLED=1
  export DATABASE_URL="postgres://sagline:${SAGLINE_DB_PASSWORD:-sagline-local}@127.0.0.1:$PG_PORT/$1"
  export REDIS_URL="redis://127.0.0.1:$REDIS_PORT/$2"
  export REDIS_PREFIX="$3"
  export APP_URL="$4"
  export NEXTAUTH_URL="$APP_URL"
  export NEXTAUTH_SECRET="${NEXTAUTH_SECRET:-$(ensure_secret "$5")}"
}

# write_instance_env FILE: this set-up's settings, for the operator commands run later against it
# (docker-local/with-instance-env.sh loads them). Mode 0600: it holds the session secret.
write_instance_env() {
  local file="$1" var
  mkdir -p "$(dirname "$file")"
  (
    umask 077
    for var in NODE_ENV NEXT_TELEMETRY_DISABLED DATABASE_URL REDIS_URL REDIS_PREFIX APP_URL NEXTAUTH_URL NEXTAUTH_SECRET \
      SMTP_HOST SMTP_PORT MAIL_FROM SAGLINE_FAKES MAIL_UI_URL MAIL_DIR WEBHOOK_ALLOWLIST PARTNER_PORT; do
      if [ -n "${!var+x}" ]; then printf '%s=%q\n' "$var" "${!var}"; fi
    done > "$file.tmp"
    mv "$file.tmp" "$file"
  )
}
