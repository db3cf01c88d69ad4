#!/usr/bin/env bash
# npm run bench: the engine benchmark against pandas. Generates (once) a wide daily file of 3,000
# invented securities × 2,520 days with a market column and a risk-free file, runs the full batch in
# Clinometer (bench/run-bench.ts) and the same work in numpy/pandas (bench/reference_batch.py), checks
# that their outputs agree to 1e-9, and prints the table of phase times, the ratio and peak memory.
# Data and outputs stay under .data/bench/ (ignored by git). Settings: BENCH_THREADS (default 2),
# BENCH_SECURITIES (3000), BENCH_DAYS (2520). Exits non-zero when the outputs disagree.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_node_modules
ensure_python_reference_libraries

SECURITIES="${BENCH_SECURITIES:-3000}"
DAYS="${BENCH_DAYS:-2520}"
THREADS="${BENCH_THREADS:-2}"
DATA="$ROOT/.data/bench/data-${SECURITIES}x${DAYS}"
OUT="$ROOT/.data/bench/out"

if [ ! -f "$DATA/prices-wide.csv" ] || [ "$ROOT/bench/generate-wide.ts" -nt "$DATA/prices-wide.csv" ]; then
  say "generating $SECURITIES securities × $DAYS days in ${DATA#$ROOT/}"
  node --import tsx bench/generate-wide.ts --out "$DATA" --securities "$SECURITIES" --days "$DAYS" >&2
fi
rm -rf "$OUT"
mkdir -p "$OUT"
cat "$DATA"/*.csv >/dev/null # both engines start with the files in the page cache

elapsed_since() { awk -v start="$1" -v end="$EPOCHREALTIME" 'BEGIN { printf "%.3f", end - start }'; }

say "Clinometer ($THREADS threads)"
start=$EPOCHREALTIME
node --import tsx bench/run-bench.ts --data "$DATA" --out "$OUT/clinometer" --threads "$THREADS"
ours_seconds=$(elapsed_since "$start")

say "pandas reference"
start=$EPOCHREALTIME
/usr/bin/python3 bench/reference_batch.py --data "$DATA" --out "$OUT/reference"
pandas_seconds=$(elapsed_since "$start")

say "comparing the outputs"
agree_status=0
/usr/bin/python3 bench/compare_outputs.py "$OUT/clinometer" "$OUT/reference" >"$OUT/agreement.json" || agree_status=$?
node --import tsx bench/print-report.ts "$OUT" "$ours_seconds" "$pandas_seconds"
if [ $agree_status -ne 0 ]; then
  say "the outputs disagree: see ${OUT#$ROOT/}/agreement.json"
  exit 1
fi
