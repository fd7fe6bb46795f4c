/**
 * The hidden features of the current network over the training rows, h_i = h_L(z_i), and their
 * discounted policy average at the next state, ψ_i = γ(1 − done_i)·Σ_j ω_ij h_L(s'_i, a'_ij), by the
 * fixed next-state quadrature rows of networkNextInputs.ts (whose weights already carry γ and
 * the terminal mask). One forward pass over the n·K next rows and the n rows per outer iteration;
 * the last-layer solve, the regression targets and J all reuse these two matrices.
 *
 * Shapes: hidden and nextHidden n×dh (dh = units of the last hidden layer), float32 tensors.
 */
import * as tf from '@tensorflow/tfjs';
import { hiddenFeatures } from './networkForward';
import type { NextInputs } from './networkNextInputs';
import type { NetworkLayout } from './networkParameters';
import type { NetworkActivation } from './networkSettings';

export interface HiddenFeatureRows {
  readonly hidden: tf.Tensor2D; // n×dh
  readonly nextHidden: tf.Tensor2D; // n×dh, discounted and policy-averaged
  dispose(): void;
}

/**
 * Training rows per forward call: one call for logs up to this size. Measured on wasm: slices and
 * concatenations copy element by element, so one large call beats several small ones, while
 * activations of several hundred thousand rows make the heap grow and slow everything down.
 */
const ROWS_PER_CALL = 131_072;

export function hiddenFeatureRows(
  theta: tf.Tensor1D, layout: NetworkLayout, activation: NetworkActivation, rows: tf.Tensor2D, next: NextInputs,
): HiddenFeatureRows {
  const n = rows.shape[0], k = next.pointsPerState;
  const hidden = tf.tidy(() => {
    const parts: tf.Tensor2D[] = [];
    for (let start = 0; start < n; start += ROWS_PER_CALL) {
      parts.push(hiddenFeatures(theta, layout, activation, tf.slice(rows, [start, 0], [Math.min(ROWS_PER_CALL, n - start), -1])));
    }
    return parts.length === 1 ? parts[0] : (tf.concat(parts, 0) as tf.Tensor2D);
  });
  const nextHidden = tf.tidy(() => {
    const parts = next.chunks.map((chunk) => {
      const h = hiddenFeatures(theta, layout, activation, chunk.inputs); // (states·K)×dh
      const dh = h.shape[1];
      // Σ_j W_bj h_bj: weights states×K broadcast over the feature axis.
      return tf.sum(tf.mul(tf.reshape(h, [chunk.states, k, dh]), tf.reshape(chunk.weights, [chunk.states, k, 1])), 1) as tf.Tensor2D;
    });
    return parts.length === 1 ? parts[0] : (tf.concat(parts, 0) as tf.Tensor2D);
  });
  return { hidden, nextHidden, dispose: () => tf.dispose([hidden, nextHidden]) };
}
