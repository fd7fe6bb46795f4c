/**
 * The regression data of network FQE in network units, uploaded once as float32 tensors:
 * standardised inputs z = [s, a] of every transition (training rows first, then held-out rows)
 * and the reward part of each target. With Q = offset + scale·q (networkOutputScale.ts) the
 * target y = r + γ(1 − done)·E_{a'~π} Q(s', a') becomes, in network units,
 *   t = (y − offset)/scale = base + γ(1 − done)·E_{a'~π} q(s', a'),
 *   base = (r − offset·(1 − γ(1 − done)))/scale,
 * so the per-iteration work is only the expectation (networkNextInputs.ts).
 *
 * Shapes: inputs n×p (p = ds + m) row-major, base n.
 */
import * as tf from '@tensorflow/tfjs';
import type { TransitionSet } from '../transitions';
import type { OutputScale } from './networkOutputScale';

export interface InputStandardiser {
  readonly mean: Float64Array; // p
  readonly scale: Float64Array; // p, > 0
}

export interface NetworkTrainingSet {
  readonly inputs: tf.Tensor2D; // n×p, rows in split order
  readonly base: tf.Tensor1D; // n
  readonly trainingCount: number;
  readonly heldOutCount: number;
  dispose(): void;
}

export function createTrainingSet(
  data: TransitionSet, order: Int32Array, trainingCount: number, standardiser: InputStandardiser, output: OutputScale, discount: number,
): NetworkTrainingSet {
  const n = data.count, ds = data.stateDim, m = data.actionDim, p = ds + m;
  const inputs = new Float32Array(n * p), base = new Float32Array(n);
  for (let row = 0; row < n; row++) {
    const i = order[row];
    standardiseInto(data.states, i * ds, 0, ds, standardiser, inputs, row * p);
    standardiseInto(data.actions, i * m, ds, m, standardiser, inputs, row * p + ds);
    const continuation = discount * (1 - data.terminal[i]);
    base[row] = (data.rewards[i] - output.offset * (1 - continuation)) / output.scale;
  }
  const inputsT = tf.tensor2d(inputs, [n, p]), baseT = tf.tensor1d(base);
  return {
    inputs: inputsT, base: baseT, trainingCount, heldOutCount: n - trainingCount,
    dispose: () => tf.dispose([inputsT, baseT]),
  };
}

/**
 * out[outOffset + c] = (source[sourceOffset + c] − mean[column + c]) / scale[column + c] for c < width:
 * `column` is where these values sit among the p standardiser columns (states 0…ds−1, then actions).
 */
export function standardiseInto(
  source: ArrayLike<number>, sourceOffset: number, column: number, width: number,
  standardiser: InputStandardiser, out: Float32Array, outOffset: number,
): void {
  for (let c = 0; c < width; c++) {
    out[outOffset + c] = (source[sourceOffset + c] - standardiser.mean[column + c]) / standardiser.scale[column + c];
  }
}
