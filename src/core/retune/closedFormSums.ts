/**
 * A retune-map point by the closed-form route: for an affine Gaussian policy and polynomial
 * features ψ_i = C χ_i (nextFeatureCoefficients.ts), so with the once-formed sums A, B, x
 * (nextStateMonomialSums.ts)
 *   ΦᵀΨ = A Cᵀ,   ΨᵀΨ = C B Cᵀ,   Ψᵀr = C x                                  O(d²·dχ), no data pass;
 * then, where the candidate's actuator limits are within reach of its action law at s'_i (a tail
 * beyond a limit of probability ≥ 1e−15, the same switch the bounded quadrature makes,
 * quadrature/boundedNormal.ts), the row's exact ψ_i (clipped-normal moments) replaces C χ_i:
 *   ΦᵀΨ += φ_i δ_iᵀ,  ΨᵀΨ += ψ_i ψ_iᵀ − p_i p_iᵀ,  Ψᵀr += r_i δ_i,   p_i = C χ_i, δ_i = ψ_i − p_i.
 * A loop that rarely saturates pays for the few rows where it might. Where limits are within reach
 * on many rows (a valve working near its stop, a rate limit whose band is always within reach) the
 * corrections cost more than a plain pass, so retuneGrid then takes the per-row route instead
 * (MAX_CORRECTED_SHARE, measured: the corrections are unblocked and cost about 2× a pass row).
 */
import type { PolynomialFeatureSpec } from '../features/featureMap';
import { throwIfCancelled, type CancellationCheck } from '../fqe/cancellation';
import { normalCdf, normalSurvival } from '../normalDistribution';
import { actionLimitsAt, actionStd, hasActionLimits, policyMean, type GaussianPolicy } from '../policy';
import { NEGLIGIBLE_MASS } from '../quadrature/boundedNormal';
import type { TransitionSet } from '../transitions';
import { nextFeatureCoefficients } from './nextFeatureCoefficients';
import type { NextStateMonomialSums } from './nextStateMonomialSums';
import type { PolicyFeatureAverage } from '../features/policyFeatureAverage';
import type { PolicyFreeSums } from './policyFreeSums';
import { keepUpperTriangles, newPacked, newSlot, packedSlot, statisticsOf, type PointSums, type Slot } from './pointSums';

/** Above this share of rows near a limit the per-row route is cheaper (a choice, from the bench). */
export const MAX_CORRECTED_SHARE = 0.25;

/**
 * 1 for each transition (in episode order) whose candidate action law at s'_i reaches an actuator
 * limit, or null when the policy has no limits; and how many there are.
 */
export function rowsNearLimits(data: TransitionSet, free: PolicyFreeSums, policy: GaussianPolicy): { mask: Uint8Array | null; count: number } {
  if (!hasActionLimits(policy)) return { mask: null, count: 0 };
  const ds = data.stateDim, m = policy.actionDim, index = free.index, mask = new Uint8Array(free.count);
  const mu = new Float64Array(m), lo = new Float64Array(m), hi = new Float64Array(m), std = Array.from({ length: m }, (_, i) => actionStd(policy, i));
  let count = 0;
  for (let q = 0; q < free.count; q++) {
    const i = index.order[q];
    if (data.terminal[i] !== 0) continue;
    policyMean(policy, data.nextStates, mu, i * ds, 0);
    actionLimitsAt(policy, data.nextStates, i * ds, lo, hi);
    if (limitWithinReach(mu, std, lo, hi)) {
      mask[q] = 1;
      count++;
    }
  }
  return { mask, count };
}

