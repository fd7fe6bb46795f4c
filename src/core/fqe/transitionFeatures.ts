/**
 * The two feature vectors of one logged transition that linear fitted Q-evaluation needs:
 *   φ_i = φ(s_i, a_i), the features of the logged state and action, and
 *   ψ_i = (1 − done_i) E_{a'~π(·|s'_i)} φ(s'_i, a'), the policy's expected next features: the action
 *   quadrature at s'_i, Σ_j ω_ij φ(s'_i, a'_ij), or the closed-form moments that equal it where the
 *   rule is exact for the features (policyFeatureAverage.ts); 0 past a terminal state.
 * Read one transition at a time into buffers owned by the reader: nothing is allocated per call,
 * so it can run once per transition in every pass over the data.
 */
import type { ActionQuadrature } from '../actionQuadrature';
import type { FeatureMap } from '../features/featureMap';
import { averageForQuadrature } from '../features/policyFeatureAverage';
import type { TransitionSet } from '../transitions';

export interface TransitionFeatureReader {
  readonly phi: Float64Array; // d
  readonly psi: Float64Array; // d
  /** Fill phi and psi for transition i. */
  read(i: number): void;
}

export function createTransitionFeatureReader(data: TransitionSet, features: FeatureMap, quadrature: ActionQuadrature): TransitionFeatureReader {
  const ds = data.stateDim, m = data.actionDim, d = features.dim;
  const input = new Float64Array(ds + m), phi = new Float64Array(d), psi = new Float64Array(d);
  const next = averageForQuadrature(features, quadrature);
  return {
    phi, psi,
    read(i) {
      for (let c = 0; c < ds; c++) input[c] = data.states[i * ds + c];
      for (let c = 0; c < m; c++) input[ds + c] = data.actions[i * m + c];
      features.evaluate(input, 0, phi, 0);
      if (data.terminal[i] !== 0) psi.fill(0);
      else next.average(data.nextStates, i * ds, psi, 0);
    },
  };
}
