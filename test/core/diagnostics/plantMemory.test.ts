/**
 * The plant-memory check (src/core/diagnostics/plantMemory.ts) against outside references:
 *   - a hand-built dead-time series x_{t+1} = φx_t + b·a_{t−1} + e, a and e white and Gaussian: x_t
 *     is built from a_{t−2} and earlier, so it is independent of a_{t−1}, and the base regression on
 *     (x_t, a_t) leaves b²σ_a² + σ_e² while a_{t−1} leaves σ_e²: the partial R² is
 *     b²σ_a²/(b²σ_a² + σ_e²) (closed form, by the independence above; ours);
 *   - the same check's RSS₀, RSS₁, partial R² and F recomputed from the explicit design matrices with
 *     ml-matrix's Householder QR least squares, and F by the textbook formula for nested linear
 *     models, F = ((RSS₀ − RSS₁)/q)/(RSS₁/(N − p − q)) (Seber & Lee, "Linear Regression Analysis",
 *     2nd ed., 2003, §4.3; from memory);
 *   - a Markov AR(1) (b = 0): the partial R² stays near its chance level q/(N − p) (the mean of a
 *     Beta(q/2, (N − p − q)/2) variable under the null; from memory).
 */
import { Matrix, QrDecomposition } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { plantMemory, usableRows, type MemoryData } from '../../../src/core/diagnostics/plantMemory';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { createRandom } from '../../../src/core/random';

/** runs × steps rows of x_{t+1} = φx_t + b·a_{t−delay} + σ_e·e, a ~ N(0, 1); one state, one action. */
function deadTimeSeries(o: { phi: number; b: number; noise: number; delay: number; runs: number; steps: number; seed: number }): MemoryData {
  const rng = createRandom(o.seed), n = o.runs * o.steps;
  const states = new Float64Array(n), actions = new Float64Array(n), nextStates = new Float64Array(n), episode = new Int32Array(n);
  for (let e = 0, i = 0; e < o.runs; e++) {
    const past = Array.from({ length: o.delay + 1 }, () => rng.normal());
    let x = rng.normal();
    for (let t = 0; t < o.steps; t++, i++) {
      past.unshift(rng.normal());
      past.length = o.delay + 1;
      states[i] = x;
      actions[i] = past[0];
      x = o.phi * x + o.b * past[o.delay] + o.noise * rng.normal();
      nextStates[i] = x;
      episode[i] = e;
    }
  }
  return { count: n, stateDim: 1, actionDim: 1, states, actions, nextStates, episode, terminal: new Uint8Array(n) };
}

function check(data: MemoryData, degree: number, lags: number, maxRows = 1e9) {
  const standardiser = fitStateActionStandardiser(data).spec;
  return plantMemory(data, { features: createFeatureMap(polynomialFeatureSpec(standardiser, degree)), standardiser, lags, maxRows });
}

