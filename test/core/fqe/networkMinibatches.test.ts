/**
 * The Adam minibatches: uniform epochs visit every row once (sampling without replacement, common
 * practice; Bottou 2012), and weighted epochs (networkRunEmphasis.ts) draw rows in proportion to
 * their weights. The weighted check compares draw counts with their binomial expectation
 * n·p ± 4·sqrt(n·p·(1 − p)) (a textbook bound; a failure by chance has probability below 1e-4 per row).
 */
import * as tf from '@tensorflow/tfjs';
import { describe, expect, it } from 'vitest';
import { createMinibatchStream } from '../../../src/core/fqe/networkMinibatches';
import { runStartEmphasis } from '../../../src/core/fqe/networkRunEmphasis';
import { createRandom } from '../../../src/core/random';
import { simulateTankLevels } from '../../../sample-projects/tank-levels/simulate';
import { tankLogTransitions } from './simulatedTransitions';

/** Row indices of `batches` draws of size b: inputs hold their own row number. */
function drawnRows(rows: number, b: number, batches: number, cumulative: Float64Array | null): number[] {
  return tf.tidy(() => {
    const inputs = tf.tensor2d(Float32Array.from({ length: rows }, (_, i) => i), [rows, 1]);
    const stream = createMinibatchStream(inputs, b, createRandom(7), cumulative);
    stream.setTargets(tf.zeros([rows]) as tf.Tensor1D);
    const out: number[] = [];
    for (let k = 0; k < batches; k++) out.push(...stream.next().inputs.dataSync());
    stream.dispose();
    return out;
  });
}

describe('minibatch stream', () => {
  it('uniform: each epoch of 10 batches of 10 visits all 100 rows once', async () => {
    await tf.setBackend('cpu');
    const drawn = drawnRows(100, 10, 20, null);
    for (const epoch of [drawn.slice(0, 100), drawn.slice(100)]) expect([...epoch].sort((a, b) => a - b)).toEqual(Array.from({ length: 100 }, (_, i) => i));
  });

  it('weighted: rows are drawn in proportion to their weights', async () => {
    await tf.setBackend('cpu');
    const weights = [0.5, 0.25, 0.125, 0.0625, 0.0625];
    const cumulative = Float64Array.from(weights.map((_, i) => weights.slice(0, i + 1).reduce((a, b) => a + b, 0)));
    const drawn = drawnRows(5, 5, 4_000, cumulative), n = drawn.length;
    weights.forEach((p, row) => {
      const count = drawn.filter((r) => r === row).length;
      expect(Math.abs(count - n * p)).toBeLessThan(4 * Math.sqrt(n * p * (1 - p)));
    });
  });
});

describe('runStartEmphasis', () => {
  const log = simulateTankLevels({ runs: 4, stepsPerRun: 11, seed: 5 });
  const data = tankLogTransitions(log.rows, log.rowCount); // 4 runs × 10 transitions
  const all = Int32Array.from({ length: data.count }, (_, i) => i);

  it('is off (null) for ρ = 0', () => {
    expect(runStartEmphasis(data, all, 0.9, 0)).toBeNull();
  });

  it('weights row t of a run (1 − ρ)/n + ρ·γ^t/Σγ^t, summing to 1 (geometric series)', () => {
    const gamma = 0.9, rho = 0.4, c = runStartEmphasis(data, all, gamma, rho)!;
    const w = Array.from(c, (x, i) => x - (i > 0 ? c[i - 1] : 0));
    const perRun = (1 - gamma ** 10) / (1 - gamma); // Σ_{t<10} γ^t
    for (let i = 0; i < data.count; i++) {
      const t = i % 10;
      expect(w[i]).toBeCloseTo((1 - rho) / 40 + (rho * gamma ** t) / (4 * perRun), 12);
    }
    expect(c[c.length - 1]).toBe(1);
  });
});
