/**
 * The per-project choice of the network's polynomial degree (src/core/fqe/networkDegreeChoice.ts),
 * checked where the right degree is known exactly:
 *   - linear-quadratic battery plants logged under a linear controller with Gaussian dither: the
 *     present controller's action value is exactly quadratic in (s, a) (the closed form of
 *     src/core/lq.ts; Bradtke & Barto, "Linear least-squares algorithms for temporal difference
 *     learning", Machine Learning 1996 — from memory), so degree 2 holds the truth and degree 4 can
 *     only add estimation noise: the rule must keep degree 2 (it picks 4 only beyond two standard
 *     errors, so a false pick has about a 2 % chance per log under the null; the seeds are fixed);
 *   - a one-state plant with linear dynamics, Gaussian noise and a quartic cost r = −s⁴, logged under
 *     a linear controller: every moment of a Gaussian is a polynomial in its mean of the same degree
 *     (E[(m + w)⁴] = m⁴ + 6m²σ² + 3σ⁴; common practice), so the action value is exactly a quartic in
 *     (s, a) and no quadratic holds it: the rule must pick degree 4.
 */
import { describe, expect, it } from 'vitest';
import { CHOICE_STANDARD_ERRORS, chooseLinearPartDegree, chooseLinearPartDegreeOnce } from '../../../src/core/fqe/networkDegreeChoice';
import { foldLstdSums } from '../../../src/core/fqe/degreeChoiceSums';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { DEGREE_CHOICE_MAX_FEATURES } from '../../../src/core/limits';
import type { TransitionSet } from '../../../src/core/transitions';
import { batteryPlant } from '../../battery/catalogue';
import { quarticCostLog } from './quarticCostLog';

describe('choice of the polynomial part\'s degree from held-out returns of the present controller', () => {
  it.each([
    ['lq2-vessel-g0.90', 'steady', 1], ['lq2-vessel-g0.90', 'wide', 2], ['lq3-oven-g0.97', 'steady', 1], ['lq3-oven-g0.97', 'wide', 1],
  ] as const)('keeps degree 2 on %s (runs logged %s, seed %i), where the present controller\'s Q is exactly quadratic', (name, runStarts, seed) => {
    const plant = batteryPlant(name), data = plant.simulate({ transitions: 100_000, seed, runStarts });
    const choice = chooseLinearPartDegree({ data, discount: plant.discount, seed });
    expect(choice.notCompared).toBeNull();
    expect(choice.runsScored).toBe(data.episodeCount);
    expect(choice.chosen).toBe(2);
    expect(choice.difference!).toBeGreaterThan(-CHOICE_STANDARD_ERRORS * choice.standardError!);
    expect(choice.sentence).toContain('Polynomial part of degree 2');
  }, 60_000);

  it('picks degree 4 where the action value is exactly quartic (linear plant, quartic cost)', () => {
    const data = quarticCostLog(200, 100, 7), choice = chooseLinearPartDegree({ data, discount: 0.9, seed: 1 });
    expect(choice.chosen).toBe(4);
    expect(choice.relativeError[1]).toBeLessThan(choice.relativeError[0]);
    expect(choice.sentence).toContain('Polynomial part of degree 4');
  });

  it('is made once per log, discount and fold seed: every fit of a project takes the first call\'s answer, equal to a fresh one', () => {
    const data = quarticCostLog(200, 100, 7), first = chooseLinearPartDegreeOnce({ data, discount: 0.9, seed: 1 });
    expect(chooseLinearPartDegreeOnce({ data, discount: 0.9, seed: 1 })).toBe(first);
    expect(first).toEqual(chooseLinearPartDegree({ data, discount: 0.9, seed: 1 }));
    // Another discount or fold seed is another question.
    expect(chooseLinearPartDegreeOnce({ data, discount: 0.95, seed: 1 })).not.toBe(first);
    expect(chooseLinearPartDegreeOnce({ data, discount: 0.9, seed: 2 })).not.toBe(first);
  });

  it('keeps the default degree and says why when too few runs can be scored', () => {
    const data = quarticCostLog(1, 200, 3), choice = chooseLinearPartDegree({ data, discount: 0.9, seed: 1 });
    expect(choice.chosen).toBe(2);
    expect(choice.notCompared).toMatch(/the log has 1 run/);
    expect(choice.sentence).toMatch(/not compared because the log has 1 run/);
  });

  it('forms its sums by block products equal to the plain row-by-row sums (to rounding)', () => {
    const data = quarticCostLog(40, 60, 5), gamma = 0.9, d = 15;
    const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 4));
    const continues = Uint8Array.from({ length: data.count }, (_, i) => (i + 1 < data.count && data.episode[i + 1] === data.episode[i] ? 1 : 0));
    const fold = Int32Array.from({ length: 40 }, (_, run) => run % 2);
    const sums = foldLstdSums(data, features, gamma, continues, fold, 2);
    // The reference: Σ φ(φ − γφ')ᵀ and Σ φ r one row at a time, written out here.
    const phi = new Float64Array(d), next = new Float64Array(d);
    const a = [new Float64Array(d * d), new Float64Array(d * d)], b = [new Float64Array(d), new Float64Array(d)];
    for (let i = 0; i < data.count; i++) {
      if (!continues[i]) continue;
      features.evaluate([data.states[i], data.actions[i]], 0, phi, 0);
      features.evaluate([data.states[i + 1], data.actions[i + 1]], 0, next, 0);
      const f = fold[data.episode[i]];
      for (let r = 0; r < d; r++) {
        for (let c = 0; c < d; c++) a[f][r * d + c] += phi[r] * (phi[c] - gamma * next[c]);
        b[f][r] += phi[r] * data.rewards[i];
      }
    }
    for (const f of [0, 1]) {
      const scale = Math.max(...a[f].map(Math.abs));
      a[f].forEach((x, k) => expect(Math.abs(sums.a[f][k] - x)).toBeLessThan(1e-12 * scale));
      b[f].forEach((x, k) => expect(sums.b[f][k]).toBeCloseTo(x, 6));
    }
    expect(sums.counts[0] + sums.counts[1]).toBe(40 * 59);
  });

  it('is not run above DEGREE_CHOICE_MAX_FEATURES quartic features, and says so', () => {
    // 5 states and 1 action: a quartic in 6 inputs has C(10, 4) = 210 features.
    const one = quarticCostLog(20, 20, 1), n = one.count, wide = (x: Float64Array) => Float64Array.from({ length: 5 * n }, (_, k) => x[Math.floor(k / 5)] + 0.01 * (k % 5));
    const data: TransitionSet = { ...one, stateDim: 5, stateNames: ['a', 'b', 'c', 'd', 'e'], states: wide(one.states), nextStates: wide(one.nextStates), startStates: wide(one.startStates).subarray(0, 5 * 20) };
    const choice = chooseLinearPartDegree({ data, discount: 0.9, seed: 1 });
    expect(DEGREE_CHOICE_MAX_FEATURES).toBeLessThan(210);
    expect(choice.chosen).toBe(2);
    expect(choice.notCompared).toBe(`a degree-4 polynomial in 6 inputs has 210 features, more than the ${DEGREE_CHOICE_MAX_FEATURES} up to which the comparison is cheap enough to run on every fit`);
  });
});
