/**
 * Forward pass of the Q-network in network units (before the output scaling of networkOutputScale):
 * h_0 = x, h_l = σ(h_{l−1}W_l + b_l), q = h_L W_{L+1} + b_{L+1}.
 *
 * Outside a gradient tape TF.js runs tf.fused.matMul as one kernel (product, bias and activation);
 * training does its own backpropagation (networkGradient.ts), so it uses the same fused pass. The
 * wasm backend cannot fuse tanh, so tanh is applied as a separate op on every backend.
 *
 * Shapes: x: rows×p, each h_l: rows×units_l, q: rows×1.
 */
import * as tf from '@tensorflow/tfjs';
import { unpackParameters, type NetworkLayout } from './networkParameters';
import type { NetworkActivation } from './networkSettings';

export interface ForwardPass {
  /** h_0 = x, h_1, …, h_L (kept for backpropagation). */
  readonly activations: tf.Tensor2D[];
  readonly output: tf.Tensor2D; // q: rows×1
  readonly weights: tf.Tensor2D[];
}

/** All layer outputs. Call inside tf.tidy. */
export function forwardPass(theta: tf.Tensor1D, layout: NetworkLayout, activation: NetworkActivation, x: tf.Tensor2D): ForwardPass {
  const { weights, biases } = unpackParameters(theta, layout);
  const activations: tf.Tensor2D[] = [x];
  const hidden = layout.layers.length - 1;
  for (let l = 0; l < hidden; l++) activations.push(denseLayer(activations[l], weights[l], biases[l], activation));
  const output = tf.fused.matMul({ a: activations[hidden], b: weights[hidden], bias: biases[hidden] }) as tf.Tensor2D;
  return { activations, output, weights };
}

/** q = f_θ(x) only: rows×1. Call inside tf.tidy. */
export function networkOutput(theta: tf.Tensor1D, layout: NetworkLayout, activation: NetworkActivation, x: tf.Tensor2D): tf.Tensor2D {
  return forwardPass(theta, layout, activation, x).output;
}

function denseLayer(h: tf.Tensor2D, w: tf.Tensor2D, b: tf.Tensor1D, activation: NetworkActivation): tf.Tensor2D {
  if (activation === 'tanh') return tf.tanh(tf.fused.matMul({ a: h, b: w, bias: b })) as tf.Tensor2D;
  return tf.fused.matMul({ a: h, b: w, bias: b, activation }) as tf.Tensor2D;
}

/** h_L, the last hidden layer's output (rows×units_L): the features the output layer is linear in. Call inside tf.tidy. */
export function hiddenFeatures(theta: tf.Tensor1D, layout: NetworkLayout, activation: NetworkActivation, x: tf.Tensor2D): tf.Tensor2D {
  const { weights, biases } = unpackParameters(theta, layout);
  let h = x;
  for (let l = 0; l < layout.layers.length - 1; l++) h = denseLayer(h, weights[l], biases[l], activation);
  return h;
}
