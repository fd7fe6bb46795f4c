/**
 * An invented one-state log whose present controller's action value is exactly a quartic in (s, a):
 * runs of `steps` rows, s' = 0.8 s + 0.5 a + w, a = −0.3 s + dither, r = −s⁴. Every moment of a
 * Gaussian is a polynomial in its mean of the same degree (E[(m + w)⁴] = m⁴ + 6m²σ² + 3σ⁴; common
 * practice), so no quadratic holds the value and the degree choice (networkDegreeChoice.ts) must pick 4.
 */
import { createRandom } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';

export function quarticCostLog(runs: number, steps: number, seed: number): TransitionSet {
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
