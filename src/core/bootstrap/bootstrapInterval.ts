/**
 * Bootstrap confidence intervals from replicates θ*_1 … θ*_B of an estimate θ̂
 * (Davison & Hinkley, "Bootstrap Methods and their Application", 1997, §5.2–5.3):
 *   percentile:  [q(α/2), q(1 − α/2)]                    (eq. 5.18)
 *   basic:       [2θ̂ − q(1 − α/2), 2θ̂ − q(α/2)]          (eq. 5.6)
 * with q the sample quantile of the replicates and α = 1 − level. The percentile interval is
 * right when the estimator's error is symmetric after some monotone transform; the basic interval
 * when θ̂ − θ behaves like θ* − θ̂. Both are shown so a reader can see when they differ (a skewed
 * or biased estimator); Hao et al. (2021) study the percentile interval for fitted Q-evaluation.
 * The bootstrap standard error is the standard deviation of the replicates and the bias estimate
 * mean(θ*) − θ̂ (Efron & Tibshirani, "An Introduction to the Bootstrap", 1993, eqs. 6.6 and 10.2).
 */
import { BootstrapError } from './episodeMultiplicities';

export interface BootstrapInterval {
  readonly level: number; // e.g. 0.9
  readonly estimate: number; // θ̂
  readonly standardError: number;
  readonly bias: number;
  readonly percentile: readonly [number, number];
  readonly basic: readonly [number, number];
  readonly replicates: number; // B
}

export function bootstrapInterval(estimate: number, replicates: ArrayLike<number>, level: number): BootstrapInterval {
  checkLevel(level);
  if (!Number.isFinite(estimate)) throw new BootstrapError(`estimate: expected a finite number, got ${estimate}`);
  const b = replicates.length;
  if (b < 2) throw new BootstrapError(`replicates: an interval needs at least 2 bootstrap replicates, got ${b}`);
  const sorted = Float64Array.from(replicates as ArrayLike<number>).sort();
  if (!Number.isFinite(sorted[0]) || !Number.isFinite(sorted[b - 1])) throw new BootstrapError('replicates: contain a value that is not a finite number');
  const alpha = 1 - level;
  const lo = sampleQuantile(sorted, alpha / 2), hi = sampleQuantile(sorted, 1 - alpha / 2);
  let mean = 0;
  for (let i = 0; i < b; i++) mean += sorted[i];
  mean /= b;
  let squares = 0;
  for (let i = 0; i < b; i++) squares += (sorted[i] - mean) ** 2;
  return {
    level, estimate, standardError: Math.sqrt(squares / (b - 1)), bias: mean - estimate,
    percentile: [lo, hi], basic: [2 * estimate - hi, 2 * estimate - lo], replicates: b,
  };
}

/**
 * Quantile p of sorted values x_1 ≤ … ≤ x_B by linear interpolation between order statistics:
 * h = (B − 1)p, q = x_⌊h⌋ + (h − ⌊h⌋)(x_⌊h⌋+1 − x_⌊h⌋) — definition 7 of Hyndman & Fan,
 * "Sample quantiles in statistical packages", Am. Stat. 50 (1996), the default of R and NumPy.
 */
export function sampleQuantile(sorted: ArrayLike<number>, p: number): number {
  const b = sorted.length;
  if (b < 1) throw new BootstrapError('quantile: no values');
  if (!(p >= 0 && p <= 1)) throw new BootstrapError(`quantile: probability must be from 0 to 1, got ${p}`);
  const h = (b - 1) * p, low = Math.floor(h), high = Math.min(low + 1, b - 1);
  return sorted[low] + (h - low) * (sorted[high] - sorted[low]);
}

function checkLevel(level: number): void {
  if (!(level > 0 && level < 1)) throw new BootstrapError(`level: expected a confidence level strictly between 0 and 1 (e.g. 0.9), got ${level}`);
}
