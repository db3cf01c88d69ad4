#!/usr/bin/env bash
# npm start: installs what is missing, starts a private MariaDB, migrates, seeds the demo, builds the
# console when stale, and serves the API, the console and the mail sink on loopback. Ctrl-C stops all.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

export CLINO_DATA_DIR="${CLINO_DATA_DIR:-$ROOT/.data/dev}"
export CLINO_PORT="${CLINO_PORT:-8640}"
export CLINO_DB_PORT="${CLINO_DB_PORT:-8641}"
export CLINO_SMTP_PORT="${CLINO_SMTP_PORT:-8642}"
export CLINO_DB_NAME="${CLINO_DB_NAME:-clinometer}"
export CLINO_DB_USER="${CLINO_DB_USER:-clino}"
export CLINO_DB_PASSWORD="${CLINO_DB_PASSWORD:-clino-local}"

ensure_node_modules
ensure_debian_package mariadbd mariadb-server

CHILDREN=()
cleanup() {
  trap - EXIT INT TERM
  local pid
  for pid in "${CHILDREN[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  for pid in "${CHILDREN[@]}"; do wait "$pid" 2>/dev/null || true; done
  mariadb_stop
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

mariadb_start "$CLINO_DATA_DIR" "$CLINO_DB_PORT"
mariadb_prepare "$CLINO_DB_NAME" "$CLINO_DB_USER" "$CLINO_DB_PASSWORD"
node --import tsx server/src/db/database-command.ts migrate
node --import tsx server/src/db/database-command.ts seed
ensure_console_build

node --import tsx server/src/main.ts &
CHILDREN+=($!)

say "console and API: http://127.0.0.1:$CLINO_PORT/   health: http://127.0.0.1:$CLINO_PORT/api/health"
say "mail sink (SMTP): 127.0.0.1:$CLINO_SMTP_PORT   database: 127.0.0.1:$CLINO_DB_PORT   data: ${CLINO_DATA_DIR#$ROOT/}"
say "press Ctrl-C to stop"
wait -n "${CHILDREN[@]}" || true
