/**
 * Test fixtures: transition sets simulated from an invented linear plant x' = A x + B u + w with
 * quadratic cost, logged under a behaviour policy, with reward = −cost (as the importer stores it).
 */
import type { TransitionSet } from '../../../src/core/transitions';
import { createRandom } from '../../../src/core/random';

export interface LinearPlantScenario {
  dynamics: number[]; // A: n×n row-major
  inputGain: number[]; // B: n×m
  processNoiseStd: number[]; // n, independent
  stateWeight: number[]; // Q: n×n
  actionWeight: number[]; // R: m×m
  /** Behaviour policy u = behaviourGain·x + N(0, behaviourStd²) per action. */
  behaviourGain: number[]; // m×n
  behaviourStd: number[]; // m
  startStd: number; // x0 ~ N(0, startStd² I)
  episodes: number;
  stepsPerEpisode: number;
  seed: number;
}

export function simulateLinearPlant(sc: LinearPlantScenario): TransitionSet {
  const n = sc.processNoiseStd.length, m = sc.behaviourStd.length;
  const count = sc.episodes * sc.stepsPerEpisode, rng = createRandom(sc.seed);
  const states = new Float64Array(count * n), actions = new Float64Array(count * m), nextStates = new Float64Array(count * n);
  const rewards = new Float64Array(count), episode = new Int32Array(count), startStates = new Float64Array(sc.episodes * n);
  const x = new Float64Array(n), u = new Float64Array(m), next = new Float64Array(n);
  let row = 0;
  for (let e = 0; e < sc.episodes; e++) {
    for (let i = 0; i < n; i++) x[i] = startStates[e * n + i] = sc.startStd * rng.normal();
    for (let t = 0; t < sc.stepsPerEpisode; t++, row++) {
      for (let a = 0; a < m; a++) u[a] = dotRow(sc.behaviourGain, a, x) + sc.behaviourStd[a] * rng.normal();
      for (let i = 0; i < n; i++) next[i] = dotRow(sc.dynamics, i, x) + dotRow(sc.inputGain, i, u) + sc.processNoiseStd[i] * rng.normal();
      rewards[row] = -(quadratic(sc.stateWeight, x) + quadratic(sc.actionWeight, u));
      states.set(x, row * n);
      actions.set(u, row * m);
      nextStates.set(next, row * n);
      episode[row] = e;
      x.set(next);
    }
  }
  return {
    count, stateDim: n, actionDim: m,
    stateNames: Array.from({ length: n }, (_, i) => `x${i + 1}`), actionNames: Array.from({ length: m }, (_, i) => `u${i + 1}`),
    states, actions, rewards, nextStates, terminal: new Uint8Array(count), episode, episodeCount: sc.episodes, startStates,
    sourceLine: Int32Array.from({ length: count }, (_, i) => i + 2),
  };
}

function dotRow(a: number[], row: number, v: ArrayLike<number>): number {
  let s = 0;
  for (let j = 0; j < v.length; j++) s += a[row * v.length + j] * v[j];
  return s;
}

function quadratic(w: number[], v: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) for (let j = 0; j < v.length; j++) s += v[i] * w[i * v.length + j] * v[j];
  return s;
}

/**
 * Transitions from a tank-levels log (columns run, time, upper, lower, valve, cost): each row
 * followed by a row of the same run gives (s, a, −cost, s'); the last row of a run has no s'.
 */
export function tankLogTransitions(rows: Float64Array, rowCount: number): TransitionSet {
  const cols = 6, keep: number[] = [];
  for (let i = 0; i + 1 < rowCount; i++) if (rows[i * cols] === rows[(i + 1) * cols]) keep.push(i);
  const count = keep.length;
  const states = new Float64Array(count * 2), actions = new Float64Array(count), nextStates = new Float64Array(count * 2);
  const rewards = new Float64Array(count), episode = new Int32Array(count), starts: number[] = [];
  keep.forEach((i, t) => {
    states.set(rows.subarray(i * cols + 2, i * cols + 4), t * 2);
    actions[t] = rows[i * cols + 4];
    rewards[t] = -rows[i * cols + 5];
    nextStates.set(rows.subarray((i + 1) * cols + 2, (i + 1) * cols + 4), t * 2);
    episode[t] = rows[i * cols] - 1;
    if (i === 0 || rows[(i - 1) * cols] !== rows[i * cols]) starts.push(rows[i * cols + 2], rows[i * cols + 3]);
  });
  return {
    count, stateDim: 2, actionDim: 1, stateNames: ['level_upper_m', 'level_lower_m'], actionNames: ['inflow_valve_pct'],
    states, actions, rewards, nextStates, terminal: new Uint8Array(count), episode, episodeCount: starts.length / 2,
    startStates: Float64Array.from(starts), sourceLine: Int32Array.from(keep, (i) => i + 2),
  };
}
