# Shared settings for the local-service scripts. Sourced, never run.
# Every port is the project's own (never a server's default), overridable from the environment.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
LOCAL_DIR="${SAGLINE_LOCAL_DIR:-$ROOT/.local}"
PG_PORT="${SAGLINE_PG_PORT:-54329}"
REDIS_PORT="${SAGLINE_REDIS_PORT:-63799}"
APP_PORT="${SAGLINE_APP_PORT:-3790}"
SMTP_PORT="${SAGLINE_SMTP_PORT:-2590}"
MAIL_UI_PORT="${SAGLINE_MAIL_UI_PORT:-3791}"
PARTNER_PORT="${SAGLINE_PARTNER_PORT:-3792}"
PG_BIN="${SAGLINE_PG_BIN:-/usr/lib/postgresql/15/bin}"
export ROOT LOCAL_DIR PG_PORT REDIS_PORT APP_PORT SMTP_PORT MAIL_UI_PORT PARTNER_PORT PG_BIN

log() { printf '\033[1m[sagline]\033[0m %s\n' "$*"; }

as_postgres() {
  if [ "$(id -u)" = "0" ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

# pid file helpers: stop only what we started.
pid_alive() { [ -f "$1" ] && kill -0 "$(cat "$1")" 2>/dev/null; }
