// Our side of the live comparison: the synthetic files through Clinometer's readers and engine —
// align (grid, sampling, returns, risk-free), the window, and estimateSecurity with the OLS and the
// Dimson (k = 1) base estimators — one SecurityResult per security and estimator.
import { alignReturns } from '../../cli/src/engine/align.js';
import type { RiskFreeSource, YieldSeries } from '../../cli/src/engine/risk-free.js';
import { estimateSecurity } from '../../cli/src/engine/statistics.js';
import type { EstimationSettings } from '../../cli/src/engine/statistics.js';
import { PERIODS_PER_YEAR } from '../../cli/src/engine/types.js';
import type { BaseEstimator, Frequency, SecurityResult } from '../../cli/src/engine/types.js';
import { windowBounds } from '../../cli/src/engine/window.js';
import { readMarketFile } from '../../cli/src/inputs/market-series.js';
import { readPriceFile } from '../../cli/src/inputs/price-file.js';
import { DEFAULT_WIDE } from '../../cli/src/inputs/price-file-options.js';
import type { DatedSeries } from '../../cli/src/inputs/price-file-options.js';
import { readRiskFreeFile } from '../../cli/src/inputs/risk-free-file.js';
import type { SyntheticFiles } from './make-synthetic.js';

export interface SyntheticInputs {
  readonly securities: readonly DatedSeries[];
  readonly market: DatedSeries;
  readonly yields: YieldSeries;
}

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
  readonly asOfPeriod: string;
  readonly gridPeriods: number;
  readonly securities: ReadonlyMap<string, EngineSecurity>;
}

export async function readSyntheticInputs(files: SyntheticFiles): Promise<SyntheticInputs> {
  const dialect = { delimiter: ',', dateFormat: 'YYYY-MM-DD' };
  const prices = await readPriceFile(files.prices, { ...dialect, columns: DEFAULT_WIDE });
  const market = await readMarketFile(files.market, { ...dialect, dateColumn: 'date', valueColumn: 'level' });
  const yields = await readRiskFreeFile(files.riskFree, { ...dialect, dateColumn: 'date', valueColumn: 'rate_pct', unit: 'percent' });
  return { securities: prices.securities, market, yields };
}

function settingsOf(estimator: BaseEstimator, comparison: ComparisonCase): EstimationSettings {
  return {
    estimator, dimsonLags: 1, minimum: comparison.minimum, periodsPerYear: PERIODS_PER_YEAR[comparison.frequency],
    adjustment: 'none', blumeWeight: 2 / 3,
  };
}

export function runEngineCase(inputs: SyntheticInputs, comparison: ComparisonCase, constantYield: number): EngineCase {
  const riskFree: RiskFreeSource = comparison.riskFree === 'file'
    ? { kind: 'series', series: inputs.yields }
    : { kind: 'constant', annualYield: constantYield };
  const aligned = alignReturns({
    frequency: comparison.frequency, asOf: comparison.asOf, returnKind: 'simple',
    market: inputs.market, securities: inputs.securities, riskFree,
  });
  const bounds = windowBounds(aligned.asOfIndex, comparison.window);
  const window = { start: bounds.first, end: bounds.last };
  const labels = aligned.grid.labels;
  const securities = new Map<string, EngineSecurity>();
  for (const security of aligned.securities) {
    securities.set(security.id, {
      ols: estimateSecurity(security, aligned.marketExcess, window, labels, settingsOf('ols', comparison)),
      dimson: estimateSecurity(security, aligned.marketExcess, window, labels, settingsOf('dimson', comparison)),
    });
  }
  return { asOfPeriod: labels[labels.length - 1] ?? '', gridPeriods: labels.length, securities };
}
