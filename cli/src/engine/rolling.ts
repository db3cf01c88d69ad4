// Rolling OLS betas of length L (default W) with the estimation minimum, ending at the as-of period
// and every S periods before it, for the K most recent ends or `all` the data allows (a window must
// start at grid index 1 or later: index 0 holds no return).
//
// Speed: one sweep with running sums, O(1) per period and no allocation per point. Accuracy: the sums
// are of values shifted by a pivot near the data's means (so Σx and Σy stay small and the centred
// sums Sxx = Σx² − (Σx)²/n cancel little), each kept with Neumaier's compensated summation (1974,
// ZAMM 54), and rebuilt from scratch once at least 2L updates have accumulated (amortised O(1)).
// The window ending at the as-of period with L = W matches the full OLS estimate to about 1e-14.

import type { IndexRange } from './types.js';

export interface RollingSettings {
  readonly length: number; // L, in return periods
  readonly step: number; // S, periods between consecutive ends
  readonly count: number | 'all'; // K most recent ends
  readonly minimum: number; // fewer pairwise observations: NaN estimates for that end
}

/** One row per window end, ascending by end. NaN estimates where n < minimum or x is flat. */
export interface RollingBetas {
  readonly ends: Int32Array; // grid index of each window's last period
  readonly n: Int32Array;
  readonly alpha: Float64Array;
  readonly beta: Float64Array;
  readonly betaSe: Float64Array;
  readonly rSquared: Float64Array;
}

const FIRST_RETURN_INDEX = 1;

function checkSettings(settings: RollingSettings): void {
  const { length, step, count } = settings;
  if (!Number.isInteger(length) || length < 3) throw new RangeError(`rolling length must be a whole number ≥ 3, got ${length}`);
  if (!Number.isInteger(step) || step < 1) throw new RangeError(`rolling step must be a whole number ≥ 1, got ${step}`);
  if (count !== 'all' && (!Number.isInteger(count) || count < 0)) throw new RangeError(`rolling count must be a whole number or "all", got ${count}`);
}

/** Window ends asOf, asOf − S, … (at most K of them, each window starting at index 1 or later), ascending. */
export function rollingEnds(asOf: number, settings: RollingSettings): Int32Array {
  checkSettings(settings);
  const earliest = FIRST_RETURN_INDEX + settings.length - 1;
  const available = asOf >= earliest ? Math.floor((asOf - earliest) / settings.step) + 1 : 0;
  const count = settings.count === 'all' ? available : Math.min(settings.count, available);
  const ends = new Int32Array(count);
  for (let j = 0; j < count; j += 1) ends[count - 1 - j] = asOf - j * settings.step;
  return ends;
}

/** Running state: n, then (sum, compensation) pairs for Σx, Σy, Σx², Σy², Σxy of pivot-shifted values. */
const SUMS = 5;

function compensatedAdd(state: Float64Array, slot: number, value: number): void {
  const sum = state[1 + 2 * slot];
  const total = sum + value;
  state[2 + 2 * slot] += Math.abs(sum) >= Math.abs(value) ? sum - total + value : value - total + sum;
  state[1 + 2 * slot] = total;
}

function update(state: Float64Array, dx: number, dy: number, sign: 1 | -1): void {
  state[0] += sign;
  compensatedAdd(state, 0, sign * dx);
  compensatedAdd(state, 1, sign * dy);
  compensatedAdd(state, 2, sign * dx * dx);
  compensatedAdd(state, 3, sign * dy * dy);
  compensatedAdd(state, 4, sign * dx * dy);
}

function rebuild(state: Float64Array, y: Float64Array, x: Float64Array, range: IndexRange, pivot: readonly [number, number]): void {
  state.fill(0);
  for (let t = range.start; t <= range.end; t += 1) {
    if (Number.isFinite(x[t]) && Number.isFinite(y[t])) update(state, x[t] - pivot[0], y[t] - pivot[1], 1);
  }
}

/** Means of the pairwise-complete values in the range (the pivot; its precision does not matter). */
function pivotOf(y: Float64Array, x: Float64Array, range: IndexRange): [number, number] {
  let n = 0, sx = 0, sy = 0;
  for (let t = range.start; t <= range.end; t += 1) {
    if (Number.isFinite(x[t]) && Number.isFinite(y[t])) { n += 1; sx += x[t]; sy += y[t]; }
  }
  return n > 0 ? [sx / n, sy / n] : [0, 0];
}

function emit(out: RollingBetas, j: number, state: Float64Array, pivot: readonly [number, number], minimum: number): void {
  const n = state[0];
  const sx = state[1] + state[2], sy = state[3] + state[4];
  const sxx = state[5] + state[6], syy = state[7] + state[8], sxy = state[9] + state[10];
  const cxx = sxx - (sx * sx) / n, cyy = syy - (sy * sy) / n, cxy = sxy - (sx * sy) / n;
  out.n[j] = n;
  if (n < minimum || n < 3 || !(cxx > 64 * Number.EPSILON * sxx)) return;
  const beta = cxy / cxx;
  const ssr = Math.max(0, cyy - beta * cxy);
  out.beta[j] = beta;
  out.alpha[j] = pivot[1] + sy / n - beta * (pivot[0] + sx / n);
  out.betaSe[j] = Math.sqrt(ssr / (n - 2) / cxx);
  out.rSquared[j] = cyy > 0 ? 1 - ssr / cyy : NaN;
}

function emptyRolling(ends: Int32Array): RollingBetas {
  const k = ends.length, nan = () => new Float64Array(k).fill(NaN);
  return { ends, n: new Int32Array(k), alpha: nan(), beta: nan(), betaSe: nan(), rSquared: nan() };
}

/** Rolling OLS of y on x (pairwise-complete) over windows ending at the rolling ends up to asOf. */
export function rollingBetas(y: Float64Array, x: Float64Array, asOf: number, settings: RollingSettings): RollingBetas {
  if (y.length !== x.length || asOf < 0 || asOf >= y.length) throw new RangeError(`as-of index ${asOf} is outside 0..${y.length - 1}, or y and x differ in length`);
  const out = emptyRolling(rollingEnds(asOf, settings));
  if (out.ends.length === 0) return out;
  const L = settings.length, first = out.ends[0] - L + 1;
  const pivot = pivotOf(y, x, { start: first, end: asOf });
  const state = new Float64Array(1 + 2 * SUMS);
  let next = 0, updates = 0;
  for (let t = first; t <= asOf; t += 1) {
    if (Number.isFinite(x[t]) && Number.isFinite(y[t])) { update(state, x[t] - pivot[0], y[t] - pivot[1], 1); updates += 1; }
    const leaving = t - L;
    if (leaving >= first && Number.isFinite(x[leaving]) && Number.isFinite(y[leaving])) {
      update(state, x[leaving] - pivot[0], y[leaving] - pivot[1], -1);
      updates += 1;
    }
    if (t !== out.ends[next]) continue;
    if (updates >= 2 * L) { rebuild(state, y, x, { start: t - L + 1, end: t }, pivot); updates = 0; }
    emit(out, next, state, pivot, settings.minimum);
    next += 1;
  }
  return out;
}

/** max − min of the finite rolling betas (NaN when there are none). */
export function rollingBetaRange(rolling: RollingBetas): number {
  let low = Number.POSITIVE_INFINITY, high = Number.NEGATIVE_INFINITY;
  for (const beta of rolling.beta) {
    if (!Number.isFinite(beta)) continue;
    low = Math.min(low, beta);
    high = Math.max(high, beta);
  }
  return high >= low ? high - low : NaN;
}
