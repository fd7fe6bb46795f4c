/**
 * A straight line through K points by weighted least squares, read at a further point with its
 * standard error and an interval: the forecast of a value that drifts steadily (runBlockValues.ts).
 *
 * With weights w_k = 1/v_k (v_k each point's sampling variance), X = [1, x_k] (K×2), W = diag(w):
 *   β = (XᵀWX)⁻¹ XᵀWy,   r_k = y_k − x_kᵀβ,   s² = Σ w_k r_k² / (K − 2),
 *   SE(x*) = √(c · x*ᵀ(XᵀWX)⁻¹x*),   interval ŷ(x*) ± t_{(1+level)/2, K−2} · SE(x*)
 * (Draper & Smith, "Applied Regression Analysis", 3rd ed., ch. 9, weighted least squares, and §3.2 for the
 * fitted value's variance; from memory). c is the scale: s² estimates how far the points scatter about the
 * line relative to their variances, so a trend that is not quite a line widens the interval. Our choice
 * (the rule in /work/notes/drift40-rule.md): c = max(1, s²) — scatter smaller than the points' own
 * sampling variance says is chance, and the interval never claims more than the points hold (an upward-only
 * scale, as a Birge ratio is used when combining measurements; common practice). The t quantile on K − 2
 * degrees of freedom follows the estimated scale.
 *
 * 2×2 algebra in closed form, centred on the weighted mean of x so the normal equations stay well
 * conditioned at any position scale: with x̄ = Σwx/Σw, Sxx = Σw(x − x̄)²,
 *   slope = Σw(x − x̄)y / Sxx, ŷ(x*) = ȳ + slope·(x* − x̄), Var = c·(1/Σw + (x* − x̄)²/Sxx).
 */
import { studentQuantile } from '../studentDistribution';

export interface WeightedLineForecast {
  /** ŷ at the point read. */
  readonly value: number;
  readonly standardError: number;
  readonly interval: readonly [number, number];
  readonly intercept: number;
  readonly slope: number;
  /** s² = Σ w r² / (K − 2), before the floor of 1. */
  readonly residualScale: number;
  /** K − 2. */
  readonly degrees: number;
}

export class ForecastError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ForecastError';
  }
}

/** x, y, variances: K each (K ≥ 3, every variance > 0, at least two distinct x). */
export function weightedLineForecast(
  x: ArrayLike<number>, y: ArrayLike<number>, variances: ArrayLike<number>, at: number, level: number,
): WeightedLineForecast {
  const k = x.length;
  if (y.length !== k || variances.length !== k) throw new ForecastError(`weightedLineForecast: ${k} positions, ${y.length} values, ${variances.length} variances`);
  if (k < 3) throw new ForecastError(`weightedLineForecast: a line with an estimated scale needs at least 3 points, got ${k}`);
  let sw = 0, swx = 0, swy = 0;
  for (let i = 0; i < k; i++) {
    if (!(variances[i] > 0) || !Number.isFinite(variances[i])) throw new ForecastError(`weightedLineForecast: variance ${i} is ${variances[i]}, expected a positive number`);
    const w = 1 / variances[i];
    sw += w;
    swx += w * x[i];
    swy += w * y[i];
  }
  const xBar = swx / sw, yBar = swy / sw;
  let sxx = 0, sxy = 0;
  for (let i = 0; i < k; i++) {
    const w = 1 / variances[i], dx = x[i] - xBar;
    sxx += w * dx * dx;
    sxy += w * dx * (y[i] - yBar);
  }
  if (!(sxx > 0)) throw new ForecastError('weightedLineForecast: every point at the same position; no line');
  const slope = sxy / sxx, intercept = yBar - slope * xBar;
  let rss = 0;
  for (let i = 0; i < k; i++) rss += (y[i] - intercept - slope * x[i]) ** 2 / variances[i];
  const degrees = k - 2, residualScale = rss / degrees, scale = Math.max(1, residualScale);
  const value = yBar + slope * (at - xBar), standardError = Math.sqrt(scale * (1 / sw + (at - xBar) ** 2 / sxx));
  const half = studentQuantile((1 + level) / 2, degrees) * standardError;
  return { value, standardError, interval: [value - half, value + half], intercept, slope, residualScale, degrees };
}
