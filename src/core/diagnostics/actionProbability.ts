/**
 * P_π(lo ≤ a_j ≤ hi | s): the probability a Gaussian policy gives an interval of one action,
 * with its actuator limits. With clip limits L < U the law is the Gaussian censored at L and U
 * (point masses Φ((L−μ)/σ) and 1 − Φ((U−μ)/σ)); with truncation it is the Gaussian restricted to
 * [L, U] and renormalised (Johnson, Kotz & Balakrishnan, "Continuous Univariate Distributions",
 * Vol. 1, 2nd ed., §10.1 for both). μ is the mean before limits, σ = actionStd.
 */
import { normalCdf, normalIntervalProbability } from '../normalDistribution';
import { actionStd, type GaussianPolicy } from '../policy';

export function actionIntervalProbability(policy: GaussianPolicy, j: number, mean: number, lo: number, hi: number): number {
  if (!(lo <= hi)) return 0;
  const sigma = actionStd(policy, j), b = policy.bounds;
  const z = (x: number) => (x - mean) / sigma;
  if (!b) return normalIntervalProbability(z(lo), z(hi));
  const limitLo = b.lo[j], limitHi = b.hi[j];
  const a = Math.max(lo, limitLo), c = Math.min(hi, limitHi);
  if (a > c) return 0;
  if (b.mode === 'truncate') return normalIntervalProbability(z(a), z(c)) / normalIntervalProbability(z(limitLo), z(limitHi));
  // Clipped: the distribution function jumps by the lower tail at L and reaches 1 at U.
  const below = a <= limitLo ? 0 : normalCdf(z(a)); // P(a_j < a)
  const upTo = c >= limitHi ? 1 : normalCdf(z(c)); // P(a_j ≤ c)
  return Math.max(0, upTo - below);
}
