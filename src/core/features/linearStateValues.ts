/**
 * State values of a linear action-value function Q(s, a) = φ(s, a)ᵀw at many states:
 *   V^π(s) = Σ_j ω_j Q(s, a_j) = ξ(s)ᵀw,   ξ(s) = Σ_j ω_j φ(s, a_j)   (linearity; policyFeatures.ts),
 * with ξ(s) from policyFeatureAverage.ts: closed-form action moments where the rule is exact for
 * the features, else the feature map's node average where it has one (polynomialNodeAverage.ts,
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
import { averageForQuadrature } from './policyFeatureAverage';

export function linearStateValues(
  features: FeatureMap, weights: Float64Array, quadrature: ActionQuadrature, states: Float64Array, count: number, ds: number, out = new Float64Array(count),
): Float64Array {
  const d = features.dim;
  if (weights.length !== d) throw new ValueQueryError(`weights: expected ${d}, got ${weights.length}`);
  if (states.length < count * ds) throw new ValueQueryError(`states: expected ${count}×${ds} values, got ${states.length}`);
  const xi = new Float64Array(d), average = averageForQuadrature(features, quadrature);
  for (let s = 0; s < count; s++) {
    average.average(states, s * ds, xi, 0);
    let v = 0;
    for (let f = 0; f < d; f++) v += xi[f] * weights[f];
    if (!Number.isFinite(v)) throw new ValueQueryError(`state value is ${v} at state ${s + 1} [${Array.from(states.subarray(s * ds, (s + 1) * ds)).join(', ')}]`);
    out[s] = v;
  }
  return out;
}
