#!/usr/bin/env bash
# npm run start:production: starts Sagline for real use with the settings the operator supplies in
# the environment (or in the file SAGLINE_ENV_FILE names): no local fakes, no demo seed, no demo
# sign-ins printed, no Debian installs and no local PostgreSQL or Redis (bring your own). Before
# anything starts it runs lib/cli/production-check.ts and refuses on any problem. Web and worker run
# supervised (restarted with a backoff when they crash). npm run stop:production stops them.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
cd "$ROOT"
if [ -n "${SAGLINE_ENV_FILE:-}" ]; then
  [ -f "$SAGLINE_ENV_FILE" ] || { echo "SAGLINE_ENV_FILE=$SAGLINE_ENV_FILE does not exist" >&2; exit 78; }
  set -a
  # shellcheck source=/dev/null
  source "$SAGLINE_ENV_FILE"
  set +a
fi
export NODE_ENV=production NEXT_TELEMETRY_DISABLED=1
RUN="${SAGLINE_RUN_DIR:-$LOCAL_DIR/run-production}"
LOGS="${SAGLINE_LOG_DIR:-$LOCAL_DIR/logs}"
LISTEN_HOST="${SAGLINE_LISTEN_HOST:-127.0.0.1}"
WEB_PORT="${SAGLINE_APP_PORT:-3790}"
export SAGLINE_DIST_DIR="${SAGLINE_DIST_DIR:-.next-production}"
mkdir -p "$RUN" "$LOGS"

bash docker-local/ensure-node-modules.sh
if ! npx tsx lib/cli/production-check.ts; then exit 1; fi
npx tsx db/migrate.ts
build_web_if_needed "$SAGLINE_DIST_DIR"

start_supervised worker "$RUN" "$LOGS/production-worker.log" node --import tsx workers/index.ts
START_PORT="$WEB_PORT" START_PORT_VAR=SAGLINE_APP_PORT start_supervised web "$RUN" "$LOGS/production-web.log" \
  node node_modules/next/dist/bin/next start -H "$LISTEN_HOST" -p "$WEB_PORT"
health_host="$LISTEN_HOST"
[ "$health_host" = "0.0.0.0" ] && health_host=127.0.0.1
if ! wait_for_url "http://$health_host:$WEB_PORT/api/health" 120; then
  log "the web app did not become healthy; see $LOGS/production-web.log (left running under its supervisor; npm run stop:production stops it)"
  tail -20 "$LOGS/production-web.log"
  exit 1
fi
log "Sagline (production) is listening on $LISTEN_HOST:$WEB_PORT for $APP_URL"
log "logs in $LOGS (production-web.log, production-worker.log; crashes and restarts: crashes.log); stop with: npm run stop:production"
