/**
 * Average of the parameter vectors of the last k outer iterations (iterate averaging; Polyak &
 * Juditsky, "Acceleration of stochastic approximation by averaging", SIAM J. Control Optim.
 * 1992). Successive iterates are warm-started from one another, so they sit in one basin and
 * their average is a network of the same shape whose minibatch noise is partly averaged out.
 */
import * as tf from '@tensorflow/tfjs';

export interface ParameterAverage {
  /** Keep a copy of θ (the oldest copy is dropped beyond k). */
  add(theta: tf.Tensor1D): void;
  readonly count: number;
  /** A new tensor: the mean of the kept copies. Throws when none are kept. */
  mean(): tf.Tensor1D;
  dispose(): void;
}

export function createParameterAverage(last: number): ParameterAverage {
  const kept: tf.Tensor1D[] = [];
  return {
    add(theta) {
      kept.push(tf.clone(theta));
      if (kept.length > last) kept.shift()!.dispose();
    },
    get count() {
      return kept.length;
    },
    mean() {
      if (kept.length === 0) throw new RangeError('parameter average: no parameters kept yet');
      return tf.tidy(() => (kept.length === 1 ? tf.clone(kept[0]) : tf.div(tf.addN(kept), kept.length)) as tf.Tensor1D);
    },
    dispose() {
      tf.dispose(kept.splice(0));
    },
  };
}
