// Synthetic daily excess returns of a thinly traded security (seeded): the market and the security
// follow a one-factor model with a known beta, but the security's price only updates on days it
// trades, so its observed return gathers every true return since its previous trade.

import { seededRandom } from './seeded-random.js';

export interface StaleSeriesOptions {
  readonly seed: number;
  readonly periods: number;
  readonly beta: number;
  readonly tradeProbability: number; // chance that the security trades on a day
  readonly marketSd?: number; // per-period sd of market returns (default 1%)
  readonly residualSd?: number; // per-period sd of the security's own shocks (default 1.5%)
}

export interface StaleSeries {
  readonly market: Float64Array; // index 0 is NaN, as on the engine's grid
  readonly security: Float64Array; // observed (stale) returns
  readonly synchronous: Float64Array; // the security's true returns on the same days
  readonly zeroShare: number; // share of days with a zero observed return
}

export function staleSeries(options: StaleSeriesOptions): StaleSeries {
  const random = seededRandom(options.seed);
  const { periods, beta, tradeProbability } = options;
  const marketSd = options.marketSd ?? 0.01, residualSd = options.residualSd ?? 0.015;
  const market = new Float64Array(periods).fill(NaN), security = new Float64Array(periods).fill(NaN);
  const synchronous = new Float64Array(periods).fill(NaN);
  let pending = 0, zeros = 0;
  for (let t = 1; t < periods; t += 1) {
    const marketLog = 0.0003 + marketSd * random.normal();
    const securityLog = beta * marketLog + residualSd * random.normal();
    market[t] = Math.expm1(marketLog);
    synchronous[t] = Math.expm1(securityLog);
    pending += securityLog;
    const trades = random.uniform() < tradeProbability;
    security[t] = trades ? Math.expm1(pending) : 0;
    if (trades) pending = 0;
    else zeros += 1;
  }
  return { market, security, synchronous, zeroShare: zeros / (periods - 1) };
}
