// Our side of the live comparison: the synthetic files through `computeRun`, the one entry point that
// turns a run spec and its input files into result rows (readers, grid, returns, risk-free, window,
// base estimator, adjustments). One run with the OLS and one with the Dimson (k = 1) base estimator.
import { computeRun } from '../../cli/src/batch/compute-run.js';
import { fillRunSpecDefaults, runSpecSchema } from '../../server/src/contracts/run-spec.schema.js';
import type { ResolvedRunSpec, RunSpecInput } from '../../server/src/contracts/run-spec.schema.js';
import type { BaseEstimator, Frequency, SecurityResult } from '../../cli/src/engine/types.js';
import type { SyntheticFiles } from './make-synthetic.js';

export interface ComparisonCase {
  readonly frequency: Frequency;
  readonly asOf: string;
  readonly riskFree: 'file' | 'constant';
  readonly window: number;
  readonly minimum: number;
}

export interface EngineSecurity {
  readonly ols: SecurityResult;
  readonly dimson: SecurityResult;
}

export interface EngineCase {
  /** The as-of date the run resolved ("latest" becomes the market's last date). */
  readonly asOf: string;
  readonly securities: ReadonlyMap<string, EngineSecurity>;
}

function specOf(comparison: ComparisonCase, estimator: BaseEstimator, constantYield: number): ResolvedRunSpec {
  const input: RunSpecInput = {
    schema: 1,
    name: 'reference-comparison',
    inputs: {
      prices: { pattern: 'prices.csv', layout: 'wide' },
      market: { source: 'own-file', pattern: 'index.csv', column: 'level' },
      riskFree: comparison.riskFree === 'file'
        ? { source: 'file', pattern: 'rates.csv', column: 'rate_pct', unit: 'percent' }
        : { source: 'constant', annualYield: constantYield },
    },
    sampling: { frequency: comparison.frequency, asOf: comparison.asOf, window: comparison.window, minimum: comparison.minimum },
    estimation: { estimator, dimson: { lags: 1 } },
  };
  return fillRunSpecDefaults(runSpecSchema.parse(input));
}

export async function runEngineCase(files: SyntheticFiles, comparison: ComparisonCase, constantYield: number): Promise<EngineCase> {
  const paths = comparison.riskFree === 'file'
    ? { prices: files.prices, market: files.market, riskFree: files.riskFree }
    : { prices: files.prices, market: files.market };
  const ols = await computeRun(specOf(comparison, 'ols', constantYield), paths);
  const dimson = await computeRun(specOf(comparison, 'dimson', constantYield), paths);
  const dimsonById = new Map(dimson.rows.map((row) => [row.id, row]));
  const securities = new Map<string, EngineSecurity>();
  for (const row of ols.rows) securities.set(row.id, { ols: row, dimson: dimsonById.get(row.id)! });
  return { asOf: ols.asOf, securities };
}
