// OLS with an intercept on k regressors: y = b0 + b1 x1 + … + bk xk + e.
//
// Numerically sound route (Golub & Van Loan, Matrix Computations, §5.2 and §5.3): centre y and
// every regressor (corrected two-pass means), factor the centred n×k matrix by Householder QR,
// solve R b = Qᵀ y. The intercept is ȳ − x̄ᵀ b. Cov(b) = s² R⁻¹ R⁻ᵀ with s² = SSR/(n − k − 1);
// by block inversion of XᵀX, Var(b0) = s²/n + x̄ᵀ Cov(b) x̄ and Cov(b0, b) = −Cov(b) x̄.
// SSR comes from the residuals themselves.

/** Result of a multiple regression. Arrays are ordered [intercept, b1, …, bk]. */
export interface MultipleFit {
  readonly n: number;
  readonly regressors: number; // k, the intercept excluded
  readonly coefficients: Float64Array;
  readonly covariance: Float64Array; // (k + 1) × (k + 1), row-major
  readonly ssr: number;
  readonly residualDf: number; // n − k − 1
  readonly residualSd: number; // √(SSR / residualDf)
  readonly rSquared: number;
  readonly adjRSquared: number;
  readonly rankDeficient: boolean; // a regressor is constant or a combination of the others
}

/** |R_jj| below this share of the centred column's norm counts as collinear. */
const COLLINEARITY_RATIO = 1e-12;

/** Writes v − mean(v) into target at offset (corrected two-pass) and returns the mean. */
function centreInto(v: Float64Array, target: Float64Array, offset: number): number {
  const n = v.length;
  let sum = 0;
  for (let i = 0; i < n; i += 1) sum += v[i];
  const rough = sum / n;
  let correction = 0;
  for (let i = 0; i < n; i += 1) correction += v[i] - rough;
  const mean = rough + correction / n;
  for (let i = 0; i < n; i += 1) target[offset + i] = v[i] - mean;
  return mean;
}

function sumOfSquares(a: Float64Array, from: number, to: number): number {
  let sum = 0;
  for (let i = from; i < to; i += 1) sum += a[i] * a[i];
  return sum;
}

/** Applies the reflector stored in a[col*n + j …] to the vector starting at target[offset]. */
function reflect(a: Float64Array, n: number, j: number, vTv: number, target: Float64Array, offset: number): void {
  const v = j * n;
  let dot = 0;
  for (let i = j; i < n; i += 1) dot += a[v + i] * target[offset + i];
  const scale = (2 * dot) / vTv;
  for (let i = j; i < n; i += 1) target[offset + i] -= scale * a[v + i];
}

/**
 * In-place Householder QR of the column-major n×k matrix `a`, applying Qᵀ to `rhs` as well.
 * Returns R's diagonal (R's upper part stays in `a`), or null when a column is collinear.
 */
function householderQr(a: Float64Array, n: number, k: number, rhs: Float64Array): Float64Array | null {
  const diagonal = new Float64Array(k);
  for (let j = 0; j < k; j += 1) {
    const col = j * n;
    const originalNorm = Math.sqrt(sumOfSquares(a, col, col + n));
    const norm = Math.sqrt(sumOfSquares(a, col + j, col + n));
    if (!(norm > COLLINEARITY_RATIO * originalNorm)) return null;
    const rjj = a[col + j] > 0 ? -norm : norm;
    a[col + j] -= rjj;
    const vTv = sumOfSquares(a, col + j, col + n);
    for (let c = j + 1; c < k; c += 1) reflect(a, n, j, vTv, a, c * n);
    reflect(a, n, j, vTv, rhs, 0);
    diagonal[j] = rjj;
  }
  return diagonal;
}

/** R entry (row i, column j ≥ i) from the packed QR. */
function rEntry(a: Float64Array, n: number, diagonal: Float64Array, i: number, j: number): number {
  return i === j ? diagonal[i] : a[j * n + i];
}

function solveUpper(a: Float64Array, n: number, k: number, diagonal: Float64Array, rhs: Float64Array): Float64Array {
  const b = new Float64Array(k);
  for (let i = k - 1; i >= 0; i -= 1) {
    let sum = rhs[i];
    for (let j = i + 1; j < k; j += 1) sum -= rEntry(a, n, diagonal, i, j) * b[j];
    b[i] = sum / diagonal[i];
  }
  return b;
}

