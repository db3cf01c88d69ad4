// CAPM pricing (Sharpe 1964; Lintner 1965; Mossin 1966): E[R_i] = r_f + β (E[R_m] − r_f), with the
// forward-looking r_f and either E[R_m] or the market premium from the spec. Add-on premia (for
// example size or country premia) are summed and added. Rates are decimals (0.02 is 2%).

/** Forward-looking market assumptions: an expected market return or a premium over r_f. */
export type MarketAssumptions =
  | { readonly riskFree: number; readonly expectedMarketReturn: number }
  | { readonly riskFree: number; readonly marketPremium: number };

export function marketPremium(assumptions: MarketAssumptions): number {
  return 'marketPremium' in assumptions ? assumptions.marketPremium : assumptions.expectedMarketReturn - assumptions.riskFree;
}

function sum(values: readonly number[]): number {
  return values.reduce((total, value) => total + value, 0);
}

/** r_f + β·premium + Σ add-on premia. */
export function capmExpectedReturn(beta: number, assumptions: MarketAssumptions, addOnPremia: readonly number[] = []): number {
  return assumptions.riskFree + beta * marketPremium(assumptions) + sum(addOnPremia);
}

export interface ReturnBand {
  readonly low: number;
  readonly high: number;
}

/** Expected returns at the ends of the beta's 95% interval (ordered, so a negative premium still gives low ≤ high). */
export function capmBand(betaLow: number, betaHigh: number, assumptions: MarketAssumptions, addOnPremia: readonly number[] = []): ReturnBand {
  const a = capmExpectedReturn(betaLow, assumptions, addOnPremia), b = capmExpectedReturn(betaHigh, assumptions, addOnPremia);
  return { low: Math.min(a, b), high: Math.max(a, b) };
}

export interface SmlPoint {
  readonly beta: number;
  readonly expectedReturn: number;
}

/** Points of the security market line at `count` evenly spaced betas from `fromBeta` to `toBeta`. */
export function securityMarketLine(assumptions: MarketAssumptions, fromBeta: number, toBeta: number, count: number): SmlPoint[] {
  if (!Number.isInteger(count) || count < 2) throw new RangeError(`a security market line needs at least 2 points, got ${count}`);
  return Array.from({ length: count }, (_, i) => {
    const beta = fromBeta + ((toBeta - fromBeta) * i) / (count - 1);
    return { beta, expectedReturn: capmExpectedReturn(beta, assumptions) };
  });
}

export interface Holding {
  readonly weight: number; // any unit (a value, a share count times a price, or a fraction)
  readonly value: number; // the holding's beta or expected return
}

/**
 * Σ wᵢ·vᵢ. With `normalise` (the default) the weights are divided by their sum first, so market
 * values can be passed as they are; without it they are used as given (fractions that already sum to
 * 1, or deliberately partial or leveraged weights). A zero weight sum cannot be normalised.
 */
export function weightedSum(holdings: readonly Holding[], normalise = true): number {
  const total = normalise ? sum(holdings.map((h) => h.weight)) : 1;
  if (total === 0) throw new RangeError('portfolio weights sum to zero and cannot be normalised');
  return holdings.reduce((acc, h) => acc + (h.weight / total) * h.value, 0);
}

/** Portfolio beta Σ wᵢβᵢ (weights normalised by default; see weightedSum). */
export function portfolioBeta(holdings: readonly { readonly weight: number; readonly beta: number }[], normalise = true): number {
  return weightedSum(holdings.map((h) => ({ weight: h.weight, value: h.beta })), normalise);
}

/** Portfolio expected return Σ wᵢE[Rᵢ] (weights normalised by default; see weightedSum). */
export function portfolioExpectedReturn(holdings: readonly { readonly weight: number; readonly expectedReturn: number }[], normalise = true): number {
  return weightedSum(holdings.map((h) => ({ weight: h.weight, value: h.expectedReturn })), normalise);
}
