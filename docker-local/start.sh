#!/usr/bin/env bash
# npm start: installs what is missing, starts PostgreSQL, Redis, the web app, the workers and the
# local fakes, applies migrations and seeds the demo into an empty database. Idempotent: a second
# run reuses everything.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
cd "$ROOT"
bash docker-local/ensure-packages.sh
bash docker-local/ensure-node-modules.sh
bash docker-local/postgres.sh start sagline
bash docker-local/redis.sh start

RUN="$LOCAL_DIR/run"
mkdir -p "$RUN" "$LOCAL_DIR/logs"
export_app_env sagline 0 sagline "${APP_URL:-http://127.0.0.1:$APP_PORT}" nextauth
export SMTP_HOST=127.0.0.1 SMTP_PORT MAIL_UI_PORT
export SAGLINE_FAKES="${SAGLINE_FAKES:-1}"
export MAIL_UI_URL="http://127.0.0.1:$MAIL_UI_PORT/"
export MAIL_DIR="$LOCAL_DIR/mail"
# Webhooks may reach the local fake partner receiver on loopback (the SSRF guard refuses loopback otherwise).
if [ "$SAGLINE_FAKES" = "1" ]; then export WEBHOOK_ALLOWLIST="${WEBHOOK_ALLOWLIST:-127.0.0.1:$PARTNER_PORT}"; fi

write_instance_env "$LOCAL_DIR/instance.env"

npx tsx db/migrate.ts
npx tsx db/seed.ts > "$LOCAL_DIR/seed.log"
grep -v '^$' "$LOCAL_DIR/seed.log" | head -1
build_web_if_needed .next

if [ "$SAGLINE_FAKES" = "1" ]; then
  START_PORT="$SMTP_PORT" START_PORT_VAR=SAGLINE_SMTP_PORT start_process smtp-fake "$RUN" "$LOCAL_DIR/logs/smtp-fake.log" npx tsx docker-local/fakes/smtp-fake.ts
  START_PORT="$PARTNER_PORT" START_PORT_VAR=SAGLINE_PARTNER_PORT start_process partner-fake "$RUN" "$LOCAL_DIR/logs/partner-fake.log" npx tsx docker-local/fakes/partner-fake.ts
fi
# Web and worker run under docker-local/supervise.sh: restarted with a backoff when they crash.
start_supervised worker "$RUN" "$LOCAL_DIR/logs/worker.log" node --import tsx workers/index.ts
# The port check is on the port next listens on; APP_URL may name a proxy in front of it.
START_PORT="$APP_PORT" START_PORT_VAR=SAGLINE_APP_PORT start_supervised web "$RUN" "$LOCAL_DIR/logs/web.log" node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$APP_PORT"

wait_for_url "$APP_URL/api/health" 60 || { log "the web app did not become healthy; see $LOCAL_DIR/logs/web.log"; tail -20 "$LOCAL_DIR/logs/web.log"; exit 1; }
echo
log "Sagline is running at $APP_URL"
[ "$SAGLINE_FAKES" = "1" ] && log "captured e-mail (local SMTP fake): $MAIL_UI_URL"
[ "$SAGLINE_FAKES" = "1" ] && log "webhooks received by the fake partner: http://127.0.0.1:$PARTNER_PORT/"
npx tsx db/seed.ts --print | sed -n '/Demo sign-ins/,$p'
log "logs in $LOCAL_DIR/logs (crashes and restarts: crashes.log); stop everything with: npm run stop"
log "operator commands (npm run key:create, db:migrate, db:seed, worker) use this instance's settings from $LOCAL_DIR/instance.env"
