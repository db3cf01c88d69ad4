// Student's t distribution: two-sided p-values and quantiles for regression inference.
//
// Tail probabilities: P(|T| > t) = I_{ν/(ν+t²)}(ν/2, 1/2) (Abramowitz & Stegun 26.7.1 with 26.5.27),
// evaluated by our incomplete beta to near machine precision in relative terms, also far in the tail.
// Quantiles: jStat's inverse (good to about 1e-8) is the starting point, then Newton steps on the
// accurate tail probability bring it to machine precision. jStat's own CDF stops its continued
// fraction at a relative change of 3e-7, too coarse for results compared at 1e-9.

import jStat from 'jstat';
import { regularizedIncompleteBeta } from './incomplete-beta.js';
import { logGamma } from './log-gamma.js';

/** P(|T| > |t|) for T ~ t(df), df > 0 (not necessarily an integer). NaN when undefined. */
export function studentTTwoSidedP(t: number, df: number): number {
  if (Number.isNaN(t) || !(df > 0)) return Number.NaN;
  if (!Number.isFinite(t)) return 0;
  const t2 = t * t;
  return regularizedIncompleteBeta(df / (df + t2), t2 / (df + t2), df / 2, 0.5);
}

/** P(T > t) for T ~ t(df). */
export function studentTUpperTail(t: number, df: number): number {
  const half = studentTTwoSidedP(t, df) / 2;
  return t >= 0 ? half : 1 - half;
}

/** Density of t(df) at t. */
export function studentTDensity(t: number, df: number): number {
  if (Number.isNaN(t) || !(df > 0)) return Number.NaN;
  const logNorm = logGamma((df + 1) / 2) - logGamma(df / 2) - 0.5 * Math.log(df * Math.PI);
  return Math.exp(logNorm - ((df + 1) / 2) * Math.log1p((t * t) / df));
}

/** The q with P(T ≤ q) = p for T ~ t(df), 0 < p < 1. */
export function studentTQuantile(p: number, df: number): number {
  if (!(p > 0 && p < 1 && df > 0)) return Number.NaN;
  if (p === 0.5) return 0;
  const upper = Math.min(p, 1 - p);
  const q = refineUpperQuantile(upper, df, Math.abs(jStat.studentt.inv(1 - upper, df)));
  return p > 0.5 ? q : -q;
}

/** Newton iterations on P(T > q) = upper for q > 0, safeguarded by a bracket. */
function refineUpperQuantile(upper: number, df: number, start: number): number {
  let low = 0;
  let high = Number.POSITIVE_INFINITY;
  let q = Number.isFinite(start) && start > 0 ? start : 1;
  for (let iteration = 0; iteration < 100; iteration += 1) {
    const excess = studentTTwoSidedP(q, df) / 2 - upper;
    if (excess === 0) return q;
    if (excess > 0) low = q;
    else high = q;
    let next = q + excess / studentTDensity(q, df);
    if (!(next > low && next < high)) next = Number.isFinite(high) ? (low + high) / 2 : 2 * q;
    if (Math.abs(next - q) <= 4 * Number.EPSILON * q) return next;
    q = next;
  }
  return q;
}
