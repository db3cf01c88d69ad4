// Adjustments of the base beta toward a prior.
//
// Blume (1971, Journal of Finance 26(1); 1975, 30(3)): β_adj = w·β + (1 − w)·1, w = 2/3 by default
// (common practice; a setting).
// Vasicek (1973, Journal of Finance 28(5)): β* = v/(v + se²)·β + se²/(v + se²)·m, posterior variance
// v·se²/(v + se²), with m and v the mean and sample variance (n − 1) of the base betas with status ok
// across the run or within a group. Prior variance setting: `cross-section` uses v as it is;
// `cross-section-less-noise` subtracts the mean squared standard error of those betas (Lally 1998,
// Financial Review 33). With fewer than 3 such betas, or v ≤ 0, there is no Vasicek beta (NaN); when
// Vasicek is the spec's adjustment the security is then flagged `degenerate`.
// Securities without a group key are pooled together as one group.

import type { Adjustment, ResultFlag, SecurityResult, VasicekPrior } from './types.js';

export const DEFAULT_BLUME_WEIGHT = 2 / 3;
export const MINIMUM_VASICEK_PEERS = 3;

/** intercept + slope·β: the form of a fitted cross-period regression of betas on their past values. */
export function linearAdjustment(beta: number, intercept: number, slope: number): number {
  return intercept + slope * beta;
}

/** w·β + (1 − w)·1. */
export function blumeBeta(beta: number, weight: number = DEFAULT_BLUME_WEIGHT): number {
  return linearAdjustment(beta, 1 - weight, weight);
}

export interface VasicekPriorStats {
  readonly count: number;
  readonly mean: number;
  readonly variance: number; // the prior variance used (NaN when undefined)
}

export interface ShrunkBeta {
  readonly beta: number;
  readonly variance: number; // posterior variance
}

/** β* and its posterior variance for a beta with standard error se and the prior (mean, variance). */
export function vasicekShrink(beta: number, se: number, priorMean: number, priorVariance: number): ShrunkBeta {
  if (!(priorVariance > 0) || !Number.isFinite(se) || !Number.isFinite(beta)) return { beta: NaN, variance: NaN };
  const noise = se * se, total = priorVariance + noise;
  return { beta: (priorVariance / total) * beta + (noise / total) * priorMean, variance: (priorVariance * noise) / total };
}

/** Usable for the prior: status ok, not degenerate, finite beta and standard error. */
function isPriorMember(result: SecurityResult): boolean {
  return result.status === 'ok' && !result.flags.includes('degenerate') && Number.isFinite(result.beta) && Number.isFinite(result.betaSe);
}

/** Cross-sectional prior from base betas and their standard errors (two-pass mean and variance). */
export function vasicekPrior(members: readonly { readonly beta: number; readonly betaSe: number }[], prior: VasicekPrior): VasicekPriorStats {
  const count = members.length;
  if (count < MINIMUM_VASICEK_PEERS) return { count, mean: NaN, variance: NaN };
  const mean = members.reduce((sum, m) => sum + m.beta, 0) / count;
  const spread = members.reduce((sum, m) => sum + (m.beta - mean) ** 2, 0) / (count - 1);
  const noise = members.reduce((sum, m) => sum + m.betaSe * m.betaSe, 0) / count;
  const variance = prior === 'cross-section' ? spread : spread - noise;
  return { count, mean, variance: variance > 0 ? variance : NaN };
}

export interface AdjustmentSettings {
  readonly adjustment: Adjustment;
  readonly vasicekPrior: VasicekPrior;
  /** Group key of a security (e.g. its sector); undefined pools it with the other ungrouped ones. */
  readonly groupOf?: (id: string) => string | undefined;
}

function withVasicek(result: SecurityResult, prior: VasicekPriorStats, adjustment: Adjustment): SecurityResult {
  if (result.status !== 'ok') return result;
  const vasicekBeta = vasicekShrink(result.beta, result.betaSe, prior.mean, prior.variance).beta;
  if (adjustment !== 'vasicek') return { ...result, vasicekBeta };
  const flags: ResultFlag[] = Number.isNaN(vasicekBeta) && !result.flags.includes('degenerate') ? [...result.flags, 'degenerate'] : [...result.flags];
  return { ...result, vasicekBeta, adjustedBeta: vasicekBeta, flags };
}

/** Fills vasicekBeta (and adjustedBeta under Vasicek) across a run; the input is left unchanged. */
export function applyVasicek(results: readonly SecurityResult[], settings: AdjustmentSettings): SecurityResult[] {
  const key = (id: string) => settings.groupOf?.(id) ?? '';
  const groups = new Map<string, SecurityResult[]>();
  for (const result of results.filter(isPriorMember)) {
    const group = groups.get(key(result.id)) ?? [];
    group.push(result);
    groups.set(key(result.id), group);
  }
  const priors = new Map([...groups].map(([group, members]) => [group, vasicekPrior(members, settings.vasicekPrior)]));
  const none: VasicekPriorStats = { count: 0, mean: NaN, variance: NaN };
  return results.map((result) => withVasicek(result, priors.get(key(result.id)) ?? none, settings.adjustment));
}
