/**
 * The next-state inputs of the network's features, for E_{a'~π(·|s')} h(s', a') ≈ Σ_j w_j h(s', a'_j)
 * by the same action quadrature as the linear path (createActionQuadrature; bounded actions
 * included). The policy is fixed, so the nodes a'_j and weights w_j never change: the (n·K)×p
 * matrix of standardised [s', a'_j] rows and the n×K weights are built once, and each outer
 * iteration only runs the network over them in large batches (networkHiddenFeatures.ts).
 *
 * Rules with fewer than K = quadrature.maxPoints points at some state (bounded actions) are padded
 * with a copy of their first node at weight 0, so every state has K rows and the expectation is a
 * reshape and a weighted row sum. The weights carry γ, and terminal transitions get none.
 */
import * as tf from '@tensorflow/tfjs';
import { createActionQuadrature } from '../actionQuadrature';
import type { GaussianPolicy } from '../policy';
import type { TransitionSet } from '../transitions';
import { FqeOptionsError } from './fqeErrors';
import { standardiseInto, type InputStandardiser } from './networkTrainingSet';

export interface NextInputChunk {
  readonly states: number; // transitions in this chunk
  readonly inputs: tf.Tensor2D; // (states·K)×p, rows [s', a'_j] standardised, j fastest
  readonly weights: tf.Tensor2D; // states×K: γ·w_j, 0 past a terminal state
}

export interface NextInputs {
  readonly chunks: readonly NextInputChunk[]; // in the order of the transitions given
  readonly pointsPerState: number; // K
  dispose(): void;
}

/** Rows per network call: big enough to amortise kernel dispatch, small enough for the activations (rows×64 floats) to stay modest. */
const ROWS_PER_CHUNK = 65_536;
/** Float32 values of the whole next-input matrix (256 MB). */
export const MAX_NEXT_INPUT_VALUES = 2 ** 26;

/** transitions: indices into the data (the rows of a RegressionRows), in order. */
export function createNextInputs(
  data: TransitionSet, transitions: Int32Array, policy: GaussianPolicy, quadratureNodes: number,
  standardiser: InputStandardiser, discount: number,
): NextInputs {
  const quadrature = createActionQuadrature(policy, quadratureNodes);
  const ds = data.stateDim, m = data.actionDim, p = ds + m, k = quadrature.maxPoints;
  // Budgeted on the whole data set, since training and held-out inputs are both kept.
  if (data.count * k * p > MAX_NEXT_INPUT_VALUES) {
    throw new FqeOptionsError(`quadratureNodes: ${quadratureNodes} nodes per action dimension give ${k} points per next state, and ${data.count} transitions × ${k} points × ${p} inputs exceed the network path’s budget of ${MAX_NEXT_INPUT_VALUES} values; use fewer quadratureNodes`);
  }
  const n = transitions.length;
  const points = new Float64Array(k * m), nodeWeights = new Float64Array(k);
  const statesPerChunk = Math.max(1, Math.floor(ROWS_PER_CHUNK / k));
  const chunks: NextInputChunk[] = [];
  for (let start = 0; start < n; start += statesPerChunk) {
    const states = Math.min(statesPerChunk, n - start);
    const inputs = new Float32Array(states * k * p), weights = new Float32Array(states * k);
    for (let b = 0; b < states; b++) {
      const i = transitions[start + b];
      // Past a terminal state nothing is bootstrapped: its rows stay at the data mean (zeros) with weight 0.
      if (data.terminal[i] !== 0) continue;
      const count = quadrature.at(data.nextStates, i * ds, points, nodeWeights);
      for (let j = 0; j < k; j++) {
        const node = j < count ? j : 0, row = (b * k + j) * p;
        standardiseInto(data.nextStates, i * ds, 0, ds, standardiser, inputs, row);
        standardiseInto(points, node * m, ds, m, standardiser, inputs, row + ds);
        weights[b * k + j] = j < count ? discount * nodeWeights[j] : 0;
      }
    }
    chunks.push({ states, inputs: tf.tensor2d(inputs, [states * k, p]), weights: tf.tensor2d(weights, [states, k]) });
  }
  return { chunks, pointsPerState: k, dispose: () => chunks.forEach((c) => tf.dispose([c.inputs, c.weights])) };
}
