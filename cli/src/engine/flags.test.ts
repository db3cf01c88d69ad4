import { describe, expect, it } from 'vitest';
import { DEFAULT_FLAG_THRESHOLDS, resultFlags, withFlags } from './flags.js';
import { securityResult } from './test-support/security-result.js';

const context = { windowLength: 60 };

describe('resultFlags', () => {
  it('raises nothing for a full, well-fitted, liquid and stable result', () => {
    expect(resultFlags(securityResult({ id: 'QZ1', n: 60, rSquared: 0.4, zeroReturnShare: 0.02, rollingBetaRange: 0.2 }), context)).toEqual([]);
  });

  it('flags thin data below 80% of the window by default (48 of 60), the run spec\'s default', () => {
    expect(resultFlags(securityResult({ id: 'QZ1', n: 47 }), context)).toEqual(['thin-data']);
    expect(resultFlags(securityResult({ id: 'QZ1', n: 48 }), context)).toEqual([]);
  });

  it('flags low fit, stale prices and instability at their thresholds', () => {
    const result = securityResult({ id: 'QZ1', rSquared: 0.099, zeroReturnShare: 0.21, rollingBetaRange: 0.51 });
    expect(resultFlags(result, context)).toEqual(['low-fit', 'stale-prices', 'unstable']);
  });

  it('flags a big move only against a prior value that the caller supplies', () => {
    const result = securityResult({ id: 'QZ1', adjustedBeta: 1.3 });
    expect(resultFlags(result, context)).toEqual([]);
    expect(resultFlags(result, { ...context, priorBeta: 1.0 })).toEqual(['big-move']);
    expect(resultFlags(result, { ...context, priorBeta: 1.1 })).toEqual([]);
  });

  it('keeps a degenerate flag set upstream, in canonical order after the others', () => {
    const result = securityResult({ id: 'QZ1', n: 10, flags: ['degenerate'] });
    expect(resultFlags(result, context)).toEqual(['thin-data', 'degenerate']);
  });

  it('honours thresholds from the spec', () => {
    const result = securityResult({ id: 'QZ1', rSquared: 0.15 });
    expect(withFlags(result, context, { ...DEFAULT_FLAG_THRESHOLDS, lowFitRSquared: 0.2 }).flags).toEqual(['low-fit']);
  });

  it('never raises a flag from a missing (NaN) estimate', () => {
    const result = securityResult({ id: 'QZ1', status: 'insufficient', n: 59, rSquared: NaN, zeroReturnShare: NaN, adjustedBeta: NaN });
    expect(resultFlags(result, { ...context, priorBeta: 1 })).toEqual([]);
  });
});
