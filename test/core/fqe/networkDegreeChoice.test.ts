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
import { CHOICE_STANDARD_ERRORS, chooseLinearPartDegree } from '../../../src/core/fqe/networkDegreeChoice';
import { createRandom } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';
import { batteryPlant } from '../../battery/catalogue';

/** Runs of `steps` rows: s' = 0.8 s + 0.5 a + w, a = −0.3 s + dither, r = −s⁴ (invented). */
function quarticCostLog(runs: number, steps: number, seed: number): TransitionSet {
  const rng = createRandom(seed), n = runs * steps;
  const normal = () => rng.normal();
  const states = new Float64Array(n), actions = new Float64Array(n), rewards = new Float64Array(n), nextStates = new Float64Array(n);
  const episode = new Int32Array(n), startStates = new Float64Array(runs), sourceLine = new Int32Array(n);
  let i = 0;
  for (let run = 0; run < runs; run++) {
    let s = 1.5 * normal();
    startStates[run] = s;
    for (let t = 0; t < steps; t++, i++) {
      const a = -0.3 * s + 0.3 * normal(), next = 0.8 * s + 0.5 * a + 0.2 * normal();
      states[i] = s; actions[i] = a; rewards[i] = -(s ** 4); nextStates[i] = next; episode[i] = run; sourceLine[i] = i + 2;
      s = next;
    }
  }
  return {
    count: n, stateDim: 1, actionDim: 1, stateNames: ['x'], actionNames: ['u'], states, actions, rewards, nextStates,
    terminal: new Uint8Array(n), episode, episodeCount: runs, startStates, sourceLine,
  };
}

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

  it('keeps the default degree and says why when too few runs can be scored', () => {
    const data = quarticCostLog(1, 200, 3), choice = chooseLinearPartDegree({ data, discount: 0.9, seed: 1 });
    expect(choice.chosen).toBe(2);
    expect(choice.notCompared).toMatch(/the log has 1 run/);
    expect(choice.sentence).toMatch(/not compared because the log has 1 run/);
  });
});
