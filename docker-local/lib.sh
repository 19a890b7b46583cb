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

# As root, PostgreSQL's tools run as the postgres user (initdb refuses root), from / because the
# checkout may sit in a folder that user cannot enter. Anyone else runs the cluster as themselves.
as_postgres() {
  if [ "$(id -u)" = "0" ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi
}

# Where the PostgreSQL cluster lives: $LOCAL_DIR/postgres (ignored by git), unless we are root and
# the postgres user cannot reach that folder (a clone in root's own 0700 home directory); then
# /var/lib/sagline/<first 12 hex of sha1 of the checkout path>/postgres. An existing cluster is
# never moved. $LOCAL_DIR/postgres-location names the folder in use.
resolve_pg_dir() {
  local inside="$LOCAL_DIR/postgres" outside
  mkdir -p "$LOCAL_DIR"
  outside="/var/lib/sagline/$(printf '%s' "$LOCAL_DIR" | sha1sum | cut -c1-12)/postgres"
  if [ -f "$inside/data/PG_VERSION" ] || [ "$(id -u)" != "0" ] || runuser -u postgres -- test -x "$LOCAL_DIR" 2>/dev/null; then
    echo "$inside"
  else
    echo "$outside"
  fi
}

# port_taken PORT: true when something on 127.0.0.1 accepts connections on PORT.
port_taken() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }
# free_port_near PORT: the first of PORT+10, PORT+20, ... that nothing listens on (for suggestions).
free_port_near() {
  local p="$1"
  for _ in $(seq 1 20); do p=$((p + 10)); port_taken "$p" || break; done
  echo "$p"
}

# pid file helpers: stop only what we started.
pid_alive() { [ -f "$1" ] && kill -0 "$(cat "$1")" 2>/dev/null; }
