#!/usr/bin/env bash
# Installs the Debian packages Sagline needs, only those missing. Idempotent.
source "$(dirname "$0")/lib.sh"
need=()
[ -x "$PG_BIN/initdb" ] || need+=(postgresql)
command -v redis-server >/dev/null || need+=(redis-server)
# The test suite also drives a real browser and a real spreadsheet program (CSV exports).
if [ "${SAGLINE_NEED_BROWSER:-0}" = "1" ]; then
  command -v chromium >/dev/null || need+=(chromium)
  command -v soffice >/dev/null || need+=(libreoffice-calc-nogui)
fi
if [ "${#need[@]}" -gt 0 ]; then
  if [ "$(id -u)" != "0" ]; then echo "missing packages: ${need[*]} (run as root or install them)" >&2; exit 1; fi
  log "installing Debian packages: ${need[*]}"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq --no-install-recommends "${need[@]}" >/dev/null
  # Debian's package starts its own default cluster and server; ours run on their own ports.
  if [[ " ${need[*]} " == *" redis-server "* ]]; then
    (service redis-server stop || systemctl stop redis-server || true) >/dev/null 2>&1
  fi
fi
