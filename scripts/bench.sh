#!/usr/bin/env bash
# npm run bench: the engine benchmark against pandas. Generates (once) a wide daily file of 3,000
# invented securities × 2,520 days with a market column and a risk-free file, runs the full batch in
# Clinometer (bench/run-bench.ts) and the same work in numpy/pandas (bench/reference_batch.py), checks
# that their outputs agree to 1e-9, and prints the table of phase times, the ratio and peak memory.
# Data and outputs stay under .data/bench/ (ignored by git). Settings: BENCH_THREADS (default 2),
# BENCH_REPEAT (3), BENCH_SECURITIES (3000), BENCH_DAYS (2520), BENCH_WORK (another folder for the
# data, the build and the outputs) and BENCH_NO_INSTALL (skip the install steps), as the tests use.
# Exits non-zero when the outputs disagree.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

if [ -z "${BENCH_NO_INSTALL:-}" ]; then # the tests set it: nothing is installed while they run
  ensure_node_modules
  ensure_python_reference_libraries
fi

SECURITIES="${BENCH_SECURITIES:-3000}"
DAYS="${BENCH_DAYS:-2520}"
THREADS="${BENCH_THREADS:-2}"
REPEAT="${BENCH_REPEAT:-3}"
WORK="${BENCH_WORK:-$ROOT/.data/bench}" # inside the project: the built bench finds node_modules from there
DATA="$WORK/data-${SECURITIES}x${DAYS}"
mkdir -p "$WORK"
OUT="$WORK/out"

if [ ! -f "$DATA/prices-wide.csv" ] || [ "$ROOT/bench/generate-wide.ts" -nt "$DATA/prices-wide.csv" ]; then
  say "generating $SECURITIES securities × $DAYS days in ${DATA#$ROOT/}"
  node --import tsx bench/generate-wide.ts --out "$DATA" --securities "$SECURITIES" --days "$DAYS" >&2
fi
# Clinometer's side runs built ahead into plain JavaScript (esbuild, one bundle per entry), as a
# deployment would run it: started through tsx, the worker thread spends ~0.5 s compiling and
# resolving TypeScript while the main thread parses (bench/slice-pool.ts runs either way).
BUILD="$WORK/build"
rm -rf "$BUILD"
node_modules/.bin/esbuild bench/run-bench.ts bench/batch-worker.ts --bundle --platform=node --format=esm \
  --target=node20 --packages=external --outdir="$BUILD" --log-level=warning
rm -rf "$OUT"
mkdir -p "$OUT"
cat "$DATA"/*.csv >/dev/null # both engines start with the files in the page cache

elapsed_since() { awk -v start="$1" -v end="$EPOCHREALTIME" 'BEGIN { printf "%.3f", end - start }'; }

# The machine is shared: run both sides REPEAT times, alternately; the report takes each side's
# fastest repetition (and shows the spread).
for run in $(seq 1 "$REPEAT"); do
  say "run $run of $REPEAT: Clinometer ($THREADS threads)"
  start=$EPOCHREALTIME
  node "$BUILD/run-bench.js" --data "$DATA" --out "$OUT/clinometer-$run" --threads "$THREADS"
  elapsed_since "$start" >"$OUT/clinometer-$run/process-seconds"
  say "run $run of $REPEAT: pandas reference"
  start=$EPOCHREALTIME
  /usr/bin/python3 bench/reference_batch.py --data "$DATA" --out "$OUT/reference-$run"
  elapsed_since "$start" >"$OUT/reference-$run/process-seconds"
done

say "comparing the outputs"
agree_status=0
/usr/bin/python3 bench/compare_outputs.py "$OUT/clinometer-1" "$OUT/reference-1" >"$OUT/agreement.json" || agree_status=$?
for run in $(seq 2 "$REPEAT"); do # same inputs, same bytes: then only the first run's large CSVs are kept
  for file in "$OUT/clinometer-1"/*.csv; do
    cmp -s "$file" "$OUT/clinometer-$run/$(basename "$file")" || { say "run $run wrote a different $(basename "$file")"; agree_status=1; }
  done
  rm -f "$OUT/clinometer-$run/rolling-betas-daily.csv" "$OUT/reference-$run/rolling-betas-daily.csv"
done
node --import tsx bench/print-report.ts "$OUT"
if [ $agree_status -ne 0 ]; then
  say "the outputs disagree: see ${OUT#$ROOT/}/agreement.json"
  exit 1
fi
