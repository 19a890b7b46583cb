#!/usr/bin/env bash
# Runs an operator command (npm run key:create, db:migrate, db:seed, worker) against the local
# instance that npm start set up, with the settings it wrote to .local/instance.env. When the
# caller has set DATABASE_URL, nothing is loaded: the caller's own environment is used as it is.
# Usage: with-instance-env.sh COMMAND...   (SAGLINE_INSTANCE_ENV names another settings file)
source "$(dirname "$0")/lib.sh"
file="${SAGLINE_INSTANCE_ENV:-$LOCAL_DIR/instance.env}"
if [ -z "${DATABASE_URL:-}" ]; then
  if [ -f "$file" ]; then
    set -a
    # shellcheck source=/dev/null
    source "$file"
    set +a
    echo "[sagline] using the local instance's settings from $file (set DATABASE_URL to use others)" >&2
  else
    echo "[sagline] DATABASE_URL is not set and $file does not exist: run npm start first," >&2
    echo "[sagline] or set DATABASE_URL, REDIS_URL, APP_URL and NEXTAUTH_SECRET yourself (README, Configuration)." >&2
    exit 78
  fi
fi
cd "$ROOT"
exec "$@"
