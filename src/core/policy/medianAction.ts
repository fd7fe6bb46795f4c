/**
 * The median of each action under a Gaussian policy at a state, limits included: the value a
 * cross-section of Q along one action holds the other actions at, so that every held value is one
 * the policy can take (the unlimited mean μ need not be: a valve's mean may sit below its closed end).
 *
 * Per action j with mean μ, std σ and the limits [L, U] in force at the state (actionLimitsAt):
 *   no limits:  μ (the median of a normal law);
 *   clip:       min(max(μ, L), U) — clipping is monotone, and the median of a monotone transform
 *               of a variable is the transform of its median (common practice);
 *   truncate:   the x in [L, U] with Φ((x − μ)/σ) − Φ(α) = ½·(Φ(β) − Φ(α)), α = (L − μ)/σ,
 *               β = (U − μ)/σ (the truncated normal's median; Johnson, Kotz & Balakrishnan,
 *               "Continuous Univariate Distributions", Vol. 1, 2nd ed., §10.1), found by bisection.
 *
 * Shapes: state ds; out m.
 */
import { normalIntervalProbability } from '../normalDistribution';
import { actionLimitsAt, actionStd, policyMean, type GaussianPolicy } from '../policy';

/** Bisection steps: halves [L, U] to below 2⁻⁶⁰ of its width, past double precision. */
const MEDIAN_BISECTION_STEPS = 60;

export function medianAction(policy: GaussianPolicy, state: ArrayLike<number>, out: Float64Array): void {
  const m = policy.actionDim, mean = new Float64Array(m), lo = new Float64Array(m), hi = new Float64Array(m);
  policyMean(policy, state, mean);
  const mode = actionLimitsAt(policy, state, 0, lo, hi);
  for (let j = 0; j < m; j++) {
    const mu = mean[j];
    if (mode === null) out[j] = mu;
    else if (mode === 'clip' || lo[j] === hi[j]) out[j] = Math.min(Math.max(mu, lo[j]), hi[j]);
    else out[j] = truncatedMedian(mu, actionStd(policy, j), lo[j], hi[j]);
  }
}

function truncatedMedian(mu: number, sigma: number, lo: number, hi: number): number {
  const alpha = (lo - mu) / sigma, beta = (hi - mu) / sigma, half = 0.5 * normalIntervalProbability(alpha, beta);
  if (!(half > 0)) return Math.min(Math.max(mu, lo), hi); // the band holds no mass in double precision: the nearest end
  // Bracket in z; an open side is replaced by the point where the normal's tail is negligible.
  let a = Math.max(alpha, -40), b = Math.min(beta, 40);
  for (let k = 0; k < MEDIAN_BISECTION_STEPS; k++) {
    const c = 0.5 * (a + b);
    if (normalIntervalProbability(alpha, c) < half) a = c;
    else b = c;
  }
  return mu + sigma * 0.5 * (a + b);
}
