/**
 * ψ(s) = E_{a~π(·|s)} φ(s, a): the candidate-averaged feature vector at a state, by one of two
 * routes that give the same numbers to rounding:
 *   quadrature — the action quadrature's nodes and weights (actionQuadrature.ts), φ at each node;
 *   moments    — for polynomial features, φ_j(s, a) = S_j(s)·Π_i z_i^{k_ij} with z_i the
 *     standardised action, so by independence of the action dimensions
 *       ψ_j(s) = S_j(s) · Π_i E[z_i^{k_ij}],
 *     the moments in closed form (actionMoments.ts). Cost per state O(d + m·K²) instead of
 *     O(nodes^m · d).
 * The moment route is taken only where the quadrature is itself exact for the features (its
 * n nodes per dimension integrate degree ≤ 2n − 1, and the feature degree is at most that) and
 * the action law has independent dimensions without truncation; so a retune map's points agree
 * with the main fit of the same policy to rounding, whichever route served them.
 *
 * Shapes: state read from states[offset .. offset+ds); out[outOffset .. outOffset+d).
 */
import { createActionQuadrature } from '../actionQuadrature';
import type { FeatureMap, PolynomialFeatureSpec } from '../features/featureMap';
import { monomialBasis } from '../features/monomials';
import { actionLimitsAt, actionStd, limitModeOf, policyMean, type GaussianPolicy } from '../policy';
import { clippedGaussianMoments, gaussianMoments, MAX_MOMENT_DEGREE } from './actionMoments';

export type AverageRoute = 'moments' | 'quadrature';

export interface PolicyFeatureAverage {
  readonly route: AverageRoute;
  readonly dim: number; // d
  average(states: ArrayLike<number>, offset: number, out: Float64Array, outOffset: number): void;
}

export function createPolicyFeatureAverage(features: FeatureMap, policy: GaussianPolicy, quadratureNodes: number): PolicyFeatureAverage {
  const spec = features.toSpec();
  if (spec.kind === 'polynomial' && momentRouteApplies(spec, policy, quadratureNodes)) return momentAverage(spec, policy);
  return quadratureAverage(features, policy, quadratureNodes);
}

/** True when the closed-form moments reproduce the quadrature exactly (see above). */
export function momentRouteApplies(spec: PolynomialFeatureSpec, policy: GaussianPolicy, quadratureNodes: number): boolean {
  return policy.independent && limitModeOf(policy) !== 'truncate' && spec.degree <= Math.min(2 * quadratureNodes - 1, MAX_MOMENT_DEGREE);
}

export function quadratureAverage(features: FeatureMap, policy: GaussianPolicy, nodes: number): PolicyFeatureAverage {
  const quadrature = createActionQuadrature(policy, nodes);
  const ds = policy.stateDim, m = policy.actionDim, d = features.dim;
  const input = new Float64Array(ds + m), phi = new Float64Array(d);
  const points = new Float64Array(quadrature.maxPoints * m), weights = new Float64Array(quadrature.maxPoints);
  return {
    route: 'quadrature', dim: d,
    average(states, offset, out, outOffset) {
      for (let f = 0; f < d; f++) out[outOffset + f] = 0;
      for (let c = 0; c < ds; c++) input[c] = states[offset + c];
      const k = quadrature.at(states, offset, points, weights);
      for (let j = 0; j < k; j++) {
        for (let c = 0; c < m; c++) input[ds + c] = points[j * m + c];
        features.evaluate(input, 0, phi, 0);
        const w = weights[j];
        for (let f = 0; f < d; f++) out[outOffset + f] += w * phi[f];
      }
    },
  };
}

function momentAverage(spec: PolynomialFeatureSpec, policy: GaussianPolicy): PolicyFeatureAverage {
  const ds = policy.stateDim, m = policy.actionDim, n = ds + m, degree = spec.degree;
  const { mean: centre, scale } = spec.standardiser;
  const basis = monomialBasis(n, degree), d = basis.size;
  const { keys, keyOf } = actionExponentKeys(basis.exponents, d, ds, m);
  const stateFactor = new Float64Array(d), z = new Float64Array(ds), mu = new Float64Array(m);
  const lo = new Float64Array(m), hi = new Float64Array(m), partial = new Float64Array(degree + 1);
  const moments = Array.from({ length: m }, () => new Float64Array(degree + 1)), product = new Float64Array(keys.length);
  const std = Array.from({ length: m }, (_, i) => actionStd(policy, i));
  return {
    route: 'moments', dim: d,
    average(states, offset, out, outOffset) {
      for (let c = 0; c < ds; c++) z[c] = (states[offset + c] - centre[c]) / scale[c];
      policyMean(policy, states, mu, offset, 0);
      const mode = actionLimitsAt(policy, states, offset, lo, hi);
      for (let i = 0; i < m; i++) {
        const c = centre[ds + i], h = scale[ds + i];
        if (mode === null) gaussianMoments(mu[i], std[i], c, h, degree, moments[i]);
        else clippedGaussianMoments(mu[i], std[i], lo[i], hi[i], c, h, degree, moments[i], partial);
      }
      for (let k = 0; k < keys.length; k++) {
        let p = 1;
        for (let i = 0; i < m; i++) p *= moments[i][keys[k][i]];
        product[k] = p;
      }
      stateFactor[0] = 1;
      out[outOffset] = product[keyOf[0]];
      for (let j = 1; j < d; j++) {
        const v = basis.variable[j];
        stateFactor[j] = stateFactor[basis.parent[j]] * (v < ds ? z[v] : 1);
        out[outOffset + j] = stateFactor[j] * product[keyOf[j]];
      }
    },
  };
}

/** The distinct action-exponent tuples of the monomials, and each monomial's tuple index. */
function actionExponentKeys(exponents: Int32Array, d: number, ds: number, m: number): { keys: number[][]; keyOf: Int32Array } {
  const n = ds + m, index = new Map<string, number>(), keys: number[][] = [], keyOf = new Int32Array(d);
  for (let j = 0; j < d; j++) {
    const tuple = Array.from(exponents.subarray(j * n + ds, (j + 1) * n));
    const name = tuple.join(',');
    if (!index.has(name)) {
      index.set(name, keys.length);
      keys.push(tuple);
    }
    keyOf[j] = index.get(name)!;
  }
  return { keys, keyOf };
}
