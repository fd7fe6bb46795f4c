/**
 * The parameters of a fully connected Q-network as one flat float32 vector θ, so that Adam,
 * snapshots, weight averaging and copies each take one tensor operation rather than one per layer.
 *
 * Layout (row-major): for each dense layer l = 1 … L+1, W_l (inputs×units) then b_l (units); the
 * last layer is the linear output (units = 1). Network: h_0 = x, h_l = σ(h_{l−1}W_l + b_l) for the
 * hidden layers, q = h_L W_{L+1} + b_{L+1}.
 */
import * as tf from '@tensorflow/tfjs';
import type { RandomSource } from '../random';
import type { NetworkActivation } from './networkSettings';

export interface DenseLayerSlot {
  readonly inputs: number;
  readonly units: number;
  readonly weightOffset: number; // W_l: inputs×units, row-major, at θ[weightOffset …)
  readonly biasOffset: number; // b_l: units
}

export interface NetworkLayout {
  readonly inputDim: number; // p = ds + m
  readonly layers: readonly DenseLayerSlot[]; // hidden layers, then the output layer (units 1)
  readonly size: number; // length of θ
}

export function networkLayout(inputDim: number, hiddenLayers: readonly number[]): NetworkLayout {
  const layers: DenseLayerSlot[] = [];
  let inputs = inputDim, offset = 0;
  for (const units of [...hiddenLayers, 1]) {
    layers.push({ inputs, units, weightOffset: offset, biasOffset: offset + inputs * units });
    offset += inputs * units + units;
    inputs = units;
  }
  return { inputDim, layers, size: offset };
}

/** Multiply–adds of one forward pass per input row (the dense layers' matrix products). */
export function multiplyAddsPerRow(layout: NetworkLayout): number {
  return layout.layers.reduce((sum, l) => sum + l.inputs * l.units, 0);
}

/**
 * θ_0: hidden weights from TF.js's seeded initialisers — He uniform for relu and elu (He et al.,
 * "Delving deep into rectifiers", 2015), Glorot uniform for tanh (Glorot & Bengio, 2010) — and
 * zero biases. The output layer starts at zero so that Q_0 is exactly the output offset (a
 * constant), not random noise that the first iterations would have to wash out at rate γ^k.
 */
export function initialParameters(layout: NetworkLayout, activation: NetworkActivation, rng: RandomSource): Float32Array {
  const theta = new Float32Array(layout.size);
  const hidden = layout.layers.slice(0, -1);
  for (const layer of hidden) {
    // Seeds drawn from the fit's stream, so one fit seed fixes every layer (TF.js uses seedrandom's alea).
    const seed = rng.integer(2 ** 31);
    const init = activation === 'tanh' ? tf.initializers.glorotUniform({ seed }) : tf.initializers.heUniform({ seed });
    const weights = init.apply([layer.inputs, layer.units], 'float32');
    theta.set(weights.dataSync(), layer.weightOffset);
    weights.dispose();
  }
  return theta;
}

/** Per-layer views of θ as tensors (W_l: inputs×units, b_l: units). Call inside tf.tidy. */
export function unpackParameters(theta: tf.Tensor1D, layout: NetworkLayout): { weights: tf.Tensor2D[]; biases: tf.Tensor1D[] } {
  const sizes = layout.layers.flatMap((l) => [l.inputs * l.units, l.units]);
  const parts = tf.split(theta, sizes);
  const weights = layout.layers.map((l, i) => tf.reshape(parts[2 * i], [l.inputs, l.units]) as tf.Tensor2D);
  const biases = layout.layers.map((_, i) => parts[2 * i + 1] as tf.Tensor1D);
  return { weights, biases };
}
