/**
 * Moments E[z^k], k = 0..K, of a standardised action z = (a − c)/h when a is Gaussian N(μ, σ²),
 * unlimited or clipped to [L, U] — what a polynomial feature of the action averages to under a
 * candidate's action law, without quadrature.
 *
 * Unlimited: z = u + τξ with u = (μ − c)/h, τ = σ/h, ξ ~ N(0, 1), so by the binomial theorem
 *   E z^k = Σ_{l even} C(k, l) u^{k−l} τ^l (l − 1)!!     (normal moments; common practice).
 * Clipped (censored normal; Johnson, Kotz & Balakrishnan, "Continuous Univariate Distributions",
 * Vol. 1, 2nd ed., §10.1): with α = (L − μ)/σ, β = (U − μ)/σ,
 *   E z^k = Φ(α) z_L^k + (1 − Φ(β)) z_U^k + Σ_l C(k, l) u^{k−l} τ^l I_l,
 *   I_l = ∫_α^β ξ^l φ(ξ) dξ:  I_0 = Φ(β) − Φ(α),  I_1 = φ(α) − φ(β),
 *   I_l = (l − 1) I_{l−2} + α^{l−1} φ(α) − β^{l−1} φ(β)      (integration by parts),
 * where z_L, z_U are the standardised limits and the terms at an infinite limit vanish. Limits
 * that collapse (L = U) give z_L^k.
 *
 * Rounding: the upward recursion and the binomial sum add terms of either sign, so the error of
 * the interior part is about ε·Σ_l C(k, l) |u|^{k−l} τ^l B_l, with B_l the sum of the magnitudes
 * that went into I_l (common practice for error bounds of sums; Higham, "Accuracy and Stability
 * of Numerical Algorithms", 2nd ed., ch. 4; section from memory). Where the dither is far wider than the band between
 * the limits (τ large, β − α small) those terms are huge and cancel to a sliver of probability,
 * and E z^k loses many digits (σ = 1000 on limits ±1: 1e−4 at k = 4). clippedGaussianMoments
 * bounds that error and reports how many leading moments are good to CLIPPED_MOMENT_TOLERANCE of
 * max(1, |E z^k|); the caller takes the rest from a Gauss rule. The count depends on k alone, not
 * on the degree asked for, so a lower degree's moments are a higher degree's leading ones.
 *
 * out: K+1 values.
 */
import { CLIPPED_MOMENT_TOLERANCE } from '../limits';
import { normalCdf, normalDensity, normalIntervalProbability, normalSurvival } from '../normalDistribution';

const BINOMIAL: number[][] = [];
for (let k = 0; k <= 12; k++) {
  BINOMIAL[k] = [1];
  for (let l = 1; l <= k; l++) BINOMIAL[k][l] = l === k ? 1 : BINOMIAL[k - 1][l - 1] + BINOMIAL[k - 1][l];
}

export const MAX_MOMENT_DEGREE = 12;

/**
 * Unlimited Gaussian: E[((a − c)/h)^k] for k = 0..degree into out, by the raw-moment recurrence of
 * a normal z ~ N(u, τ²),  E z^k = u E z^{k−1} + (k − 1) τ² E z^{k−2}  (Stein's identity
 * E[z g(z)] = u E g + τ² E g′ with g = z^{k−1}; common practice) — the binomial sum above, without powers.
 */
export function gaussianMoments(mean: number, std: number, centre: number, scale: number, degree: number, out: Float64Array): void {
  const u = (mean - centre) / scale, tau = std / scale, variance = tau * tau;
  out[0] = 1;
  if (degree >= 1) out[1] = u;
  for (let k = 2; k <= degree; k++) out[k] = u * out[k - 1] + (k - 1) * variance * out[k - 2];
}

/**
 * Clipped to [lo, hi] (either may be infinite, lo ≤ hi): E[((a − c)/h)^k] for k = 0..degree into out.
 * Returns the count t of leading moments k < t whose rounding bound above is within
 * CLIPPED_MOMENT_TOLERANCE·max(1, |out[k]|) (degree + 1 when all are; out[t..] are not to be
 * used). partial, magnitude: degree + 1 each, scratch.
 */
export function clippedGaussianMoments(
  mean: number, std: number, lo: number, hi: number, centre: number, scale: number, degree: number, out: Float64Array, partial: Float64Array,
  magnitude: Float64Array = new Float64Array(degree + 1),
): number {
  if (lo === hi) {
    const z = (lo - centre) / scale;
    for (let k = 0; k <= degree; k++) out[k] = z ** k;
    return degree + 1;
  }
  const alpha = (lo - mean) / std, beta = (hi - mean) / std;
  partialNormalMoments(alpha, beta, degree, partial, magnitude);
  const u = (mean - centre) / scale, tau = std / scale;
  const massLo = Number.isFinite(lo) ? normalCdf(alpha) : 0, massHi = Number.isFinite(hi) ? normalSurvival(beta) : 0;
  const zLo = (lo - centre) / scale, zHi = (hi - centre) / scale;
  for (let k = 0; k <= degree; k++) {
    let s = 0, size = 0;
    for (let l = 0; l <= k; l++) {
      const c = BINOMIAL[k][l] * u ** (k - l) * tau ** l;
      s += c * partial[l];
      size += Math.abs(c) * magnitude[l];
    }
    if (massLo > 0) s += massLo * zLo ** k;
    if (massHi > 0) s += massHi * zHi ** k;
    out[k] = s;
    // (2k + 4)·ε·size: k + 1 additions here, up to k + 2 in the recursion for I_k, and I_0 itself.
    if (!((2 * k + 4) * Number.EPSILON * size <= CLIPPED_MOMENT_TOLERANCE * Math.max(1, Math.abs(s)))) return k;
  }
  return degree + 1;
}

/**
 * I_l = ∫_α^β ξ^l φ(ξ) dξ for l = 0..degree (α < β, either infinite) into out, and into magnitude
 * B_l ≥ |I_l|, the sum of the magnitudes that went into it (for I_0, the tail probabilities).
 */
function partialNormalMoments(alpha: number, beta: number, degree: number, out: Float64Array, magnitude: Float64Array): void {
  const phiA = Number.isFinite(alpha) ? normalDensity(alpha) : 0, phiB = Number.isFinite(beta) ? normalDensity(beta) : 0;
  out[0] = normalIntervalProbability(alpha, beta);
  // It is a difference of two tail probabilities (normalDistribution.ts), so its error scales with the larger one.
  magnitude[0] = alpha >= 0 ? normalSurvival(alpha) : beta <= 0 ? normalCdf(beta) : 1;
  if (degree >= 1) {
    out[1] = phiA - phiB;
    magnitude[1] = phiA + phiB;
  }
  for (let l = 2; l <= degree; l++) {
    const edgeA = phiA === 0 ? 0 : alpha ** (l - 1) * phiA, edgeB = phiB === 0 ? 0 : beta ** (l - 1) * phiB;
    out[l] = (l - 1) * out[l - 2] + edgeA - edgeB;
    magnitude[l] = (l - 1) * magnitude[l - 2] + Math.abs(edgeA) + Math.abs(edgeB);
  }
}
