import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { studentTQuantile, studentTTwoSidedP, studentTUpperTail } from './student-t.js';

const relative = (got: number, expected: number) => Math.abs(got / expected - 1);

describe('studentTTwoSidedP', () => {
  // Closed forms (Abramowitz & Stegun 26.7.3 and 26.7.4, [arithmetic]):
  // ν = 1 (Cauchy): P(|T| > t) = 1 − (2/π) atan t;  ν = 2: 1 − t/√(2 + t²);
  // ν = 3: 1 − (2/π)(θ + sinθ cosθ) with θ = atan(t/√3).
  const cauchy = (t: number) => 1 - (2 / Math.PI) * Math.atan(t);
  const two = (t: number) => 1 - t / Math.sqrt(2 + t * t);
  const three = (t: number) => { const th = Math.atan(t / Math.sqrt(3)); return 1 - (2 / Math.PI) * (th + Math.sin(th) * Math.cos(th)); };

  it.each([0.1, 0.7, 1.5, 3, 6.3])('matches the closed forms for 1, 2 and 3 degrees of freedom at t = %f', (t) => {
    expect(relative(studentTTwoSidedP(t, 1), cauchy(t))).toBeLessThan(1e-13);
    expect(relative(studentTTwoSidedP(t, 2), two(t))).toBeLessThan(1e-13);
    expect(relative(studentTTwoSidedP(-t, 3), three(t))).toBeLessThan(1e-12);
  });

  it('keeps its relative precision far in the tail (ν = 2 closed form rewritten without cancellation)', () => {
    // 1 − t/√(2+t²) = 2 / (√(2+t²) (√(2+t²) + t)) [arithmetic].
    const t = 1e5, s = Math.sqrt(2 + t * t);
    expect(relative(studentTTwoSidedP(t, 2), 2 / (s * (s + t)))).toBeLessThan(1e-12);
  });

  it('gives p = 0.05 at the tabulated 5% two-sided critical values (t tables [memory]: 2.228 at 10 df, 2.042 at 30 df)', () => {
    expect(studentTTwoSidedP(2.228, 10)).toBeCloseTo(0.05, 4);
    expect(studentTTwoSidedP(2.042, 30)).toBeCloseTo(0.05, 4);
  });

  it('agrees with jStat, an independent implementation accurate to about 1e-7', () => {
    for (const [t, df] of [[1.2, 34], [2.5, 58], [4.1, 250], [0.3, 7]] as const) {
      expect(relative(studentTTwoSidedP(t, df), 2 * jStat.studentt.cdf(-t, df))).toBeLessThan(1e-6);
    }
  });

  it('is 1 at t = 0, 0 at infinity and NaN without degrees of freedom', () => {
    expect(studentTTwoSidedP(0, 12)).toBe(1);
    expect(studentTTwoSidedP(Number.POSITIVE_INFINITY, 12)).toBe(0);
    expect(studentTTwoSidedP(1, 0)).toBeNaN();
  });
});

describe('studentTQuantile', () => {
  it('inverts the closed forms for 1 and 2 degrees of freedom (tan(π(p − ½)) and (2p − 1)√(2/(4p(1 − p))))', () => {
    for (const p of [0.6, 0.9, 0.975, 0.995]) {
      expect(relative(studentTQuantile(p, 1), Math.tan(Math.PI * (p - 0.5)))).toBeLessThan(1e-12);
      expect(relative(studentTQuantile(p, 2), (2 * p - 1) * Math.sqrt(2 / (4 * p * (1 - p))))).toBeLessThan(1e-12);
    }
  });

  it('matches t tables to their printed three decimals (t tables [memory]: 2.228, 2.042, 1.984, 2.845)', () => {
    expect(studentTQuantile(0.975, 10)).toBeCloseTo(2.228, 3);
    expect(studentTQuantile(0.975, 30)).toBeCloseTo(2.042, 3);
    expect(studentTQuantile(0.975, 100)).toBeCloseTo(1.984, 3);
    expect(studentTQuantile(0.995, 20)).toBeCloseTo(2.845, 3);
  });

  it('is the exact inverse of the tail probability and symmetric about zero', () => {
    for (const df of [4, 34, 58, 250]) {
      const q = studentTQuantile(0.975, df);
      expect(relative(studentTUpperTail(q, df), 0.025)).toBeLessThan(1e-13);
      expect(relative(-studentTQuantile(0.025, df), q)).toBeLessThan(1e-14); // 1 − 0.975 is not exactly 0.025 in doubles
    }
  });
});
