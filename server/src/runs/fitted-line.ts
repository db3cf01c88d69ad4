/** An ordinary least-squares line y = alpha + beta·x through scatter points. */
export interface FittedLine {
  n: number;
  alpha: number;
  beta: number;
}

/**
 * OLS with intercept: beta = Σ(x − x̄)(y − ȳ) / Σ(x − x̄)², alpha = ȳ − beta·x̄ (textbook least
 * squares, common practice), centred on the means for accuracy. Null with fewer than two points or
 * no spread in x.
 */
export function fitLine(x: readonly number[], y: readonly number[]): FittedLine | null {
  const n = Math.min(x.length, y.length);
  if (n < 2) return null;
  let meanX = 0;
  let meanY = 0;
  for (let i = 0; i < n; i += 1) {
    meanX += x[i] as number;
    meanY += y[i] as number;
  }
  meanX /= n;
  meanY /= n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i += 1) {
    const dx = (x[i] as number) - meanX;
    sxy += dx * ((y[i] as number) - meanY);
    sxx += dx * dx;
  }
  if (!(sxx > 0)) return null;
  const beta = sxy / sxx;
  return { n, alpha: meanY - beta * meanX, beta };
}
