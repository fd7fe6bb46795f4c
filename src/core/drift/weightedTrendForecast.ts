/**
 * A straight line (or a low-degree polynomial) in position through K points by weighted least squares, read
 * at a further point with its standard error and an interval: the forecast of a value that drifts
 * (driftForecast.ts).
 *
 * With weights w_k = 1/v_k (v_k each point's sampling variance), X the K×(p+1) powers of position, W = diag(w):
 *   β = (XᵀWX)⁻¹ XᵀWy,   r_k = y_k − x_kᵀβ,   s² = Σ w_k r_k² / (K − p − 1),
 *   SE(x*) = √(c · x*ᵀ(XᵀWX)⁻¹x*),   interval ŷ(x*) ± t_{(1+level)/2, K−p−1} · SE(x*)
 * (Draper & Smith, "Applied Regression Analysis", 3rd ed., ch. 9, weighted least squares, and §3.2 for the
 * fitted value's variance; from memory). c is the scale: s² estimates how far the points scatter about the
 * fit relative to their variances, so a trend of another shape widens the interval. Our choice (the rule in
 * /work/notes/drift40-rule.md): c = max(1, s²) — scatter smaller than the points' own sampling variance says
 * is chance, and the interval never claims more than the points hold (an upward-only scale, as a Birge ratio
 * is used when combining measurements; common practice). The t quantile on K − p − 1 degrees of freedom
 * follows the estimated scale.
 *
 * Positions are centred on their weighted mean and divided by their weighted spread before the powers are
 * formed, so the normal equations stay well conditioned at any position scale (the fitted values and their
 * errors do not depend on that change of variable; the coefficients returned are in the original positions
 * for the line only). Solved by Cholesky of the (p+1)×(p+1) normal matrix.
 */
import { cholesky, choleskySolve } from '../linalg/dense';
import { studentQuantile } from '../studentDistribution';

export interface WeightedTrendForecast {
  /** ŷ at the point read. */
  readonly value: number;
  readonly standardError: number;
  readonly interval: readonly [number, number];
  /** The line's intercept and slope in the original positions (degree 1; NaN for another degree). */
  readonly intercept: number;
  readonly slope: number;
  /** s² = Σ w r² / (K − p − 1), before the floor of 1. */
  readonly residualScale: number;
  /** K − p − 1. */
  readonly degrees: number;
}

export class ForecastError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ForecastError';
  }
}

function checkPoints(x: ArrayLike<number>, y: ArrayLike<number>, variances: ArrayLike<number>, degree: number): void {
  const k = x.length;
  if (y.length !== k || variances.length !== k) throw new ForecastError(`weightedTrendForecast: ${k} positions, ${y.length} values, ${variances.length} variances`);
  if (k < degree + 2) throw new ForecastError(`weightedTrendForecast: a degree-${degree} trend with an estimated scale needs at least ${degree + 2} points, got ${k}`);
  for (let i = 0; i < k; i++) {
    if (!(variances[i] > 0) || !Number.isFinite(variances[i])) throw new ForecastError(`weightedTrendForecast: variance ${i} is ${variances[i]}, expected a positive number`);
  }
  if (new Set(Array.from(x)).size <= degree) throw new ForecastError(`weightedTrendForecast: ${degree + 1} distinct positions are needed for a degree-${degree} trend; every point at the same position gives no line`);
}

/** x, y, variances: K each (K ≥ degree + 2, every variance > 0, more than `degree` distinct positions). */
export function weightedTrendForecast(
  x: ArrayLike<number>, y: ArrayLike<number>, variances: ArrayLike<number>, at: number, level: number, degree = 1,
): WeightedTrendForecast {
  checkPoints(x, y, variances, degree);
  const k = x.length, q = degree + 1, w = Float64Array.from(variances, (v) => 1 / v);
  const sw = w.reduce((a, b) => a + b, 0), centre = w.reduce((a, wi, i) => a + wi * x[i], 0) / sw;
  const spread = Math.sqrt(w.reduce((a, wi, i) => a + wi * (x[i] - centre) ** 2, 0) / sw);
  const powers = (t: number) => Float64Array.from({ length: q }, (_, j) => ((t - centre) / spread) ** j);
  const normal = new Float64Array(q * q), rhs = new Float64Array(q), rows = Array.from(x, powers);
  rows.forEach((row, i) => {
    for (let a = 0; a < q; a++) {
      rhs[a] += w[i] * row[a] * y[i];
      for (let b = 0; b < q; b++) normal[a * q + b] += w[i] * row[a] * row[b];
    }
  });
  const factor = cholesky(normal, q), beta = choleskySolve(factor, q, rhs);
  const fitted = (row: Float64Array) => row.reduce((a, r, j) => a + r * beta[j], 0);
  const rss = rows.reduce((a, row, i) => a + w[i] * (y[i] - fitted(row)) ** 2, 0);
  const degrees = k - q, residualScale = rss / degrees, star = powers(at), solved = choleskySolve(factor, q, star);
  const value = fitted(star), standardError = Math.sqrt(Math.max(1, residualScale) * star.reduce((a, s, j) => a + s * solved[j], 0));
  const half = studentQuantile((1 + level) / 2, degrees) * standardError;
  const slope = degree === 1 ? beta[1] / spread : NaN, intercept = degree === 1 ? beta[0] - slope * centre : NaN;
  return { value, standardError, interval: [value - half, value + half], intercept, slope, residualScale, degrees };
}
