// The one entry point of a batch run: reads the inputs per the spec, samples and aligns them on the
// grid, estimates with the base estimator, adjusts, rolls, prices, unlevers and relevers, flags (a
// big move against the prior betas the caller supplies), and answers every result row, the compact
// per-security series and the inputs' checksums for the fingerprint. Glue only: every number comes
// from cli/src/engine/.
import type { SecuritySeries } from '../../../server/src/contracts/ingest.schemas.js';
import type { ResultRow } from '../../../server/src/contracts/result-columns.js';
import type { ResolvedRunSpec } from '../../../server/src/contracts/run-spec.schema.js';
import { alignReturns } from '../engine/align.js';
import { isoOfDayNumber } from '../engine/calendar-date.js';
import { estimateRun, estimationWindow } from './estimate-run.js';
import { inputChecksums, type InputChecksum } from './input-checksums.js';
import type { RunInputPaths } from './input-roles.js';
import { resultRows } from './price-and-lever.js';
import { readRunInputs } from './read-run-inputs.js';
import { securitySeries } from './security-series.js';

export interface ComputedRun {
  /** The resolved as-of date, `YYYY-MM-DD` (latest replaced by the market's last date). */
  readonly asOf: string;
  /** One row per security of the price file, in its order. */
  readonly rows: readonly ResultRow[];
  readonly series: readonly SecuritySeries[];
  /** Name, sha256 and size of each input file, in the order prices, market, risk-free. */
  readonly inputs: readonly InputChecksum[];
}

export interface ComputeRunOptions {
  /** Overrides the spec's `sampling.asOf`: a date `YYYY-MM-DD` or `latest`. */
  readonly asOf?: string;
  /** Security code → its pricing beta in the last released run of the spec (for `big-move`). */
  readonly priorBetas?: ReadonlyMap<string, number>;
  readonly onProgress?: (done: number, total: number) => void;
}

export async function computeRun(spec: ResolvedRunSpec, inputPaths: RunInputPaths, options: ComputeRunOptions = {}): Promise<ComputedRun> {
  const data = await readRunInputs(spec, inputPaths);
  const inputs = await inputChecksums(inputPaths);
  const aligned = alignReturns({
    frequency: spec.sampling.frequency,
    asOf: options.asOf ?? spec.sampling.asOf,
    returnKind: spec.sampling.returns,
    weekEnd: spec.sampling.weekday,
    market: data.market,
    securities: data.securities,
    riskFree: data.riskFree,
  });
  const estimated = estimateRun(spec, aligned, options.priorBetas ?? new Map(), options.onProgress ?? (() => {}));
  const window = estimationWindow(spec, aligned);
  return {
    asOf: isoOfDayNumber(aligned.asOfDay),
    rows: resultRows(spec, estimated.map((e) => e.result)),
    series: estimated.map((e, i) => securitySeries(aligned, i, window, spec.sampling.minimum, e.rolling)),
    inputs,
  };
}
