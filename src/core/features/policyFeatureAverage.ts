/**
 * ψ(s) = E_{a~π(·|s)} φ(s, a): the candidate-averaged feature vector at a state, by one of two
 * routes that give the same numbers to rounding:
 *   quadrature — the action quadrature's nodes and weights (actionQuadrature.ts), through the
 *     feature map's node average where it has one (polynomialNodeAverage.ts, gridNodeAverage.ts:
 *     state factors once per state), else φ at each node;
 *   moments    — for polynomial features, φ_j(s, a) = S_j(s)·Π_i z_i^{k_ij} with z_i the
 *     standardised action, so by independence of the action dimensions
 *       ψ_j(s) = S_j(s) · Π_i E[z_i^{k_ij}],
 *     the moments in closed form (actionMoments.ts). Cost per state O(d + m·K²) instead of
 *     O(nodes^m · d). Where a clipped dimension's closed form would lose digits (a dither far
 *     wider than the band between its limits), that dimension's moments come from its own
 *     bounded-normal rule instead (clippedMomentRow): still one factor per dimension.
 * The moment route is taken only where the quadrature is itself exact for the features (its
 * n nodes per dimension integrate degree ≤ 2n − 1, and the feature degree is at most that) and
 * the action law has independent dimensions without truncation; so every pass — the fit's data
 * passes, V̂ at the logged states, a retune map's points — gets the numbers the quadrature would
 * give, to rounding, whichever route served them. Both routes raise the quadrature's PolicyError
 * where the candidate's mean is not finite at a state.
 *
 * Shapes: state read from states[offset .. offset+ds); out[outOffset .. outOffset+d).
 */
import { createActionQuadrature, meanAt, type ActionQuadrature } from '../actionQuadrature';
import { actionLimitsAt, actionStd, limitModeOf, type GaussianPolicy } from '../policy';
import { createBoundedNormalQuadrature, type BoundedNormalQuadrature } from '../quadrature/boundedNormal';
import { clippedGaussianMoments, gaussianMoments, MAX_MOMENT_DEGREE } from './actionMoments';
import type { FeatureMap, PolynomialFeatureSpec } from './featureMap';
import { monomialBasis } from './monomials';

export type AverageRoute = 'moments' | 'quadrature';

export interface PolicyFeatureAverage {
  readonly route: AverageRoute;
  readonly dim: number; // d
  average(states: ArrayLike<number>, offset: number, out: Float64Array, outOffset: number): void;
}

export function createPolicyFeatureAverage(features: FeatureMap, policy: GaussianPolicy, quadratureNodes: number): PolicyFeatureAverage {
  return averageForQuadrature(features, createActionQuadrature(policy, quadratureNodes));
}

/** ψ for the policy and rule a quadrature was built for: the moment route where it applies, else that quadrature. */
export function averageForQuadrature(features: FeatureMap, quadrature: ActionQuadrature): PolicyFeatureAverage {
  const spec = features.polynomial;
  if (spec && averageRoute(features, quadrature) === 'moments') return momentAverage(spec, quadrature.policy, quadrature.nodesPerDimension);
  return quadratureRoute(features, quadrature);
}

/** The route averageForQuadrature takes for these features and rule (the two agree to rounding only, so passes to be equal to the last bit must share it). */
export function averageRoute(features: FeatureMap, quadrature: ActionQuadrature): AverageRoute {
  const spec = features.polynomial;
  return spec && momentRouteApplies(spec, quadrature.policy, quadrature.nodesPerDimension) ? 'moments' : 'quadrature';
}

/** True when the closed-form moments reproduce the quadrature exactly (see above). */
export function momentRouteApplies(spec: Readonly<PolynomialFeatureSpec>, policy: GaussianPolicy, quadratureNodes: number): boolean {
  return policy.independent && limitModeOf(policy) !== 'truncate' && spec.degree <= Math.min(2 * quadratureNodes - 1, MAX_MOMENT_DEGREE);
}

/** The quadrature route for a policy and node count (the slow reference the tests compare with). */
export function quadratureAverage(features: FeatureMap, policy: GaussianPolicy, nodes: number): PolicyFeatureAverage {
  return quadratureRoute(features, createActionQuadrature(policy, nodes));
}

