/**
 * The mean action of a Gaussian policy N(μ, σ²) behind an actuator limit [lo, hi] (either side may
 * be open: ±Infinity), the two ways a policy may meet it (src/core/policy.ts):
 *
 *   clip (censored normal): actions beyond a limit sit at the limit,
 *     E = lo·Φ(α) + hi·(1 − Φ(β)) + μ·(Φ(β) − Φ(α)) + σ·(φ(α) − φ(β));
 *   truncate: the distribution is cut at the limits and renormalised,
 *     E = μ + σ·(φ(α) − φ(β)) / (Φ(β) − Φ(α)),
 * with α = (lo − μ)/σ, β = (hi − μ)/σ (Johnson, Kotz & Balakrishnan, "Continuous Univariate
 * Distributions", vol. 1, 2nd ed. 1994, §10.1 for the truncated normal; the censored mean is the
 * Tobit model's, e.g. Greene, "Econometric Analysis", §19.3). Terms with an infinite limit vanish.
 *
 * Where the kept mass Φ(β) − Φ(α) underflows (μ some 38 σ or more beyond a limit), the truncated
 * mean is the nearer limit plus σ/|α| toward the inside, from Mills' ratio R(x) ~ 1/x for large x
 * (Abramowitz & Stegun 26.2.12). Every result is kept inside [lo, hi], where the true mean lies,
 * so rounding can never put it outside.
 */
import { normalCdf, normalDensity, normalIntervalProbability, normalSurvival } from './normalDistribution';

export type LimitMode = 'clip' | 'truncate';

/** α, β, φ(α), φ(β) (0 at an open side) and the kept mass Φ(β) − Φ(α) of N(mean, std²) behind [lo, hi]: the terms every formula above is written in. */
export function boundedTerms(mean: number, std: number, lo: number, hi: number) {
  const alpha = (lo - mean) / std, beta = (hi - mean) / std;
  const phiA = Number.isFinite(alpha) ? normalDensity(alpha) : 0, phiB = Number.isFinite(beta) ? normalDensity(beta) : 0;
  return { alpha, beta, phiA, phiB, kept: normalIntervalProbability(alpha, beta) };
}

const inside = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x));

/** E[clip(a, lo, hi)] for a ~ N(mean, std²). */
export function clippedNormalMean(mean: number, std: number, lo: number, hi: number): number {
  if (!(std > 0)) return inside(mean, lo, hi);
  const { alpha, beta, phiA, phiB, kept } = boundedTerms(mean, std, lo, hi);
  const below = Number.isFinite(lo) ? lo * normalCdf(alpha) : 0;
  const above = Number.isFinite(hi) ? hi * normalSurvival(beta) : 0;
  return inside(below + above + mean * kept + std * (phiA - phiB), lo, hi);
}

/** E[a | lo ≤ a ≤ hi] for a ~ N(mean, std²). */
export function truncatedNormalMean(mean: number, std: number, lo: number, hi: number): number {
  if (!(std > 0)) return inside(mean, lo, hi);
  const { alpha, beta, phiA, phiB, kept } = boundedTerms(mean, std, lo, hi);
  if (!(kept > 1e-300)) return inside(mean < lo ? lo + std / alpha : mean > hi ? hi + std / beta : mean, lo, hi);
  return inside(mean + (std * (phiA - phiB)) / kept, lo, hi);
}

export function boundedNormalMean(mean: number, std: number, lo: number, hi: number, mode: LimitMode): number {
  return mode === 'clip' ? clippedNormalMean(mean, std, lo, hi) : truncatedNormalMean(mean, std, lo, hi);
}
