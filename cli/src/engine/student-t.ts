// Student's t distribution for regression inference, from stdlib (@stdlib/stats-base-dists-t-cdf
// and -quantile: a maintained numerics library whose incomplete beta follows Boost's, accurate to
// about machine precision). jStat's CDF stops its continued fraction at a relative change of 3e-7,
// too coarse for results compared with reference libraries at 1e-10, so it is not used here.
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import tQuantile from '@stdlib/stats-base-dists-t-quantile';

/** P(|T| > |t|) for T ~ t(df), df > 0 (not necessarily an integer). NaN when undefined. */
export function studentTTwoSidedP(t: number, df: number): number {
  if (Number.isNaN(t) || !(df > 0)) return Number.NaN;
  return 2 * tCdf(-Math.abs(t), df);
}

/** P(T > t) for T ~ t(df). */
export function studentTUpperTail(t: number, df: number): number {
  if (Number.isNaN(t) || !(df > 0)) return Number.NaN;
  return tCdf(-t, df);
}

/**
 * The q with P(T ≤ q) = p for T ~ t(df), 0 < p < 1. A run asks for the same few (p, df) pairs
 * thousands of times (one per security), so answers are kept: about 10 µs each to compute.
 */
export function studentTQuantile(p: number, df: number): number {
  if (!(p > 0 && p < 1 && df > 0)) return Number.NaN;
  const key = `${p}:${df}`;
  let q = quantiles.get(key);
  if (q === undefined) {
    if (quantiles.size >= 10_000) quantiles.clear();
    q = tQuantile(p, df);
    quantiles.set(key, q);
  }
  return q;
}

const quantiles = new Map<string, number>();