export function closedFormPointSums(
  data: TransitionSet, spec: PolynomialFeatureSpec, free: PolicyFreeSums, mono: NextStateMonomialSums,
  policy: GaussianPolicy, average: PolicyFeatureAverage, near: { mask: Uint8Array | null; count: number }, cancel?: CancellationCheck,
): PointSums & { correctedRows: number } {
  const d = free.dim, k = mono.ring.size;
  const c = nextFeatureCoefficients(spec, mono.ring, mono.structure, policy);
  const total = newSlot(d);
  projectSums(c, mono.cross, mono.gram, mono.reward, d, k, total);
  const packed = mono.episodes ? newPacked(free) : null;
  if (packed) {
    const stride = d * k + k * k + k, e = mono.episodes!;
    for (let ep = 0; ep < free.index.episodes; ep++) {
      const o = ep * stride;
      projectSums(c, e.subarray(o, o + d * k), e.subarray(o + d * k, o + d * k + k * k), e.subarray(o + d * k + k * k, o + stride), d, k, packedSlot(packed, ep, d));
    }
  }
  if (near.mask) correctAtLimits(data, free, mono, c, near.mask, average, total, packed, cancel);
  if (packed) keepUpperTriangles(packed);
  return { statistics: statisticsOf(free, total, 'full'), episodeSums: packed, correctedRows: near.count };
}

/** slot = (A Cᵀ, C B Cᵀ, C x), all d×d full. */
function projectSums(c: Float64Array, a: Float64Array, b: Float64Array, x: Float64Array, d: number, k: number, slot: Slot): void {
  const cb = new Float64Array(d * k);
  for (let f = 0; f < d; f++) {
    for (let j = 0; j < k; j++) {
      let s = 0;
      for (let i = 0; i < k; i++) s += c[f * k + i] * b[i * k + j];
      cb[f * k + j] = s;
    }
    let e = 0;
    for (let i = 0; i < k; i++) e += c[f * k + i] * x[i];
    slot.nextReward[f] = e;
  }
  for (let f = 0; f < d; f++) {
    for (let g = 0; g < d; g++) {
      let m = 0, h = 0;
      for (let i = 0; i < k; i++) {
        m += a[f * k + i] * c[g * k + i];
        h += cb[f * k + i] * c[g * k + i];
      }
      slot.cross[f * d + g] = m;
      slot.nextGram[f * d + g] = h;
    }
  }
}

/** Replace C χ_i by the exact clipped ψ_i on the rows the mask marks (episode order). */
function correctAtLimits(
  data: TransitionSet, free: PolicyFreeSums, mono: NextStateMonomialSums, c: Float64Array, mask: Uint8Array,
  average: PolicyFeatureAverage, total: Slot, packed: ReturnType<typeof newPacked> | null, cancel?: CancellationCheck,
): void {
  const d = free.dim, k = mono.ring.size, ds = data.stateDim, index = free.index, phi = free.features!;
  const psi = new Float64Array(d), p = new Float64Array(d);
  for (let e = 0; e < index.episodes; e++) {
    if (e % 64 === 0) throwIfCancelled(cancel);
    const slot = packed ? packedSlot(packed, e, d) : null;
    for (let q = index.offsets[e]; q < index.offsets[e + 1]; q++) {
      if (!mask[q]) continue;
      const i = index.order[q];
      average.average(data.nextStates, i * ds, psi, 0);
      for (let f = 0; f < d; f++) {
        let s = 0;
        for (let j = 0; j < k; j++) s += c[f * k + j] * mono.monomials[q * k + j];
        p[f] = s;
      }
      addCorrection(phi, q, psi, p, data.rewards[i], d, total);
      if (slot) addCorrection(phi, q, psi, p, data.rewards[i], d, slot);
    }
  }
}

function limitWithinReach(mu: Float64Array, std: number[], lo: Float64Array, hi: Float64Array): boolean {
  for (let i = 0; i < mu.length; i++) {
    if (lo[i] === hi[i]) return true;
    if (Number.isFinite(lo[i]) && normalCdf((lo[i] - mu[i]) / std[i]) >= NEGLIGIBLE_MASS) return true;
    if (Number.isFinite(hi[i]) && normalSurvival((hi[i] - mu[i]) / std[i]) >= NEGLIGIBLE_MASS) return true;
  }
  return false;
}

function addCorrection(phi: Float64Array, q: number, psi: Float64Array, p: Float64Array, r: number, d: number, slot: Slot): void {
  for (let f = 0; f < d; f++) {
    const df = psi[f] - p[f], pf = phi[q * d + f];
    slot.nextReward[f] += r * df;
    for (let g = 0; g < d; g++) {
      slot.cross[f * d + g] += pf * (psi[g] - p[g]);
      slot.nextGram[f * d + g] += psi[f] * psi[g] - p[f] * p[g];
    }
  }
}
