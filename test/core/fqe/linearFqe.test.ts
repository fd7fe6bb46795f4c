import { describe, expect, it } from 'vitest';
import type { FeatureMap } from '../../../src/core/features/featureMap';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { FqeCancelledError, FqeDataError, FqeOptionsError } from '../../../src/core/fqe/fqeErrors';
import { createLinearActionValue } from '../../../src/core/fqe/linearActionValue';
import { fitLinearFqe, type LinearFqeInput } from '../../../src/core/fqe/linearFqe';
import { createGaussianPolicy } from '../../../src/core/policy';
import type { TransitionSet } from '../../../src/core/transitions';
import { simulateLinearPlant } from './simulatedTransitions';

function plantProblem(): Pick<LinearFqeInput, 'data' | 'policy' | 'features'> {
  const data = simulateLinearPlant({
    dynamics: [0.95, 0.05, 0, 0.9], inputGain: [0.3, 0.1], processNoiseStd: [0.05, 0.05],
    stateWeight: [1, 0, 0, 1], actionWeight: [0.1], behaviourGain: [-0.5, -0.2], behaviourStd: [0.5],
    startStd: 1, episodes: 20, stepsPerEpisode: 100, seed: 3,
  });
  const policy = createGaussianPolicy({ offset: [0], gain: [[-0.8, -0.4]], std: [0.3] }, 2);
  return { data, policy, features: createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2)) };
}

/**
 * Two states with the single feature φ = s (values 1 and 2) and zero rewards: state 1 moves to
 * state 2; state 2 stays with probability 1 − ε and terminates with probability ε. Least squares
 * with equal weight on both states gives w_{k+1} = γ(6 − 4ε)/5 · w_k, so FQE diverges for
 * γ > 5/(6 − 4ε) although the true values (0) are representable. Tsitsiklis & Van Roy (1996),
 * "Feature-based methods for large scale dynamic programming", Machine Learning 22; retold as
 * Example 11.1 of Sutton & Barto, "Reinforcement Learning: An Introduction", 2nd ed. (from memory).
 * The growth factor is re-derived here: minimising (w − 2γw_k)² + (2w − 2γ(1−ε)w_k)² over w.
 */
function twoStateCounterexample(epsilon: number, reward = 0): TransitionSet {
  const rows = 100, count = 2 * rows, terminalRows = Math.round(epsilon * rows);
  const states = new Float64Array(count), nextStates = new Float64Array(count), terminal = new Uint8Array(count);
  for (let i = 0; i < rows; i++) {
    states[i] = 1; nextStates[i] = 2;
    states[rows + i] = 2; nextStates[rows + i] = 2;
    terminal[rows + i] = i < terminalRows ? 1 : 0;
  }
  return {
    count, stateDim: 1, actionDim: 1, stateNames: ['s'], actionNames: ['a'], states, actions: new Float64Array(count),
    rewards: new Float64Array(count).fill(reward), nextStates, terminal, episode: new Int32Array(count), episodeCount: 1,
    startStates: Float64Array.from([1]), sourceLine: Int32Array.from({ length: count }, (_, i) => i + 2),
  };
}

/** φ(s, a) = s: no constant and no action term, as in the counterexample. Not serialisable. */
const stateOnlyFeature: FeatureMap = {
  dim: 1, inputDim: 2, constantIndex: null,
  evaluate(input, inputOffset, out, outOffset) { out[outOffset] = input[inputOffset]; },
  toSpec() { throw new Error('test feature map has no spec'); },
};

const anyPolicy = createGaussianPolicy({ offset: [0], gain: [[0]], std: [1] }, 1);

