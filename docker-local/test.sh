#!/usr/bin/env bash
# npm test: the same set-up as npm start, against its own database, Redis database and ports,
# then every suite (lint, types, unit, integration, browser). Stops only what it started.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
cd "$ROOT"
SAGLINE_NEED_BROWSER=1 bash docker-local/ensure-packages.sh
bash docker-local/ensure-node-modules.sh

redis_was_up=0; pg_was_up=0
redis-cli -h 127.0.0.1 -p "$REDIS_PORT" ping >/dev/null 2>&1 && redis_was_up=1
[ -f "$(resolve_pg_dir)/data/postmaster.pid" ] && pg_was_up=1
TEST_DB="${SAGLINE_TEST_DB:-sagline_test}"
TEST_REDIS_DB="${SAGLINE_TEST_REDIS_DB:-1}"
bash docker-local/postgres.sh start "$TEST_DB"
bash docker-local/redis.sh start

RUN="$LOCAL_DIR/run-test-$TEST_DB"
mkdir -p "$RUN" "$LOCAL_DIR/logs"
TEST_APP_PORT="${SAGLINE_TEST_APP_PORT:-3793}"
export SMTP_PORT="${SAGLINE_TEST_SMTP_PORT:-2593}"
export MAIL_UI_PORT="${SAGLINE_TEST_MAIL_UI_PORT:-3794}"
export PARTNER_PORT="${SAGLINE_TEST_PARTNER_PORT:-3795}"
unset NEXTAUTH_SECRET; export_app_env "$TEST_DB" "$TEST_REDIS_DB" sagline-test "http://127.0.0.1:$TEST_APP_PORT" nextauth-test
export SMTP_HOST=127.0.0.1 SAGLINE_FAKES=1
export MAIL_UI_URL="http://127.0.0.1:$MAIL_UI_PORT/"
export MAIL_DIR="$LOCAL_DIR/mail-$TEST_DB"
export SAGLINE_DIST_DIR="${SAGLINE_DIST_DIR:-.next-test}"
# A spare port for tests that start a second web process of their own.
export SAGLINE_TEST_SPARE_PORT="${SAGLINE_TEST_SPARE_PORT:-3799}"
export SIGN_IN_MAX_FAILURES=5
# Webhooks: the fake partner on loopback is allowed past the SSRF guard; retries run 5000x faster.
export WEBHOOK_ALLOWLIST="127.0.0.1:$PARTNER_PORT"
export WEBHOOK_RETRY_SCALE="${WEBHOOK_RETRY_SCALE:-0.0002}"
export WEBHOOK_TIMEOUT_MS="${WEBHOOK_TIMEOUT_MS:-3000}"
# This set-up's settings, for the test that runs the operator commands the way an operator would.
export SAGLINE_TEST_INSTANCE_ENV="$LOCAL_DIR/instance-$TEST_DB.env"
write_instance_env "$SAGLINE_TEST_INSTANCE_ENV"

cleanup() {
  for name in web worker smtp-fake partner-fake; do stop_process "$name" "$RUN"; done
  [ "$redis_was_up" = 1 ] || bash docker-local/redis.sh stop
  [ "$pg_was_up" = 1 ] || bash docker-local/postgres.sh stop
}
trap cleanup EXIT

# A clean slate every run: the test database and Redis database are the tests' own.
PGOPTIONS="--client-min-messages=warning" psql -X -q -v ON_ERROR_STOP=1 "$DATABASE_URL" -c "drop schema if exists public cascade; drop schema if exists drizzle cascade; create schema public;"
redis-cli -h 127.0.0.1 -p "$REDIS_PORT" -n "$TEST_REDIS_DB" flushdb >/dev/null
rm -rf "$MAIL_DIR"

log "lint and types"
npx eslint . --max-warnings=0
npx tsc --noEmit -p .

npx tsx db/migrate.ts
npx tsx db/seed.ts >/dev/null
build_web_if_needed "$SAGLINE_DIST_DIR"
START_PORT="$SMTP_PORT" START_PORT_VAR=SAGLINE_TEST_SMTP_PORT start_process smtp-fake "$RUN" "$LOCAL_DIR/logs/$TEST_DB-smtp-fake.log" npx tsx docker-local/fakes/smtp-fake.ts
START_PORT="$PARTNER_PORT" START_PORT_VAR=SAGLINE_TEST_PARTNER_PORT start_process partner-fake "$RUN" "$LOCAL_DIR/logs/$TEST_DB-partner-fake.log" npx tsx docker-local/fakes/partner-fake.ts
start_supervised worker "$RUN" "$LOCAL_DIR/logs/$TEST_DB-worker.log" node --import tsx workers/index.ts
START_PORT="$TEST_APP_PORT" START_PORT_VAR=SAGLINE_TEST_APP_PORT start_supervised web "$RUN" "$LOCAL_DIR/logs/$TEST_DB-web.log" node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$TEST_APP_PORT"
wait_for_url "$APP_URL/api/health" 60 || { tail -30 "$LOCAL_DIR/logs/$TEST_DB-web.log"; exit 1; }
wait_for_url "$MAIL_UI_URL" 30
wait_for_url "http://127.0.0.1:$PARTNER_PORT/" 30

log "running every suite"
set +e
npx vitest run --reporter=default --reporter=json --outputFile.json="$LOCAL_DIR/test-results-$TEST_DB.json" "$@"
status=$?
set -e
node docker-local/summarise-tests.mjs "$LOCAL_DIR/test-results-$TEST_DB.json" || status=1
exit $status
