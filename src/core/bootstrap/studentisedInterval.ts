/**
 * The studentised (bootstrap-t) interval (Davison & Hinkley, "Bootstrap Methods and their
 * Application", 1997, §5.2.1, eq. 5.7; Efron & Tibshirani, "An Introduction to the Bootstrap",
 * 1993, §12.5): each replicate θ*_b with its own standard error v*_b^{1/2} gives
 *   z*_b = (θ*_b − θ̂) / v*_b^{1/2},
 * and with q the sample quantile of the z*,
 *   [θ̂ − v^{1/2} q(1 − α/2),  θ̂ − v^{1/2} q(α/2)],   α = 1 − level.
 * Unlike the percentile interval it corrects for a spread that changes with the estimate and for
 * skew, to second order (D&H §5.4); it needs a standard error that is cheap and stable on every
 * resample: here the nonparametric delta method from per-unit empirical influence values
 * (influenceStandardError).
 *
 * Replicates whose standard error is not a positive finite number are left out (their count is
 * returned), as D&H leave out resamples on which v* cannot be computed.
 */
import { sampleQuantile } from './bootstrapInterval';
import { BootstrapError } from './episodeMultiplicities';

export interface StudentisedInterval {
  readonly interval: readonly [number, number];
  /** Replicates used (B minus those without a usable standard error or value). */
  readonly used: number;
}

export function studentisedInterval(
  estimate: number, standardError: number, replicates: ArrayLike<number>, replicateErrors: ArrayLike<number>, level: number,
): StudentisedInterval {
  if (!(level > 0 && level < 1)) throw new BootstrapError(`level: expected a confidence level strictly between 0 and 1 (e.g. 0.9), got ${level}`);
  if (!Number.isFinite(estimate)) throw new BootstrapError(`estimate: expected a finite number, got ${estimate}`);
  if (!(standardError >= 0 && Number.isFinite(standardError))) throw new BootstrapError(`standard error: expected a finite number ≥ 0, got ${standardError}`);
  if (replicateErrors.length !== replicates.length) throw new BootstrapError(`replicate standard errors: expected one per replicate (${replicates.length}), got ${replicateErrors.length}`);
  const z: number[] = [];
  for (let b = 0; b < replicates.length; b++) {
    const se = replicateErrors[b], t = (replicates[b] - estimate) / se;
    if (se > 0 && Number.isFinite(t)) z.push(t);
  }
  if (z.length < 2) throw new BootstrapError(`replicates: a studentised interval needs at least 2 replicates with a standard error, got ${z.length}`);
  const sorted = Float64Array.from(z).sort(), alpha = 1 - level;
  const interval: [number, number] = [estimate - standardError * sampleQuantile(sorted, 1 - alpha / 2), estimate - standardError * sampleQuantile(sorted, alpha / 2)];
  return { interval, used: z.length };
}

/**
 * The nonparametric delta-method standard error from empirical influence values l_k of n units
 * drawn c_k times (D&H eq. 2.36, v_L = n⁻² Σ l_k², taken on a resample as the resample's own values):
 *   v = Σ c_k (l_k − l̄)² / (Σ c_k)²,   l̄ = Σ c_k l_k / Σ c_k;
 * without multiplicities every unit once. For a sample mean, l_k = x_k − x̄ and v = (n − 1)s²/n²
 * (D&H §2.7.2): the plug-in variance of the mean.
 */
export function influenceStandardError(influence: ArrayLike<number>, multiplicities?: ArrayLike<number>): number {
  const n = influence.length;
  if (multiplicities && multiplicities.length !== n) throw new BootstrapError(`multiplicities: expected one per unit (${n}), got ${multiplicities.length}`);
  let weight = 0, total = 0;
  for (let k = 0; k < n; k++) {
    const c = multiplicities ? multiplicities[k] : 1;
    weight += c;
    total += c * influence[k];
  }
  if (!(weight > 0)) throw new BootstrapError('influence standard error: no units drawn');
  const mean = total / weight;
  let squares = 0;
  for (let k = 0; k < n; k++) squares += (multiplicities ? multiplicities[k] : 1) * (influence[k] - mean) ** 2;
  return Math.sqrt(squares) / weight;
}
