// The estimation steps of a run, each one engine call: the base estimate per security over the
// window, its rolling betas, the Vasicek prior across the run, then the review flags. Glue only.
import type { ResolvedRunSpec } from '../../../server/src/contracts/run-spec.schema.js';
import { applyVasicek } from '../engine/adjustments.js';
import type { AlignedSample } from '../engine/align.js';
import { withFlags, type FlagThresholds } from '../engine/flags.js';
import { rollingBetaRange, rollingBetas, type RollingBetas } from '../engine/rolling.js';
import { estimateSecurity, type EstimationSettings } from '../engine/statistics.js';
import { PERIODS_PER_YEAR, type IndexRange, type SecurityResult } from '../engine/types.js';
import { windowBounds } from '../engine/window.js';

export interface EstimatedSecurity {
  readonly result: SecurityResult;
  readonly rolling: RollingBetas;
}

export function estimationWindow(spec: ResolvedRunSpec, aligned: AlignedSample): IndexRange {
  const bounds = windowBounds(aligned.asOfIndex, spec.sampling.window);
  return { start: bounds.first, end: bounds.last };
}

function estimationSettings(spec: ResolvedRunSpec): EstimationSettings {
  return {
    estimator: spec.estimation.estimator,
    dimsonLags: spec.estimation.dimson.lags,
    minimum: spec.sampling.minimum,
    periodsPerYear: PERIODS_PER_YEAR[spec.sampling.frequency],
    adjustment: spec.estimation.adjustment,
    blumeWeight: spec.estimation.blume.weight,
  };
}

function flagThresholds(spec: ResolvedRunSpec): FlagThresholds {
  const flags = spec.flags;
  return {
    thinDataShare: flags.thinDataShare,
    lowFitRSquared: flags.lowFitRSquared,
    stalePriceShare: flags.stalePricesShare,
    unstableRange: flags.unstableRange,
    bigMoveChange: flags.bigMoveChange,
  };
}

/** Per security in price-file order: the result with adjustments and flags, and its rolling betas. */
export function estimateRun(
  spec: ResolvedRunSpec,
  aligned: AlignedSample,
  priorBetas: ReadonlyMap<string, number>,
  onProgress: (done: number, total: number) => void,
): EstimatedSecurity[] {
  const window = estimationWindow(spec, aligned);
  const settings = estimationSettings(spec);
  const rolling = spec.estimation.rolling;
  const rollingSettings = { length: rolling.length, step: rolling.step, count: rolling.count, minimum: spec.sampling.minimum };
  const total = aligned.securities.length;
  onProgress(0, total);
  const estimated = aligned.securities.map((security, i) => {
    const base = estimateSecurity(security, aligned.marketExcess, window, aligned.grid.labels, settings);
    const betas = rollingBetas(security.excess, aligned.marketExcess, aligned.asOfIndex, rollingSettings);
    if ((i + 1) % 50 === 0 || i + 1 === total) onProgress(i + 1, total);
    const result = base.status === 'ok' ? { ...base, rollingBetaRange: rollingBetaRange(betas) } : base;
    return { result, rolling: betas };
  });
  const groups = spec.groups;
  const adjusted = applyVasicek(estimated.map((e) => e.result), {
    adjustment: spec.estimation.adjustment,
    vasicekPrior: spec.estimation.vasicek.priorVariance,
    groupOf: spec.estimation.vasicek.priorScope === 'group' && groups !== undefined ? (id) => groups[id] : undefined,
  });
  const thresholds = flagThresholds(spec);
  return estimated.map((entry, i) => {
    const priorBeta = priorBetas.get(entry.result.id);
    const context = priorBeta === undefined ? { windowLength: spec.sampling.window } : { windowLength: spec.sampling.window, priorBeta };
    return { ...entry, result: withFlags(adjusted[i]!, context, thresholds) };
  });
}
