// An independent, deliberately plain OLS for tests: normal equations XᵀX b = Xᵀy on plain arrays,
// solved by Gauss–Jordan elimination with partial pivoting (fine for well-conditioned synthetic data).

export interface ReferenceFit {
  readonly coefficients: number[]; // [intercept, slopes…]
  readonly inverseGram: number[][]; // (XᵀX)⁻¹ with the intercept column included
  readonly residualVariance: number; // SSR / (n − p)
}

function invert(matrix: number[][]): number[][] {
  const size = matrix.length;
  const a = matrix.map((row, i) => [...row, ...Array.from({ length: size }, (_, j) => (i === j ? 1 : 0))]);
  for (let col = 0; col < size; col += 1) {
    let pivot = col;
    for (let r = col + 1; r < size; r += 1) if (Math.abs(a[r]![col]!) > Math.abs(a[pivot]![col]!)) pivot = r;
    [a[col], a[pivot]] = [a[pivot]!, a[col]!];
    const p = a[col]![col]!;
    a[col] = a[col]!.map((v) => v / p);
    for (let r = 0; r < size; r += 1) {
      if (r === col) continue;
      const factor = a[r]![col]!;
      a[r] = a[r]!.map((v, j) => v - factor * a[col]![j]!);
    }
  }
  return a.map((row) => row.slice(size));
}

/** OLS with an intercept of y on the regressor rows (each row: that observation's regressors). */
export function referenceFit(y: readonly number[], regressorRows: readonly (readonly number[])[]): ReferenceFit {
  const rows = regressorRows.map((r) => [1, ...r]);
  const p = rows[0]!.length;
  const gram = Array.from({ length: p }, (_, i) => Array.from({ length: p }, (_, j) => rows.reduce((s, r) => s + r[i]! * r[j]!, 0)));
  const xty = Array.from({ length: p }, (_, i) => rows.reduce((s, r, t) => s + r[i]! * y[t]!, 0));
  const inverseGram = invert(gram);
  const coefficients = inverseGram.map((row) => row.reduce((s, v, j) => s + v * xty[j]!, 0));
  const ssr = rows.reduce((s, r, t) => s + (y[t]! - r.reduce((f, v, j) => f + v * coefficients[j]!, 0)) ** 2, 0);
  return { coefficients, inverseGram, residualVariance: ssr / (rows.length - p) };
}

/** Plain simple-regression slope and the Pearson correlation, for cross-checks. */
export function referenceSlope(y: readonly number[], x: readonly number[]): number {
  const n = y.length, my = y.reduce((s, v) => s + v, 0) / n, mx = x.reduce((s, v) => s + v, 0) / n;
  return y.reduce((s, v, i) => s + (v - my) * (x[i]! - mx), 0) / x.reduce((s, v) => s + (v - mx) ** 2, 0);
}

export function referenceCorrelation(a: readonly number[], b: readonly number[]): number {
  return referenceSlope(a, b) * Math.sqrt(b.reduce((s, v) => s + (v - b.reduce((t, w) => t + w, 0) / b.length) ** 2, 0)
    / a.reduce((s, v) => s + (v - a.reduce((t, w) => t + w, 0) / a.length) ** 2, 0));
}
