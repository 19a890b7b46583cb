#!/usr/bin/env bash
# Installs npm dependencies from the lockfile when they are missing or stale. Idempotent. The
# patches in patches/ (applied by patch-package on install) count as part of the lockfile.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
stamp="node_modules/.sagline-lock-hash"
hash="$(cat package-lock.json patches/*.patch | sha256sum | cut -d' ' -f1)"
if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$hash" ]; then
  log "installing npm dependencies (npm ci)"
  npm ci --no-audit --no-fund --loglevel=error
  echo "$hash" > "$stamp"
fi
