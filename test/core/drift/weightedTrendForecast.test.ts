/**
 * The weighted straight line read at a further point (weightedTrendForecast.ts) against outside computations:
 * NumPy 2 (np.linalg.solve of the normal equations XᵀWX β = XᵀWy, s² = rᵀWr/(K − 2), the fitted value's
 * variance x*ᵀ(XᵀWX)⁻¹x* scaled by max(1, s²)) with scipy.stats.t.ppf(0.95, 3), computed 2026-12-05 for this
 * test; a quadratic trend likewise (NumPy, t_{0.95, 7}); the same algebra through ml-matrix (an independent general-purpose library) on random data; and a
 * noiseless line recovered exactly (a closed form: least squares reproduces data lying on a line).
 */
import { describe, expect, it } from 'vitest';
import { Matrix, inverse } from 'ml-matrix';
import { ForecastError, weightedTrendForecast } from '../../../src/core/drift/weightedTrendForecast';
import { createRandom } from '../../../src/core/random';
import { studentQuantile } from '../../../src/core/studentDistribution';

const x = [24.5, 74.5, 124.5, 174.5, 224.5], v = [0.04, 0.05, 0.03, 0.06, 0.05];

describe('weightedTrendForecast', () => {
  it('matches NumPy where the scatter is above the points\' variances (s² = 5.60 scales the error)', () => {
    const f = weightedTrendForecast(x, [-10.2, -11.4, -11.2, -12.9, -12.8], v, 249, 0.9);
    expect(f.intercept).toBeCloseTo(-9.96506378, 7);
    expect(f.slope).toBeCloseTo(-0.01328498, 8);
    expect(f.residualScale).toBeCloseTo(5.5988472191032415, 10);
    expect(f.value).toBeCloseTo(-13.273022905906135, 10);
    expect(f.standardError).toBeCloseTo(0.47479476701886936, 10);
    expect(f.interval[0]).toBeCloseTo(-14.390387549643593, 9);
    expect(f.interval[1]).toBeCloseTo(-12.155658262168677, 9);
    expect(f.degrees).toBe(3);
  });

  it('matches NumPy where the scatter is below them (s² = 0.56: the floor of 1 holds the error)', () => {
    const f = weightedTrendForecast(x, [-10.2, -10.9, -11.5, -12.6, -13.0], v, 249, 0.9);
    expect(f.residualScale).toBeCloseTo(0.5612695561045011, 10);
    expect(f.value).toBeCloseTo(-13.420402874466646, 10);
    expect(f.standardError).toBeCloseTo(0.20065806290291371, 10);
    expect(f.interval[0]).toBeCloseTo(-13.892624222600528, 9);
    expect(f.interval[1]).toBeCloseTo(-12.948181526332764, 9);
  });

  it('agrees with ml-matrix\'s (XᵀWX)⁻¹ on random data at random points', () => {
    const rng = createRandom(4);
    for (let trial = 0; trial < 20; trial++) {
      const k = 3 + rng.integer(6), xs = Array.from({ length: k }, () => 100 * rng.uniform()), ys = xs.map((t) => 2 - 0.03 * t + rng.normal());
      const vs = xs.map(() => 0.2 + rng.uniform()), at = 120 * rng.uniform();
      const X = new Matrix(xs.map((t) => [1, t])), W = Matrix.diag(vs.map((s) => 1 / s)), A = inverse(X.transpose().mmul(W).mmul(X));
      const beta = A.mmul(X.transpose()).mmul(W).mmul(Matrix.columnVector(ys)), r = Matrix.columnVector(ys).sub(X.mmul(beta));
      const s2 = r.transpose().mmul(W).mmul(r).get(0, 0) / (k - 2), x0 = Matrix.rowVector([1, at]);
      const se = Math.sqrt(Math.max(1, s2) * x0.mmul(A).mmul(x0.transpose()).get(0, 0)), value = x0.mmul(beta).get(0, 0);
      const f = weightedTrendForecast(xs, ys, vs, at, 0.9);
      expect(f.value).toBeCloseTo(value, 8);
      expect(f.standardError).toBeCloseTo(se, 8);
      expect(f.interval[1] - f.value).toBeCloseTo(studentQuantile(0.95, k - 2) * se, 8);
    }
  });

  it('matches NumPy for a quadratic trend read at the last run (K = 10, t on 7 degrees of freedom)', () => {
    const xs = Array.from({ length: 10 }, (_, i) => 25 * i + 12);
    const ys = [-2.77768, -2.86218, -2.89168, -2.94618, -3.1456799999999996, -3.21018, -3.38968, -3.60418, -3.77368, -3.99818];
    const vs = [0.01, 0.012, 0.009, 0.011, 0.015, 0.01, 0.02, 0.013, 0.012, 0.01];
    const f = weightedTrendForecast(xs, ys, vs, 249, 0.9, 2);
    expect(f.degrees).toBe(7);
    expect(f.residualScale).toBeCloseTo(0.074832207783304, 10);
    expect(f.value).toBeCloseTo(-4.1229189355521445, 10);
    expect(f.standardError).toBeCloseTo(0.09874932464484608, 10);
    expect(f.interval[0]).toBeCloseTo(-4.310007293291357, 9);
    expect(f.interval[1]).toBeCloseTo(-3.935830577812932, 9);
  });

  it('recovers a noiseless quadratic exactly', () => {
    const xs = [0, 2, 3, 7, 8, 11], f = weightedTrendForecast(xs, xs.map((t) => 1 + 0.5 * t - 0.2 * t * t), [1, 2, 1, 3, 1, 2], 14, 0.9, 2);
    expect(f.value).toBeCloseTo(1 + 0.5 * 14 - 0.2 * 196, 10);
  });

  it('recovers a noiseless line exactly, at the point read and beyond', () => {
    const xs = [0.5, 3, 4.25, 9, 10], ys = xs.map((t) => 7 - 0.4 * t);
    const f = weightedTrendForecast(xs, ys, [1, 2, 0.5, 3, 1], 12, 0.9);
    expect(f.slope).toBeCloseTo(-0.4, 13);
    expect(f.intercept).toBeCloseTo(7, 12);
    expect(f.value).toBeCloseTo(7 - 0.4 * 12, 12);
    expect(f.residualScale).toBeLessThan(1e-20);
  });

  it('refuses too few points, a variance that is not positive, and every point at one position', () => {
    expect(() => weightedTrendForecast([1, 2], [1, 2], [1, 1], 3, 0.9)).toThrow(ForecastError);
    expect(() => weightedTrendForecast([1, 2, 3], [1, 2, 3], [1, 0, 1], 3, 0.9)).toThrow(/variance 1 is 0/);
    expect(() => weightedTrendForecast([2, 2, 2], [1, 2, 3], [1, 1, 1], 3, 0.9)).toThrow(/same position/);
    expect(() => weightedTrendForecast([1, 2, 3], [1, 2, 3], [1, 1, 1], 4, 0.9, 2)).toThrow(/at least 4 points/);
  });
});
