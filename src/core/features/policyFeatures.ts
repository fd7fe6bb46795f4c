/**
 * Policy-averaged features ξ(s) = Σ_j ω_j φ(s, a_j) over the action quadrature at s (nodes a_j,
 * weights ω_j), so that with Q = φᵀw the state value is V^π(s) = ξ(s)ᵀw, and J(w) = ξ̄ᵀw with ξ̄
 * the mean over start states (value.ts, by linearity). Kept per state so a bootstrap resample can
 * reweight the start states by episode multiplicities.
 *
 * Shapes: states count×ds row-major; ξ rows count×d row-major.
 */
import type { ActionQuadrature } from '../actionQuadrature';
import { BootstrapError } from '../bootstrap/episodeMultiplicities';
import type { FeatureMap } from './featureMap';

/** ξ(s) per state; rows with skip[i] ≠ 0 stay zero (a transition into a terminal state has no next action). */
export function startStateFeatures(features: FeatureMap, quadrature: ActionQuadrature, states: Float64Array, ds: number, skip?: Uint8Array): Float64Array {
  const d = features.dim, m = quadrature.actionDim, count = states.length / ds;
  if (!Number.isInteger(count) || count < 1) throw new BootstrapError(`states: expected whole rows of ${ds} values, got ${states.length} values`);
  const out = new Float64Array(count * d), phi = new Float64Array(d), input = new Float64Array(ds + m);
  const points = new Float64Array(quadrature.maxPoints * m), weights = new Float64Array(quadrature.maxPoints);
  for (let s = 0; s < count; s++) {
    if (skip?.[s]) continue;
    for (let c = 0; c < ds; c++) input[c] = states[s * ds + c];
    const k = quadrature.at(states, s * ds, points, weights);
    for (let j = 0; j < k; j++) {
      for (let c = 0; c < m; c++) input[ds + c] = points[j * m + c];
      features.evaluate(input, 0, phi, 0);
      for (let f = 0; f < d; f++) out[s * d + f] += weights[j] * phi[f];
    }
  }
  return out;
}

/**
 * Mean of the rows of xi (count×d) weighted by multiplicities (count), or unweighted when they
 * are omitted: ξ̄ of a resample whose start states are its episodes' first states.
 */
export function meanStartFeatures(xi: Float64Array, d: number, multiplicities?: ArrayLike<number>, out: Float64Array = new Float64Array(d)): Float64Array {
  const count = xi.length / d;
  if (multiplicities && multiplicities.length !== count) throw new BootstrapError(`multiplicities: expected ${count} (one per start state), got ${multiplicities.length}`);
  out.fill(0);
  let total = 0;
  for (let s = 0; s < count; s++) {
    const c = multiplicities ? multiplicities[s] : 1;
    if (c === 0) continue;
    total += c;
    for (let f = 0; f < d; f++) out[f] += c * xi[s * d + f];
  }
  if (!(total > 0)) throw new BootstrapError('start states: the resample holds none');
  for (let f = 0; f < d; f++) out[f] /= total;
  return out;
}

/** Mean over states (count×ds) of ξ(s), rows with skip[i] ≠ 0 counting as zero features. */
export function policyFeatureMean(
  features: FeatureMap, quadrature: ActionQuadrature, states: Float64Array, ds: number, skip?: Uint8Array,
): Float64Array {
  const d = features.dim, rows = startStateFeatures(features, quadrature, states, ds, skip), count = rows.length / d;
  const mean = new Float64Array(d);
  for (let s = 0; s < count; s++) for (let f = 0; f < d; f++) mean[f] += rows[s * d + f] / count;
  return mean;
}
