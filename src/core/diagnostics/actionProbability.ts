/**
 * P_π(lo ≤ a_j ≤ hi | s): the probability a Gaussian policy gives an interval of one action,
 * with its actuator limits. With clip limits L < U the law is the Gaussian censored at L and U
 * (point masses Φ((L−μ)/σ) and 1 − Φ((U−μ)/σ)); with truncation it is the Gaussian restricted to
 * [L, U] and renormalised (Johnson, Kotz & Balakrishnan, "Continuous Univariate Distributions",
 * Vol. 1, 2nd ed., §10.1 for both). μ is the mean before limits, σ = actionStd. The limits are
 * those in force at the state (policy/actionLimits.ts: a rate limit moves them), passed in by the
 * caller as `limits` (from actionLimitsAt); without them the policy must have no rate limit.
 */
import { normalCdf, normalIntervalProbability } from '../normalDistribution';
import { actionStd, type BoundMode, type GaussianPolicy } from '../policy';

/** Limits at one state: lo/hi per action (m) and the mode; from actionLimitsAt. */
export interface LimitsAt {
  readonly lo: ArrayLike<number>;
  readonly hi: ArrayLike<number>;
  readonly mode: BoundMode;
}

export function actionIntervalProbability(policy: GaussianPolicy, j: number, mean: number, lo: number, hi: number, limits?: LimitsAt): number {
  if (!(lo <= hi)) return 0;
  if (policy.rateLimit && !limits) throw new RangeError('actionIntervalProbability: a rate-limited policy needs the limits at the state');
  const sigma = actionStd(policy, j), b = limits ?? policy.bounds;
  const z = (x: number) => (x - mean) / sigma;
  if (!b) return normalIntervalProbability(z(lo), z(hi));
  const limitLo = b.lo[j], limitHi = b.hi[j];
  const a = Math.max(lo, limitLo), c = Math.min(hi, limitHi);
  if (a > c) return 0;
  if (limitLo === limitHi) return 1; // the limits collapsed onto one value inside [lo, hi]
  if (b.mode === 'truncate') return normalIntervalProbability(z(a), z(c)) / normalIntervalProbability(z(limitLo), z(limitHi));
  // Clipped: the distribution function jumps by the lower tail at L and reaches 1 at U.
  const below = a <= limitLo ? 0 : normalCdf(z(a)); // P(a_j < a)
  const upTo = c >= limitHi ? 1 : normalCdf(z(c)); // P(a_j ≤ c)
  return Math.max(0, upTo - below);
}
