/**
 * State values of a linear action-value function Q(s, a) = φ(s, a)ᵀw at many states:
 *   V^π(s) = Σ_j ω_j Q(s, a_j) = ξ(s)ᵀw,   ξ(s) = Σ_j ω_j φ(s, a_j)   (linearity; policyFeatures.ts),
 * with ξ(s) from the feature map's node average where it has one (polynomialNodeAverage.ts,
 * gridNodeAverage.ts: state factors formed once per state, not once per node), else node by node.
 * The same numbers as value.ts's stateValues (Q at every node, then the weighted sum) up to
 * rounding in the order of the products; the test compares the two. Used where V̂ is needed at every
 * logged state (the doubly robust cross-check).
 *
 * Shapes: states count×ds row-major; weights d; out count.
 */
import type { ActionQuadrature } from '../actionQuadrature';
import { ValueQueryError } from '../value';
import type { FeatureMap } from './featureMap';

export function linearStateValues(
  features: FeatureMap, weights: Float64Array, quadrature: ActionQuadrature, states: Float64Array, count: number, ds: number, out = new Float64Array(count),
): Float64Array {
  const d = features.dim, m = quadrature.actionDim;
  if (weights.length !== d) throw new ValueQueryError(`weights: expected ${d}, got ${weights.length}`);
  if (states.length < count * ds) throw new ValueQueryError(`states: expected ${count}×${ds} values, got ${states.length}`);
  const xi = new Float64Array(d), phi = new Float64Array(d), input = new Float64Array(ds + m);
  const points = new Float64Array(quadrature.maxPoints * m), nodeWeights = new Float64Array(quadrature.maxPoints);
  const average = features.nodeAverage?.(ds);
  for (let s = 0; s < count; s++) {
    const k = quadrature.at(states, s * ds, points, nodeWeights);
    if (average) average(states, s * ds, points, nodeWeights, k, xi, 0);
    else {
      xi.fill(0);
      for (let c = 0; c < ds; c++) input[c] = states[s * ds + c];
      for (let j = 0; j < k; j++) {
        for (let c = 0; c < m; c++) input[ds + c] = points[j * m + c];
        features.evaluate(input, 0, phi, 0);
        for (let f = 0; f < d; f++) xi[f] += nodeWeights[j] * phi[f];
      }
    }
    let v = 0;
    for (let f = 0; f < d; f++) v += xi[f] * weights[f];
    if (!Number.isFinite(v)) throw new ValueQueryError(`state value is ${v} at state ${s + 1} [${Array.from(states.subarray(s * ds, (s + 1) * ds)).join(', ')}]`);
    out[s] = v;
  }
  return out;
}
