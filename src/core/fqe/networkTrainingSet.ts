/**
 * The regression data of network FQE in network units, uploaded once as float32 tensors:
 * standardised inputs z = [s, a] and the reward part of each target, for the training rows and
 * (when episodes are held out) the held-out rows. With Q = offset + scale·q (networkOutputScale.ts)
 * the target y = r + γ(1 − done)·E_{a'~π} Q(s', a') becomes, in network units,
 *   t = (y − offset)/scale = base + γ(1 − done)·E_{a'~π} q(s', a'),
 *   base = (r − offset·(1 − γ(1 − done)))/scale,
 * so the per-iteration work is only the expectation (networkNextInputs.ts).
 *
 * Shapes: inputs rows×p (p = ds + m) row-major, base rows.
 */
import * as tf from '@tensorflow/tfjs';
import type { TransitionSet } from '../transitions';
import type { EpisodeSplit } from './networkEpisodeSplit';
import type { OutputScale } from './networkOutputScale';

export interface InputStandardiser {
  readonly mean: Float64Array; // p
  readonly scale: Float64Array; // p, > 0
}

export interface RegressionRows {
  readonly transitions: Int32Array; // rows: indices into the data, in row order
  readonly inputs: tf.Tensor2D; // rows×p
  readonly base: tf.Tensor1D; // rows
}

export interface NetworkTrainingSet {
  readonly training: RegressionRows;
  readonly heldOut: RegressionRows | null;
  dispose(): void;
}

export function createTrainingSet(
  data: TransitionSet, split: EpisodeSplit, standardiser: InputStandardiser, output: OutputScale, discount: number,
): NetworkTrainingSet {
  const training = regressionRows(data, split.order.subarray(0, split.trainingCount), standardiser, output, discount);
  const heldOut = split.heldOutCount > 0 ? regressionRows(data, split.order.subarray(split.trainingCount), standardiser, output, discount) : null;
  return {
    training, heldOut,
    dispose: () => tf.dispose([training.inputs, training.base, ...(heldOut ? [heldOut.inputs, heldOut.base] : [])]),
  };
}

function regressionRows(
  data: TransitionSet, transitions: Int32Array, standardiser: InputStandardiser, output: OutputScale, discount: number,
): RegressionRows {
  const rows = transitions.length, ds = data.stateDim, m = data.actionDim, p = ds + m;
  const inputs = new Float32Array(rows * p), base = new Float32Array(rows);
  for (let row = 0; row < rows; row++) {
    const i = transitions[row];
    standardiseInto(data.states, i * ds, 0, ds, standardiser, inputs, row * p);
    standardiseInto(data.actions, i * m, ds, m, standardiser, inputs, row * p + ds);
    const continuation = discount * (1 - data.terminal[i]);
    base[row] = (data.rewards[i] - output.offset * (1 - continuation)) / output.scale;
  }
  return { transitions, inputs: tf.tensor2d(inputs, [rows, p]), base: tf.tensor1d(base) };
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
