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
# The demo watcher's machine token: the seed stores its hash, the watcher presents it. Loopback demo only.
export CLINO_DEMO_MACHINE_TOKEN="${CLINO_DEMO_MACHINE_TOKEN:-clino_demo-watcher-local-only-0000000000}"
DROP="${CLINO_DROP_DIR:-$ROOT/samples/drop}"

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
wait_for_health "http://127.0.0.1:$CLINO_PORT/api/health"

# The demo: the sample specs pushed as the demo analyst, the vendor files written into the drop
# folder when it is new, and the watcher that runs the specs on them and posts the results.
node --import tsx scripts/demo-specs.ts "http://127.0.0.1:$CLINO_PORT" >&2
node --import tsx scripts/demo-drop.ts "$DROP" >&2
CLINO_SERVER_URL="http://127.0.0.1:$CLINO_PORT" CLINO_TOKEN="$CLINO_DEMO_MACHINE_TOKEN" CLINO_CONFIG_DIR="$CLINO_DATA_DIR/clino" \
  node cli/bin/clino.js watch "$DROP" &
CHILDREN+=($!)
# A worker for reruns that supervisors and ops ask for in the console.
CLINO_SERVER_URL="http://127.0.0.1:$CLINO_PORT" CLINO_TOKEN="$CLINO_DEMO_MACHINE_TOKEN" CLINO_CONFIG_DIR="$CLINO_DATA_DIR/clino" \
  node cli/bin/clino.js work --worker demo-worker --poll-seconds 3 --work-dir "$CLINO_DATA_DIR/work" &
CHILDREN+=($!)

say "console and API: http://127.0.0.1:$CLINO_PORT/   health: http://127.0.0.1:$CLINO_PORT/api/health"
say "mail sink (SMTP): 127.0.0.1:$CLINO_SMTP_PORT   database: 127.0.0.1:$CLINO_DB_PORT   data: ${CLINO_DATA_DIR#$ROOT/}"
say "drop folder watched: ${DROP#$ROOT/}/incoming/   demo sign-ins: docs/roles.md"
say "press Ctrl-C to stop"
wait -n "${CHILDREN[@]}" || true