describe('plant memory: the nested regression on earlier rows', () => {
  it('finds the closed-form partial R² of a one-step dead time, and names the action one row back', () => {
    const b = 0.8, noise = 0.6, expected = (b * b) / (b * b + noise * noise); // 0.64 / 1.0
    const result = check(deadTimeSeries({ phi: 0.7, b, noise, delay: 1, runs: 200, steps: 500, seed: 5 }), 1, 3);
    if ('reason' in result) throw new Error(result.reason);
    const c = result.components[0];
    // Sampling sd of a partial R² near 0.64 at N ≈ 10⁵: √(4ρ²(1 − ρ²)²/N) ≈ 0.002 (from memory); 5 sd.
    expect(c.partialRSquared).toBeCloseTo(expected, 1);
    expect(Math.abs(c.partialRSquared - expected)).toBeLessThan(0.01);
    expect(c.strongest).toMatchObject({ kind: 'action', index: 0, lag: 1 });
    expect(c.numeratorDf).toBe(6);
  });

  it('agrees with ml-matrix QR least squares on the explicit nested designs, F by the textbook formula', () => {
    const data = deadTimeSeries({ phi: 0.5, b: 0.3, noise: 1, delay: 2, runs: 6, steps: 60, seed: 8 });
    const lags = 2, result = check(data, 2, lags);
    if ('reason' in result) throw new Error(result.reason);
    const rows = usableRows(data, lags);
    expect(rows.length).toBe(6 * 58);
    const base = rows.map((i) => [1, data.states[i], data.actions[i], data.states[i] ** 2, data.states[i] * data.actions[i], data.actions[i] ** 2]);
    const full = rows.map((i, r) => [...base[r], data.states[i - 1], data.actions[i - 1], data.states[i - 2], data.actions[i - 2]]);
    const y = rows.map((i) => data.nextStates[i] - data.states[i]);
    const rss = (design: number[][]) => {
      const x = new Matrix(design), beta = new QrDecomposition(x).solve(Matrix.columnVector(y));
      const residual = Matrix.columnVector(y).sub(x.mmul(beta));
      return residual.dot(residual);
    };
    const rss0 = rss(base), rss1 = rss(full), n = rows.length, p = 6, q = 4;
    const c = result.components[0];
    expect(c.partialRSquared).toBeCloseTo((rss0 - rss1) / rss0, 10);
    expect(c.fStatistic / (((rss0 - rss1) / q) / (rss1 / (n - p - q)))).toBeCloseTo(1, 9);
    expect(c.denominatorDf).toBe(n - p - q);
  });

  it('stays near its chance level on a Markov AR(1) with a white action', () => {
    const result = check(deadTimeSeries({ phi: 0.9, b: 0, noise: 1, delay: 0, runs: 100, steps: 200, seed: 3 }), 2, 8);
    if ('reason' in result) throw new Error(result.reason);
    const c = result.components[0], chance = c.numeratorDf / (c.numeratorDf + c.denominatorDf);
    // Under the null the partial R² is Beta(q/2, (N − p − q)/2): mean ≈ q/N, sd ≈ √(2q)/N (from memory); 5 sd.
    expect(c.partialRSquared).toBeLessThan(chance + (5 * Math.sqrt(2 * c.numeratorDf)) / c.denominatorDf);
  });

  it('reads only earlier rows of the same, unbroken run, and leaves a collinear column out of q', () => {
    const data = deadTimeSeries({ phi: 0.5, b: 0.5, noise: 1, delay: 1, runs: 3, steps: 10, seed: 1 });
    expect(usableRows(data, 3)).toEqual([3, 4, 5, 6, 7, 8, 9, 13, 14, 15, 16, 17, 18, 19, 23, 24, 25, 26, 27, 28, 29]);
    const broken = { ...data, nextStates: Float64Array.from(data.nextStates, (v, i) => (i === 5 ? v + 1 : v)) };
    expect(usableRows(broken, 3).slice(0, 4)).toEqual([3, 4, 5, 9]);
    // Next-state columns printed to 8 significant digits still chain.
    const printed = { ...data, nextStates: Float64Array.from(data.nextStates, (v) => Number(v.toPrecision(8))) };
    expect(usableRows(printed, 3)).toEqual(usableRows(data, 3));
    // A controller without dither: the action is exactly −0.5·x, so the earlier actions add nothing the earlier states do not.
    const noDither = { ...deadTimeSeries({ phi: 0.5, b: 0, noise: 1, delay: 0, runs: 20, steps: 100, seed: 2 }) };
    const actions = Float64Array.from(noDither.states, (x) => -0.5 * x);
    const result = check({ ...noDither, actions }, 1, 2);
    if ('reason' in result) throw new Error(result.reason);
    expect(result.components[0].numeratorDf).toBe(2);
  });

  it('says why it cannot run on runs shorter than the lags', () => {
    const result = check(deadTimeSeries({ phi: 0.5, b: 0.5, noise: 1, delay: 1, runs: 50, steps: 4, seed: 1 }), 2, 8);
    expect(result).toHaveProperty('reason');
  });
});