function quadratureRoute(features: FeatureMap, quadrature: ActionQuadrature): PolicyFeatureAverage {
  const { policy } = quadrature, ds = policy.stateDim, m = policy.actionDim, d = features.dim;
  const input = new Float64Array(ds + m), phi = new Float64Array(d);
  const points = new Float64Array(quadrature.maxPoints * m), weights = new Float64Array(quadrature.maxPoints);
  const nodeAverage = features.nodeAverage?.(ds);
  return {
    route: 'quadrature', dim: d,
    average(states, offset, out, outOffset) {
      if (nodeAverage) {
        const k = quadrature.at(states, offset, points, weights);
        nodeAverage(states, offset, points, weights, k, out, outOffset);
        return;
      }
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

function momentAverage(spec: Readonly<PolynomialFeatureSpec>, policy: GaussianPolicy, nodes: number): PolicyFeatureAverage {
  const ds = policy.stateDim, m = policy.actionDim, n = ds + m, degree = spec.degree, width = degree + 1;
  const { mean: centre, scale } = spec.standardiser;
  const { size: d, parent, variable, exponents } = monomialBasis(n, degree);
  const { keys, keyOf } = actionExponentKeys(exponents, d, ds, m), keyCount = keys.length / m;
  const stateFactor = new Float64Array(d), z = new Float64Array(ds + 1), mu = new Float64Array(m);
  const lo = new Float64Array(m), hi = new Float64Array(m), limited = limitModeOf(policy) !== null;
  const moments = new Float64Array(m * width), product = new Float64Array(keyCount), row = new Float64Array(width);
  const std = Array.from({ length: m }, (_, i) => actionStd(policy, i)), clipped = limited ? clippedMomentRow(nodes, degree) : null;
  // z[v] for a state variable v; z[ds] = 1 stands for every action variable in the state factors.
  const factorOf = Int32Array.from(variable, (v) => (v < ds ? v : ds));
  z[ds] = 1;
  return {
    route: 'moments', dim: d,
    average(states, offset, out, outOffset) {
      for (let c = 0; c < ds; c++) z[c] = (states[offset + c] - centre[c]) / scale[c];
      meanAt(policy, states, offset, mu);
      const mode = limited ? actionLimitsAt(policy, states, offset, lo, hi) : null;
      for (let i = 0; i < m; i++) {
        const c = centre[ds + i], h = scale[ds + i];
        if (mode === null) gaussianMoments(mu[i], std[i], c, h, degree, row);
        else clipped!(mu[i], std[i], lo[i], hi[i], c, h, row);
        moments.set(row, i * width);
      }
      for (let k = 0; k < keyCount; k++) {
        let p = 1;
        for (let i = 0; i < m; i++) p *= moments[i * width + keys[k * m + i]];
        product[k] = p;
      }
      stateFactor[0] = 1;
      out[outOffset] = product[keyOf[0]];
      for (let j = 1; j < d; j++) {
        stateFactor[j] = stateFactor[parent[j]] * z[factorOf[j]];
        out[outOffset + j] = stateFactor[j] * product[keyOf[j]];
      }
    },
  };
}

/**
 * One clipped action dimension's E z^k, k = 0..degree, into row: the closed form for the leading
 * moments that keep their digits (clippedGaussianMoments), the rest as Σ_j ω_j z_j^k over the
 * dimension's own bounded-normal rule with the quadrature's n nodes — the factor the tensor rule
 * gives this dimension, exact for degree ≤ 2n − 1 like the closed form. Which moment takes which
 * route depends on k alone, so a lower degree's row is a higher degree's leading part to the bit.
 */
function clippedMomentRow(n: number, degree: number) {
  const width = degree + 1, partial = new Float64Array(width), magnitude = new Float64Array(width);
  const nodes = new Float64Array(n + 2), weights = new Float64Array(n + 2);
  let rule: BoundedNormalQuadrature | null = null; // built the first time the closed form is not trusted
  return (mean: number, std: number, lo: number, hi: number, centre: number, scale: number, row: Float64Array): void => {
    const trusted = clippedGaussianMoments(mean, std, lo, hi, centre, scale, degree, row, partial, magnitude);
    if (trusted > degree) return;
    rule ??= createBoundedNormalQuadrature(n);
    const count = rule.fill(mean, std, lo, hi, 'clip', nodes, weights);
    row.fill(0, trusted, width);
    for (let j = 0; j < count; j++) {
      const z = (nodes[j] - centre) / scale;
      for (let k = 0, p = weights[j]; k <= degree; k++, p *= z) if (k >= trusted) row[k] += p;
    }
  };
}

/** The distinct action-exponent tuples of the monomials (flat, m per tuple), and each monomial's tuple index. */
function actionExponentKeys(exponents: Int32Array, d: number, ds: number, m: number): { keys: Int32Array; keyOf: Int32Array } {
  const n = ds + m, index = new Map<string, number>(), keys: number[] = [], keyOf = new Int32Array(d);
  for (let j = 0; j < d; j++) {
    const tuple = Array.from(exponents.subarray(j * n + ds, (j + 1) * n));
    const name = tuple.join(',');
    if (!index.has(name)) {
      index.set(name, keys.length / m);
      keys.push(...tuple);
    }
    keyOf[j] = index.get(name)!;
  }
  return { keys: Int32Array.from(keys), keyOf };
}
