import { describe, expect, it } from 'vitest';
import { applyVasicek, blumeBeta, linearAdjustment, vasicekPrior, vasicekShrink } from './adjustments.js';
import { securityResult } from './test-support/security-result.js';
import type { SecurityResult } from './types.js';

describe('Blume adjustment', () => {
  it('takes 1.5 to 1.3333… with the default weight of exactly 2/3 (common practice, FORMULAS.md)', () => {
    expect(blumeBeta(1.5)).toBeCloseTo(4 / 3, 15);
  });

  it('takes 1.5 to 1.335 with the weight set to 0.67 (FORMULAS.md, arithmetic: 0.67 × 1.5 + 0.33)', () => {
    expect(blumeBeta(1.5, 0.67)).toBeCloseTo(1.335, 15);
  });

  it('gives 0.6138 for β₁ = 0.4 under the published cross-period fit β₂ = 0.343 + 0.677 β₁ (Blume 1975, as quoted in textbooks [memory])', () => {
    expect(linearAdjustment(0.4, 0.343, 0.677)).toBeCloseTo(0.6138, 15);
  });

  it('adjusts the worked example\'s beta 1.19590747062 to 1.13060498042 (WORKED-EXAMPLE.md)', () => {
    expect(blumeBeta(1.19590747062)).toBeCloseTo(1.13060498042, 10); // both printed to 12 digits
  });
});

describe('Vasicek shrinkage', () => {
  it('shrinks β̂ 1.5 (s 0.3) toward a prior of 1.0 (σ² 0.25) to 1.3676470588235294 (FORMULAS.md, arithmetic)', () => {
    const shrunk = vasicekShrink(1.5, 0.3, 1.0, 0.25);
    expect(shrunk.beta).toBeCloseTo(1.3676470588235294, 15);
    expect(shrunk.variance).toBeCloseTo(0.0661764705882353, 15);
  });

  it('uses the mean and sample variance (n − 1) of the betas as the prior', () => {
    const members = [0.6, 1.0, 1.1, 1.7].map((beta) => ({ beta, betaSe: 0.2 }));
    // mean 1.1; squared deviations 0.25 + 0.01 + 0 + 0.36 = 0.62; / 3 [arithmetic].
    expect(vasicekPrior(members, 'cross-section')).toEqual({ count: 4, mean: 1.1, variance: expect.closeTo(0.62 / 3, 15) });
  });

  it('subtracts the mean squared standard error under the less-noise prior (Lally 1998)', () => {
    const members = [0.6, 1.0, 1.1, 1.7].map((beta, i) => ({ beta, betaSe: 0.1 * (i + 1) }));
    // mean of se²: (0.01 + 0.04 + 0.09 + 0.16) / 4 = 0.075 [arithmetic].
    expect(vasicekPrior(members, 'cross-section-less-noise').variance).toBeCloseTo(0.62 / 3 - 0.075, 15);
  });

  it('has no prior with fewer than 3 betas, or when the less-noise variance is not positive', () => {
    expect(vasicekPrior([{ beta: 1, betaSe: 0.1 }, { beta: 1.2, betaSe: 0.1 }], 'cross-section').variance).toBeNaN();
    const noisy = [0.9, 1.0, 1.1].map((beta) => ({ beta, betaSe: 0.5 }));
    expect(vasicekPrior(noisy, 'cross-section-less-noise').variance).toBeNaN();
  });
});

describe('applyVasicek across a run', () => {
  const result = (id: string, beta: number, betaSe: number, status: SecurityResult['status'] = 'ok') =>
    securityResult({ id, status, beta, betaSe });
  const run = [result('A1', 0.6, 0.2), result('A2', 1.0, 0.2), result('A3', 1.1, 0.2), result('A4', 1.7, 0.2), result('B1', 1.4, 0.3), result('B2', 0.8, 0.3), result('C1', NaN, NaN, 'insufficient')];

  it('shrinks every ok beta toward the whole run\'s prior when no groups are named', () => {
    const out = applyVasicek(run, { adjustment: 'vasicek', vasicekPrior: 'cross-section' });
    const prior = vasicekPrior(run.slice(0, 6), 'cross-section');
    expect(out[0]!.vasicekBeta).toBe(vasicekShrink(0.6, 0.2, prior.mean, prior.variance).beta);
    expect(out[0]!.adjustedBeta).toBe(out[0]!.vasicekBeta);
    expect(out[6]).toBe(run[6]);
  });

  it('uses each group\'s own prior, and flags a group with fewer than 3 betas as degenerate', () => {
    const out = applyVasicek(run, { adjustment: 'vasicek', vasicekPrior: 'cross-section', groupOf: (id) => id[0] });
    const groupA = vasicekPrior(run.slice(0, 4), 'cross-section');
    expect(out[3]!.vasicekBeta).toBe(vasicekShrink(1.7, 0.2, groupA.mean, groupA.variance).beta);
    expect(out[4]!.vasicekBeta).toBeNaN();
    expect(out[4]!.flags).toEqual(['degenerate']);
  });

  it('fills the Vasicek beta without touching the adjusted beta or flags when another adjustment prices', () => {
    const out = applyVasicek(run.slice(4, 6), { adjustment: 'blume', vasicekPrior: 'cross-section' });
    expect(out[0]!.flags).toEqual([]);
    expect(out[0]!.adjustedBeta).toBeNaN();
  });
});
