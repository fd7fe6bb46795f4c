/**
 * Seeded minibatches for the Adam steps: each epoch visits the training rows in a fresh random
 * order (sampling without replacement, common practice for stochastic gradient methods; Bottou,
 * "Stochastic gradient descent tricks", 2012), drawn by Fisher–Yates from the fit's RandomSource
 * (Knuth, TAOCP Vol. 2, §3.4.2, Algorithm P). The permuted copy is gathered once per epoch, so a
 * step only slices B consecutive rows. A final partial batch is dropped. The epoch runs on across
 * outer iterations; when the targets change, the new targets are gathered in the current order.
 * With cumulative weights (networkRunEmphasis.ts) an epoch is instead `rows` draws with replacement,
 * each row with probability equal to its weight (inverse-CDF sampling by bisection).
 */
import * as tf from '@tensorflow/tfjs';
import type { RandomSource } from '../random';

export interface Minibatch {
  readonly inputs: tf.Tensor2D; // B×p
  readonly targets: tf.Tensor2D; // B×1
}

export interface MinibatchStream {
  readonly batchSize: number; // B = min(requested, rows)
  /** Targets of the training rows (rows; not taken over: keep it alive until the next call or dispose). */
  setTargets(targets: tf.Tensor1D): void;
  /** The next batch; the caller disposes it. */
  next(): Minibatch;
  dispose(): void;
}

/** inputs: rows×p training inputs (not taken over); cumulative: rows weights' running sum ending at 1, or null for uniform epochs. */
export function createMinibatchStream(inputs: tf.Tensor2D, batchSize: number, rng: RandomSource, cumulative: Float64Array | null = null): MinibatchStream {
  const rows = inputs.shape[0], b = Math.min(batchSize, rows);
  const order = Int32Array.from({ length: rows }, (_, i) => i);
  let orderT: tf.Tensor1D | null = null, shuffledInputs: tf.Tensor2D | null = null, shuffledTargets: tf.Tensor2D | null = null;
  let source: tf.Tensor1D | null = null, cursor = rows;
  const gatherTargets = (): void => {
    shuffledTargets?.dispose();
    shuffledTargets = source && orderT ? tf.keep(tf.tidy(() => tf.reshape(tf.gather(source!, orderT!), [rows, 1]) as tf.Tensor2D)) : null;
  };
  const reshuffle = (): void => {
    if (cumulative) drawWeighted(order, cumulative, rng);
    else for (let i = rows - 1; i > 0; i--) {
      const j = rng.integer(i + 1);
      const swap = order[i];
      order[i] = order[j];
      order[j] = swap;
    }
    orderT?.dispose();
    shuffledInputs?.dispose();
    // tf.keep: next() is called inside the training step's tf.tidy, which must not free the epoch's copies.
    orderT = tf.keep(tf.tensor1d(order, 'int32'));
    shuffledInputs = tf.keep(tf.gather(inputs, orderT));
    gatherTargets();
    cursor = 0;
  };
  return {
    batchSize: b,
    setTargets(targets) {
      source = targets;
      gatherTargets();
    },
    next() {
      if (cursor + b > rows) reshuffle();
      if (!shuffledTargets || !shuffledInputs) throw new RangeError('minibatches: setTargets must be called before next()');
      const start = cursor;
      cursor += b;
      return { inputs: tf.slice(shuffledInputs, [start, 0], [b, -1]), targets: tf.slice(shuffledTargets, [start, 0], [b, 1]) };
    },
    dispose() {
      for (const t of [orderT, shuffledInputs, shuffledTargets]) t?.dispose();
      orderT = shuffledInputs = shuffledTargets = null;
      source = null;
    },
  };
}

/** order[k] = a row drawn with probability ∝ its weight (cumulative: rows, increasing, last = 1): inverse CDF by bisection. */
function drawWeighted(order: Int32Array, cumulative: Float64Array, rng: RandomSource): void {
  for (let k = 0; k < order.length; k++) {
    const u = rng.uniform();
    let lo = 0, hi = cumulative.length - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (cumulative[mid] < u) lo = mid + 1;
      else hi = mid;
    }
    order[k] = lo;
  }
}
