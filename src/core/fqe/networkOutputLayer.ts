/**
 * The last layer of the network's action value, Q(z) = φ(z)ᵀ·linear + h(z)ᵀ·hidden, and its place
 * in θ: the network's own output is f = hᵀw + b with Q = φᵀw1 + scale·f, so hidden = scale·w and
 * the bias folds into the quadratic part's constant (feature 0): linear = w1 + scale·b·e₀.
 */
import * as tf from '@tensorflow/tfjs';
import type { NetworkLayout } from './networkParameters';

export interface LastLayer {
  readonly linear: Float64Array; // d1, on φ
  readonly hidden: Float64Array; // dh, on h
}

function outputSlot(layout: NetworkLayout) {
  return layout.layers[layout.layers.length - 1];
}

/** The last layer θ holds now, on top of the quadratic part's weights w1. */
export function currentWeights(theta: tf.Tensor1D, layout: NetworkLayout, w1: Float64Array, scale: number): LastLayer {
  const slot = outputSlot(layout), values = theta.dataSync();
  const hidden = Float64Array.from(values.subarray(slot.weightOffset, slot.weightOffset + slot.inputs), (w) => scale * w);
  const linear = Float64Array.from(w1);
  linear[0] += scale * values[slot.biasOffset];
  return { linear, hidden };
}

/** Write hidden/scale into the output weights of θ and 0 into its bias (θ is a variable). */
export function setOutputLayer(theta: tf.Variable<tf.Rank.R1> | tf.Tensor1D, layout: NetworkLayout, lastLayer: LastLayer, scale: number): void {
  if (!(theta instanceof tf.Variable)) throw new TypeError('setOutputLayer: θ must be a tf.Variable');
  const slot = outputSlot(layout), values = Float32Array.from(theta.dataSync());
  for (let j = 0; j < slot.inputs; j++) values[slot.weightOffset + j] = lastLayer.hidden[j] / scale;
  values[slot.biasOffset] = 0;
  tf.tidy(() => theta.assign(tf.tensor1d(values)));
}
