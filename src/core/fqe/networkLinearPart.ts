/**
 * The linear part of the network's action value: full polynomial features of degree
 * `linearPartDegree` (networkMethod.ts: by default 2, the linear approximator's default, or 4 where
 * the guarded per-project choice takes it, networkDegreeChoice.ts) in the standardised (s, a), kept row by row for the training transitions, so that the network's last
 * layer can be solved jointly over them and the hidden features (networkLastLayer.ts), and so that the linear LSTD-Q fixed point on
 * them alone (Lagoudakis & Parr, "Least-squares policy iteration", JMLR 2003, §5) is at hand as
 * the starting Q. At the default degree it is also the linear estimate the network is compared
 * with; that comparator keeps the linear approximator's default degree whatever this part's
 * (networkComparator.ts).
 *
 * Why a quadratic part at all: a quadratic carries the long-horizon bulk of Q exactly on
 * linear-quadratic plants and closely near any smooth operating point, and extrapolates to start
 * states beyond the logged cloud the way a Taylor expansion does; the hidden features only have to
 * learn what a quadratic misses (saturation, clipping, asymmetric costs).
 *
 * Shapes: n training rows, d1 = C(p+k, k) features of degree k with p = ds + m inputs; rows n×d1 row-major.
 */
import type { ActionQuadrature } from '../actionQuadrature';
import { createFeatureMap, type FeatureMap } from '../features/featureMap';
import { polynomialFeatureSpec } from '../features/polynomialFeatures';
import type { TransitionSet } from '../transitions';

/** Default degree of the polynomial part (a choice: the smallest degree exact for linear-quadratic plants; networkMethod.ts). */
export const LINEAR_PART_DEGREE = 2;

export interface LinearPart {
  readonly features: FeatureMap;
  readonly dim: number; // d1
  /** φ(s_i, a_i) of each training row: n×d1. */
  readonly rows: Float64Array;
  /** γ(1 − done_i)·Σ_j ω_ij φ(s'_i, a'_ij), the discounted policy-averaged next features: n×d1. */
  readonly nextRows: Float64Array;
}

/** transitions: the training rows' indices into data, in row order; degree: of the polynomial features. */
export function createLinearPart(
  data: TransitionSet, transitions: Int32Array, standardiser: { mean: ArrayLike<number>; scale: ArrayLike<number> },
  quadrature: ActionQuadrature, discount: number, degree = LINEAR_PART_DEGREE,
): LinearPart {
  const features = createFeatureMap(polynomialFeatureSpec({ mean: Array.from(standardiser.mean), scale: Array.from(standardiser.scale) }, degree));
  const d = features.dim, n = transitions.length, ds = data.stateDim, m = data.actionDim;
  const rows = new Float64Array(n * d), nextRows = new Float64Array(n * d);
  const input = new Float64Array(ds + m), phi = new Float64Array(d);
  const points = new Float64Array(quadrature.maxPoints * m), weights = new Float64Array(quadrature.maxPoints);
  for (let row = 0; row < n; row++) {
    const i = transitions[row];
    for (let c = 0; c < ds; c++) input[c] = data.states[i * ds + c];
    for (let c = 0; c < m; c++) input[ds + c] = data.actions[i * m + c];
    features.evaluate(input, 0, rows, row * d);
    if (data.terminal[i] !== 0) continue; // nothing is bootstrapped past a terminal state
    for (let c = 0; c < ds; c++) input[c] = data.nextStates[i * ds + c];
    const k = quadrature.at(data.nextStates, i * ds, points, weights);
    for (let j = 0; j < k; j++) {
      for (let c = 0; c < m; c++) input[ds + c] = points[j * m + c];
      features.evaluate(input, 0, phi, 0);
      const w = discount * weights[j];
      for (let f = 0; f < d; f++) nextRows[row * d + f] += w * phi[f];
    }
  }
  return { features, dim: d, rows, nextRows };
}
