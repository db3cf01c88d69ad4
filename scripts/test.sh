#!/usr/bin/env bash
# npm test: the same bootstrap as npm start plus Chromium and the reference libraries, a private
# MariaDB of its own (temporary folder, free port), then every runner: console unit tests (ng test),
# Node-side tests (vitest: engine, CLI, server against MariaDB, browser flows). Ends with one line
# "N passed, N failed" summed over all runners, and exits non-zero on any failure.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_node_modules
ensure_debian_package mariadbd mariadb-server
ensure_debian_package /usr/bin/chromium chromium
ensure_python_reference_libraries

mkdir -p "$ROOT/.data"
TEST_DIR="$(mktemp -d "$ROOT/.data/test-XXXXXX")"
cleanup() {
  trap - EXIT INT TERM
  mariadb_stop
  rm -rf "$TEST_DIR"
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

export CLINO_DB_HOST=127.0.0.1
export CLINO_DB_PORT="$(free_port)"
export CLINO_DB_NAME=clinotest
export CLINO_DB_USER=clino_test
export CLINO_DB_PASSWORD=clino-test-local
export CLINO_DATA_DIR="$TEST_DIR/data"
export CLINO_LOG_LEVEL="${CLINO_LOG_LEVEL:-silent}"
export CLINO_TEST_DIR="$TEST_DIR"
export NG_CLI_ANALYTICS=false

mariadb_start "$TEST_DIR" "$CLINO_DB_PORT"
mariadb_prepare "$CLINO_DB_NAME" "$CLINO_DB_USER" "$CLINO_DB_PASSWORD"
ensure_console_build

RESULTS="$TEST_DIR/results"
mkdir -p "$RESULTS"

say "console unit tests (ng test)"
npx ng test --watch=false --reporters=json --reporters=default --output-file="$RESULTS/console.json" >&2
console_status=$?

say "Node-side tests (vitest)"
npx vitest run --reporter=default --reporter=json --outputFile.json="$RESULTS/node.json" "$@" >&2
node_status=$?

node scripts/summarise-tests.mjs "$RESULTS/console.json" "$RESULTS/node.json"
summary_status=$?

if [ $console_status -ne 0 ] || [ $node_status -ne 0 ] || [ $summary_status -ne 0 ]; then exit 1; fi
exit 0
