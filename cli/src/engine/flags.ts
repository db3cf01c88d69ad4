// Review flags on a security's result. Thresholds are settings; the defaults:
//
// | flag           | raised when                                              | default        |
// | -------------- | -------------------------------------------------------- | -------------- |
// | `thin-data`    | n < share × W (window length in return periods)          | share 0.8      |
// | `low-fit`      | R² of the base estimate < threshold                      | 0.1            |
// | `stale-prices` | share of zero security returns in the window > threshold | 0.2            |
// | `unstable`     | max − min of the rolling betas > threshold               | 0.5            |
// | `big-move`     | |adjusted beta − prior value| > threshold                | 0.25           |
// | `degenerate`   | set upstream (no variance, no estimate, no Vasicek beta) | —              |
//
// Why these values: 90% of the window keeps a month or two of gaps in five years (or about 25 days
// a year) unflagged; an R² under 5% means the market explains almost none of the variation, so the
// beta says little; more than one zero return in five points at stale or illiquid prices; a rolling
// beta that travels half a unit within the lookback is not one stable number; a quarter of a unit
// between two reports moves a cost of equity by more than a percentage point at usual premia.
// Comparisons with NaN never raise a flag, so a missing estimate never looks like bad data here.

import type { ResultFlag, SecurityResult } from './types.js';

export interface FlagThresholds {
  readonly thinDataShare: number;
  readonly lowFitRSquared: number;
  readonly stalePriceShare: number;
  readonly unstableRange: number;
  readonly bigMoveChange: number;
}

export const DEFAULT_FLAG_THRESHOLDS: FlagThresholds = {
  thinDataShare: 0.8,
  lowFitRSquared: 0.1,
  stalePriceShare: 0.2,
  unstableRange: 0.5,
  bigMoveChange: 0.25,
};

/** Canonical order of flags in results and reports. */
export const FLAG_ORDER: readonly ResultFlag[] = ['thin-data', 'low-fit', 'stale-prices', 'unstable', 'big-move', 'degenerate'];

export interface FlagContext {
  readonly windowLength: number; // W
  /** The same security's adjusted beta in the last released run of the spec, if any. */
  readonly priorBeta?: number;
}

/** The flags a result earns, merged with the ones it already carries, in canonical order. */
export function resultFlags(result: SecurityResult, context: FlagContext, thresholds: FlagThresholds = DEFAULT_FLAG_THRESHOLDS): ResultFlag[] {
  const raised = new Set<ResultFlag>(result.flags);
  if (result.n < thresholds.thinDataShare * context.windowLength) raised.add('thin-data');
  if (result.rSquared < thresholds.lowFitRSquared) raised.add('low-fit');
  if (result.zeroReturnShare > thresholds.stalePriceShare) raised.add('stale-prices');
  if (result.rollingBetaRange > thresholds.unstableRange) raised.add('unstable');
  if (context.priorBeta !== undefined && Math.abs(result.adjustedBeta - context.priorBeta) > thresholds.bigMoveChange) raised.add('big-move');
  return FLAG_ORDER.filter((flag) => raised.has(flag));
}

/** The result with its flags evaluated (see resultFlags). */
export function withFlags(result: SecurityResult, context: FlagContext, thresholds: FlagThresholds = DEFAULT_FLAG_THRESHOLDS): SecurityResult {
  return { ...result, flags: resultFlags(result, context, thresholds) };
}
