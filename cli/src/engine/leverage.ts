// Capital structure: unlevering and relevering betas, peer groups, cost of debt and WACC.
//
// Hamada (1972, Journal of Finance 27(2)): β_L = β_U [1 + (1 − T) D/E].
// Harris–Pringle (1985, Journal of Financial Research 8(3)): β_L = β_U + (β_U − β_D) D/E, with a
// debt beta β_D (default 0), hence β_U = (β_L + β_D·D/E) / (1 + D/E).
// WACC = E/V · r_E + D/V · r_D (1 − T). Rates and tax rates are decimals; D/E is a ratio.

import type { PeerAverage, Unlevering } from './types.js';

export interface LeverageInputs {
  readonly debtToEquity: number;
  readonly taxRate: number; // used by Hamada
  readonly debtBeta?: number; // used by Harris–Pringle, default 0
}

/** D/E from the debt share of the firm's value D/V. */
export function debtToEquityFromDebtShare(debtShare: number): number {
  if (!(debtShare >= 0 && debtShare < 1)) throw new RangeError(`debt share D/V must be in [0, 1), got ${debtShare}`);
  return debtShare / (1 - debtShare);
}

export function releverHamada(unleveredBeta: number, debtToEquity: number, taxRate: number): number {
  return unleveredBeta * (1 + (1 - taxRate) * debtToEquity);
}

export function unleverHamada(leveredBeta: number, debtToEquity: number, taxRate: number): number {
  return leveredBeta / (1 + (1 - taxRate) * debtToEquity);
}

export function releverHarrisPringle(unleveredBeta: number, debtToEquity: number, debtBeta = 0): number {
  return unleveredBeta + (unleveredBeta - debtBeta) * debtToEquity;
}

export function unleverHarrisPringle(leveredBeta: number, debtToEquity: number, debtBeta = 0): number {
  return (leveredBeta + debtBeta * debtToEquity) / (1 + debtToEquity);
}

export function unlever(method: Unlevering, leveredBeta: number, inputs: LeverageInputs): number {
  return method === 'hamada'
    ? unleverHamada(leveredBeta, inputs.debtToEquity, inputs.taxRate)
    : unleverHarrisPringle(leveredBeta, inputs.debtToEquity, inputs.debtBeta ?? 0);
}

export function relever(method: Unlevering, unleveredBeta: number, inputs: LeverageInputs): number {
  return method === 'hamada'
    ? releverHamada(unleveredBeta, inputs.debtToEquity, inputs.taxRate)
    : releverHarrisPringle(unleveredBeta, inputs.debtToEquity, inputs.debtBeta ?? 0);
}

/** Median (mean of the two middle values for an even count) or mean; NaN for no values. */
export function average(values: readonly number[], kind: PeerAverage): number {
  if (values.length === 0) return NaN;
  if (kind === 'mean') return values.reduce((s, v) => s + v, 0) / values.length;
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

export interface PeerGroupBeta {
  readonly unleveredBetas: readonly number[]; // per peer, input order (NaN where the beta is missing)
  readonly count: number; // peers with a finite unlevered beta
  readonly unleveredBeta: number; // their median or mean
  readonly releveredBeta: number; // at the target structure
}

/** Unlevers each peer's beta, averages the finite ones, relevers the average at the target. */
export function peerGroupBeta(
  peers: readonly ({ readonly leveredBeta: number } & LeverageInputs)[], target: LeverageInputs, method: Unlevering, kind: PeerAverage = 'median',
): PeerGroupBeta {
  const unleveredBetas = peers.map((peer) => unlever(method, peer.leveredBeta, peer));
  const finite = unleveredBetas.filter(Number.isFinite);
  const unleveredBeta = average(finite, kind);
  return { unleveredBetas, count: finite.length, unleveredBeta, releveredBeta: relever(method, unleveredBeta, target) };
}

export function afterTaxCostOfDebt(preTaxCostOfDebt: number, taxRate: number): number {
  return preTaxCostOfDebt * (1 - taxRate);
}

/** WACC from market values of equity and debt (any one currency unit) and the after-tax cost of debt. */
export function wacc(equityValue: number, debtValue: number, costOfEquity: number, afterTaxDebtCost: number): number {
  const value = equityValue + debtValue;
  if (!(value > 0)) throw new RangeError(`equity plus debt must be positive, got ${value}`);
  return (equityValue / value) * costOfEquity + (debtValue / value) * afterTaxDebtCost;
}

/** WACC from D/E, the cost of equity, the pre-tax cost of debt and the tax rate. */
export function waccFromDebtToEquity(debtToEquity: number, costOfEquity: number, preTaxCostOfDebt: number, taxRate: number): number {
  return wacc(1, debtToEquity, costOfEquity, afterTaxCostOfDebt(preTaxCostOfDebt, taxRate));
}
