/**
 * How far a network's action values reach, max |Q|, for the divergence check against
 * FitSession.valueLimit. Q = offset + scale·q is monotone in q, so the extremes of q suffice.
 */
import * as tf from '@tensorflow/tfjs';
import type { FitSession } from './networkFitSession';
import { networkOutput } from './networkForward';
import type { OutputScale } from './networkOutputScale';

/** max |Q| over q ∈ [smallest, largest] (NaN propagates, so the caller's `!(reach <= limit)` catches it). */
export function valueReach(output: OutputScale, smallest: number, largest: number): number {
  const a = Math.abs(output.offset + output.scale * smallest), b = Math.abs(output.offset + output.scale * largest);
  return Number.isNaN(a) || Number.isNaN(b) ? NaN : Math.max(a, b);
}

const ROWS_PER_CALL = 65_536;

/** max |Q| of parameters θ over the data's own (s, a) rows, training and held-out. */
export function valueReachOnInputs(theta: tf.Tensor1D, session: FitSession): number {
  let smallest = Infinity, largest = -Infinity;
  for (const rows of [session.rows.training, session.rows.heldOut]) {
    if (!rows) continue;
    const range = outputRange(theta, session, rows.inputs);
    if (Number.isNaN(range[0]) || Number.isNaN(range[1])) return NaN;
    smallest = Math.min(smallest, range[0]);
    largest = Math.max(largest, range[1]);
  }
  return valueReach(session.output, smallest, largest);
}

/** [min q, max q] over inputs (rows×p), NaN if any output is NaN. */
function outputRange(theta: tf.Tensor1D, session: FitSession, inputs: tf.Tensor2D): [number, number] {
  const n = inputs.shape[0];
  let smallest = Infinity, largest = -Infinity;
  for (let start = 0; start < n; start += ROWS_PER_CALL) {
    const rows = Math.min(ROWS_PER_CALL, n - start);
    const [lo, hi] = tf.tidy(() => {
      const q = networkOutput(theta, session.layout, session.net.activation, tf.slice(inputs, [start, 0], [rows, -1]));
      return tf.stack([tf.min(q), tf.max(q)]).dataSync();
    });
    if (Number.isNaN(lo) || Number.isNaN(hi)) return [NaN, NaN];
    smallest = Math.min(smallest, lo);
    largest = Math.max(largest, hi);
  }
  return [smallest, largest];
}
