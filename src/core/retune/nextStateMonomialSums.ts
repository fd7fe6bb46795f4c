/**
 * The policy-free sums behind the closed-form route of a retune map (nextFeatureCoefficients.ts):
 * with χ_i = χ(s'_i) the state monomials of degree ≤ K at each next state (0 past a terminal state),
 *   A = Σ_i φ_i χ_iᵀ (d×dχ),   B = Σ_i χ_i χ_iᵀ (dχ×dχ),   x = Σ_i χ_i r_i (dχ),
 * so that for a policy with ψ_i = C χ_i one has ΦᵀΨ = A Cᵀ, ΨᵀΨ = C B Cᵀ and Ψᵀr = C x — one pass
 * for the whole map instead of one per point. Kept per episode as well when the bootstrap needs it,
 * and χ itself (row-major, in episode order) for the row corrections at actuator limits.
 */
import type { PolynomialFeatureSpec } from '../features/featureMap';
import { throwIfCancelled, type CancellationCheck } from '../fqe/cancellation';
import type { TransitionSet } from '../transitions';
import { featureStructure, type FeatureStructure } from './nextFeatureCoefficients';
import { MAX_STORED_FEATURE_VALUES, type PolicyFreeSums } from './policyFreeSums';
import { evaluateMonomials, statePolynomialRing, type StatePolynomialRing } from './statePolynomials';

export interface NextStateMonomialSums {
  readonly ring: StatePolynomialRing;
  readonly structure: FeatureStructure;
  readonly monomials: Float64Array; // χ: n×dχ in episode order
  readonly cross: Float64Array; // A: d×dχ
  readonly gram: Float64Array; // B: dχ×dχ
  readonly reward: Float64Array; // x: dχ
  /** Per episode [A_k | B_k | x_k], stride d·dχ + dχ² + dχ; null unless asked for. */
  readonly episodes: Float64Array | null;
}

/** null when Φ was not kept or χ would not fit (the per-row routes are used instead). */
export function nextStateMonomialSums(
  data: TransitionSet, spec: PolynomialFeatureSpec, free: PolicyFreeSums, cancel?: CancellationCheck,
): NextStateMonomialSums | null {
  const ds = data.stateDim, ring = statePolynomialRing(ds, spec.degree);
  if (!ring || !free.features || free.count * ring.size > MAX_STORED_FEATURE_VALUES) return null;
  const structure = featureStructure(spec, ring, ds, data.actionDim);
  const d = free.dim, k = ring.size, index = free.index, phi = free.features;
  const monomials = new Float64Array(free.count * k), z = new Float64Array(ds);
  const { mean, scale } = spec.standardiser;
  const stride = d * k + k * k + k, episodes = free.episodeSums ? new Float64Array(index.episodes * stride) : null;
  const cross = new Float64Array(d * k), gram = new Float64Array(k * k), reward = new Float64Array(k);
  for (let e = 0; e < index.episodes; e++) {
    if (e % 64 === 0) throwIfCancelled(cancel);
    const o = e * stride;
    const targets = episodes
      ? [episodes.subarray(o, o + d * k), episodes.subarray(o + d * k, o + d * k + k * k), episodes.subarray(o + d * k + k * k, o + stride)]
      : [cross, gram, reward];
    for (let p = index.offsets[e]; p < index.offsets[e + 1]; p++) {
      const i = index.order[p];
      if (data.terminal[i] !== 0) continue; // χ = 0: nothing follows a terminal state
      for (let v = 0; v < ds; v++) z[v] = (data.nextStates[i * ds + v] - mean[v]) / scale[v];
      evaluateMonomials(ring, z, monomials, p * k);
      addRow(phi, monomials, p, d, k, data.rewards[i], targets[0], targets[1], targets[2]);
    }
    if (episodes) addInto(targets, [cross, gram, reward]);
  }
  return { ring, structure, monomials, cross, gram, reward, episodes };
}

function addRow(phi: Float64Array, chi: Float64Array, p: number, d: number, k: number, r: number, a: Float64Array, b: Float64Array, x: Float64Array): void {
  const oc = p * k, op = p * d;
  for (let i = 0; i < k; i++) {
    const ci = chi[oc + i];
    if (ci === 0) continue;
    x[i] += ci * r;
    for (let j = 0; j < k; j++) b[i * k + j] += ci * chi[oc + j];
  }
  for (let f = 0; f < d; f++) {
    const pf = phi[op + f];
    for (let i = 0; i < k; i++) a[f * k + i] += pf * chi[oc + i];
  }
}

function addInto(from: Float64Array[], to: Float64Array[]): void {
  from.forEach((part, t) => { for (let j = 0; j < part.length; j++) to[t][j] += part[j]; });
}
