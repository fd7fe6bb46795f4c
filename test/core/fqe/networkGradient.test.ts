/**
 * The hand-written backpropagation of networkGradient.ts against TensorFlow.js's own automatic
 * differentiation (tf.grad over the same forward pass, an independent general-purpose
 * implementation), on both backends and for every activation.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import * as tf from '@tensorflow/tfjs';
import { lossAndGradient } from '../../../src/core/fqe/networkGradient';
import { forwardPass } from '../../../src/core/fqe/networkForward';
import { multiplyAddsPerRow, networkLayout } from '../../../src/core/fqe/networkParameters';
import { relativeDifference } from '../../../src/core/fqe/tfBackendCheck';
import { loadBackend } from '../../../src/core/fqe/tfBackend';
import { wasmDirectory } from './networkTestEnvironment';

const layout = networkLayout(4, [24, 12]);

beforeAll(async () => {
  expect(await loadBackend('wasm', wasmDirectory)).toBeNull();
});

describe('network parameter layout', () => {
  it('packs W then b per layer, output layer last', () => {
    // 4·24 + 24 + 24·12 + 12 + 12·1 + 1 parameters (fully connected layers; counted by hand).
    expect(layout.size).toBe(96 + 24 + 288 + 12 + 12 + 1);
    expect(layout.layers.map((l) => [l.inputs, l.units])).toEqual([[4, 24], [24, 12], [12, 1]]);
    expect(layout.layers[1].weightOffset).toBe(120);
    expect(multiplyAddsPerRow(layout)).toBe(96 + 288 + 12);
  });
});

describe.each(['cpu', 'wasm'])('backpropagation on %s equals TF.js autodiff', (backend) => {
  it.each(['relu', 'tanh', 'elu'] as const)('%s network', async (activation) => {
    await tf.setBackend(backend);
    const start = tf.memory().numTensors;
    tf.tidy(() => {
      const theta = tf.randomNormal([layout.size], 0, 0.3, 'float32', 11) as tf.Tensor1D;
      const x = tf.randomNormal([40, 4], 0, 1, 'float32', 12) as tf.Tensor2D;
      const t = tf.randomNormal([40, 1], 0, 1, 'float32', 13) as tf.Tensor2D;
      const mine = lossAndGradient(theta, layout, activation, x, t);
      const meanSquare = (p: tf.Tensor) => tf.mean(tf.square(tf.sub(forwardPass(p as tf.Tensor1D, layout, activation, x).output, t)));
      const reference = tf.grad(meanSquare)(theta);
      // Same float32 operations up to summation order: differences are rounding (see tfBackendCheck.ts).
      expect(relativeDifference(mine.gradient.dataSync() as Float32Array, reference.dataSync() as Float32Array)).toBeLessThan(1e-5);
      expect(mine.loss.dataSync()[0]).toBeCloseTo(meanSquare(theta).dataSync()[0], 5);
    });
    expect(tf.memory().numTensors).toBe(start);
  });
});