/** (RᵀR)⁻¹ = R⁻¹R⁻ᵀ as a k×k row-major matrix. */
function inverseGram(a: Float64Array, n: number, k: number, diagonal: Float64Array): Float64Array {
  const rInv = new Float64Array(k * k); // row-major upper triangle
  for (let j = 0; j < k; j += 1) {
    rInv[j * k + j] = 1 / diagonal[j];
    for (let i = j - 1; i >= 0; i -= 1) {
      let sum = 0;
      for (let m = i + 1; m <= j; m += 1) sum += rEntry(a, n, diagonal, i, m) * rInv[m * k + j];
      rInv[i * k + j] = -sum / diagonal[i];
    }
  }
  const gram = new Float64Array(k * k);
  for (let i = 0; i < k; i += 1) {
    for (let j = i; j < k; j += 1) {
      let sum = 0;
      for (let m = j; m < k; m += 1) sum += rInv[i * k + m] * rInv[j * k + m];
      gram[i * k + j] = sum;
      gram[j * k + i] = sum;
    }
  }
  return gram;
}

function rankDeficientFit(n: number, k: number): MultipleFit {
  return {
    n, regressors: k, coefficients: new Float64Array(k + 1).fill(NaN), covariance: new Float64Array((k + 1) ** 2).fill(NaN),
    ssr: NaN, residualDf: n - k - 1, residualSd: NaN, rSquared: NaN, adjRSquared: NaN, rankDeficient: true,
  };
}

/** Full covariance of [b0, b1…bk] from s², the slopes' (XcᵀXc)⁻¹ and the regressor means. */
function coefficientCovariance(gram: Float64Array, means: Float64Array, variance: number, n: number): Float64Array {
  const k = means.length, size = k + 1;
  const cov = new Float64Array(size * size);
  let interceptVariance = 1 / n;
  for (let i = 0; i < k; i += 1) {
    let gramMean = 0;
    for (let j = 0; j < k; j += 1) gramMean += gram[i * k + j] * means[j];
    interceptVariance += means[i] * gramMean;
    cov[i + 1] = -variance * gramMean;
    cov[(i + 1) * size] = -variance * gramMean;
    for (let j = 0; j < k; j += 1) cov[(i + 1) * size + j + 1] = variance * gram[i * k + j];
  }
  cov[0] = variance * interceptVariance;
  return cov;
}

/** Index of the first value that is not a finite number, or -1. */
function firstNonFinite(v: Float64Array): number {
  for (let i = 0; i < v.length; i += 1) if (!Number.isFinite(v[i])) return i;
  return -1;
}

function checkInputs(y: Float64Array, columns: readonly Float64Array[]): void {
  if (y.length <= columns.length) throw new RangeError(`${y.length} observations cannot fit ${columns.length} regressors and an intercept`);
  const badY = firstNonFinite(y);
  if (badY >= 0) throw new RangeError(`y[${badY}] is not a finite number`);
  columns.forEach((column, j) => {
    if (column.length !== y.length) throw new RangeError(`regressor ${j + 1} has ${column.length} values, y has ${y.length}`);
    const bad = firstNonFinite(column);
    if (bad >= 0) throw new RangeError(`regressor ${j + 1} value ${bad} is not a finite number`);
  });
}

/** OLS of y on the given regressor columns with an intercept; every value must be finite. */
export function fitMultiple(y: Float64Array, columns: readonly Float64Array[]): MultipleFit {
  checkInputs(y, columns);
  const n = y.length, k = columns.length;
  const centred = new Float64Array(n * k);
  const means = Float64Array.from(columns, (column, j) => centreInto(column, centred, j * n));
  const work = centred.slice();
  const yCentred = new Float64Array(n);
  const meanY = centreInto(y, yCentred, 0);
  const qty = yCentred.slice();
  const diagonal = householderQr(work, n, k, qty);
  if (diagonal === null) return rankDeficientFit(n, k);
  const slopes = solveUpper(work, n, k, diagonal, qty);
  let ssr = 0;
  for (let i = 0; i < n; i += 1) {
    let e = yCentred[i];
    for (let j = 0; j < k; j += 1) e -= centred[j * n + i] * slopes[j];
    ssr += e * e;
  }
  const residualDf = n - k - 1;
  const variance = ssr / residualDf;
  const coefficients = new Float64Array(k + 1);
  coefficients.set(slopes, 1);
  coefficients[0] = meanY - means.reduce((sum, mean, j) => sum + mean * slopes[j], 0);
  const rSquared = 1 - ssr / sumOfSquares(yCentred, 0, n);
  return {
    n, regressors: k, coefficients, covariance: coefficientCovariance(inverseGram(work, n, k, diagonal), means, variance, n),
    ssr, residualDf, residualSd: Math.sqrt(variance), rSquared, adjRSquared: 1 - ((n - 1) / residualDf) * (1 - rSquared),
    rankDeficient: false,
  };
}