describe('linear FQE', () => {
  it('iterative and fixed-point solutions agree to 1e-8 relative when converged', () => {
    const fit = fitLinearFqe({ ...plantProblem(), discount: 0.95, ridge: 1e-6, quadratureNodes: 8, tolerance: 1e-13, maxIterations: 5000 });
    expect(fit.status).toBe('converged');
    expect(fit.spectralRadiusBound).toBeLessThan(1);
    const wi = fit.iterative!.q.weights, wf = fit.fixedPoint!.q.weights;
    const diff = Math.hypot(...wi.map((v, i) => v - wf[i])) / Math.hypot(...wf);
    expect(diff).toBeLessThan(1e-8);
    const ji = fit.iterative!.policyValue.value, jf = fit.fixedPoint!.policyValue.value;
    expect(Math.abs(ji - jf) / Math.abs(jf)).toBeLessThan(1e-8);
    expect(fit.fixedPoint!.warning).toBeNull();
    // History: J per iteration is the linear functional of w used for the final estimate.
    expect(fit.history[fit.history.length - 1].policyValue).toBeCloseTo(ji, 8);
  });

  it('diverges on the two-state counterexample with status, message and no NaN', () => {
    const epsilon = 0.1, discount = 0.99, growth = (discount * (6 - 4 * epsilon)) / 5; // 1.1088 > 1
    const fit = fitLinearFqe({
      data: twoStateCounterexample(epsilon), policy: anyPolicy, features: stateOnlyFeature,
      discount, ridge: 0, quadratureNodes: 3, tolerance: 1e-10, maxIterations: 1000, initialWeights: [1],
    });
    expect(fit.status).toBe('diverged');
    expect(fit.message).toMatch(/diverged/);
    expect(fit.message).toMatch(/not a contraction/);
    expect(fit.iterative).toBeNull();
    expect(fit.spectralRadiusBound).toBeCloseTo(growth, 12); // 1×1 iteration matrix: the bound is exact
    const j = fit.history.map((h) => h.policyValue); // J_k = w_k·φ(start = 1) = w_k
    for (let k = 1; k < j.length; k++) expect(j[k] / j[k - 1]).toBeCloseTo(growth, 10);
    for (const h of fit.history) for (const v of Object.values(h)) expect(Number.isFinite(v)).toBe(true);
    // The fixed point (5 − 6γ + 4γε)w = 0 exists and is the true value 0, but is flagged.
    expect(Math.abs(fit.fixedPoint!.q.weights[0])).toBe(0);
    expect(Math.abs(fit.fixedPoint!.policyValue.value)).toBe(0);
    expect(fit.fixedPoint!.warning).toMatch(/diverges/);
    // Growth 1.001 per step: too slow to trip the growth test in 50 iterations, still 'diverged' at the limit.
    const slow = fitLinearFqe({
      data: twoStateCounterexample(epsilon), policy: anyPolicy, features: stateOnlyFeature,
      discount: (1.001 * 5) / (6 - 4 * epsilon), ridge: 0, quadratureNodes: 3, tolerance: 1e-10, maxIterations: 50, initialWeights: [1],
    });
    expect(slow.status).toBe('diverged');
    expect(slow.message).toMatch(/stopped shrinking/);
  });

  it('diverges from w = 0 when the counterexample has rewards, and contracts at a small discount', () => {
    const data = twoStateCounterexample(0.1, -1);
    const common = { data, policy: anyPolicy, features: stateOnlyFeature, ridge: 0, quadratureNodes: 3, tolerance: 1e-12, maxIterations: 2000 };
    expect(fitLinearFqe({ ...common, discount: 0.99 }).status).toBe('diverged');
    const fit = fitLinearFqe({ ...common, discount: 0.8 });
    expect(fit.status).toBe('converged');
    expect(fit.spectralRadiusBound).toBeCloseTo((0.8 * 5.6) / 5, 12); // γ(6 − 4ε)/5 = 0.896
    // Fixed point: w = b/(G − γM) with G = 5/2, M = 2.8, b = −1.5 (hand-computed from the data above).
    expect(fit.fixedPoint!.q.weights[0]).toBeCloseTo(-1.5 / (2.5 - 0.8 * 2.8), 9);
  });

  it('reports progress, honours cancellation, and saves the fitted Q as JSON', () => {
    const problem = plantProblem();
    const passes: number[] = [], iterations: number[] = [];
    const fit = fitLinearFqe({
      ...problem, discount: 0.9, ridge: 1e-4, quadratureNodes: 6, tolerance: 1e-9, maxIterations: 500,
      onDataPass: (done) => passes.push(done), onIteration: (p) => iterations.push(p.iteration),
    });
    expect(passes[passes.length - 1]).toBe(problem.data.count);
    expect(iterations).toEqual(fit.history.map((h) => h.iteration));
    expect(() => fitLinearFqe({ ...problem, discount: 0.9, ridge: 0, quadratureNodes: 6, tolerance: 1e-9, maxIterations: 5, cancel: { aborted: true } }))
      .toThrow(FqeCancelledError);
    let calls = 0;
    expect(() => fitLinearFqe({ ...problem, discount: 0.9, ridge: 0, quadratureNodes: 6, tolerance: 1e-14, maxIterations: 100, cancel: () => ++calls > 2 }))
      .toThrow(FqeCancelledError);
    const q = fit.iterative!.q, again = createLinearActionValue(JSON.parse(JSON.stringify(q.toSpec())));
    const inputs = Float64Array.from([0.3, -0.2, 0.1, 1, 1, -1]), a = new Float64Array(2), b = new Float64Array(2);
    q.evaluate(inputs, 2, a);
    again.evaluate(inputs, 2, b);
    expect(Array.from(b)).toEqual(Array.from(a));
  });

  it('rejects bad options by name and explains a rank-deficient problem', () => {
    const problem = plantProblem();
    const base = { ...problem, discount: 0.9, ridge: 0, quadratureNodes: 6, tolerance: 1e-9, maxIterations: 50 };
    expect(() => fitLinearFqe({ ...base, discount: 1.5 })).toThrow(/discount/);
    expect(() => fitLinearFqe({ ...base, ridge: -1 })).toThrow(FqeOptionsError);
    expect(() => fitLinearFqe({ ...base, maxIterations: 0 })).toThrow(/maxIterations/);
    expect(() => fitLinearFqe({ ...base, initialWeights: [1, 2] })).toThrow(/initialWeights/);
    const flat = { ...problem.data, actions: new Float64Array(problem.data.count).fill(0.5) }; // the action never changes
    const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(flat).spec, 2));
    expect(() => fitLinearFqe({ ...base, data: flat, features })).toThrow(FqeDataError);
    expect(fitLinearFqe({ ...base, data: flat, features, ridge: 1e-6, maxIterations: 2000 }).status).toBe('converged');
  });
});
