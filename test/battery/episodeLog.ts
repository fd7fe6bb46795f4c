/**
 * A seeded simulator harness shared by every battery plant: logs episodes of a plant under a
 * Gaussian policy straight into a core TransitionSet (reward = −cost, as the importer stores it).
 * Episodes end on their time limit (terminal = 0: the plant goes on after the log stops), or, for a
 * plant whose runs really end (`ends`), on reaching an absorbing state (terminal = 1 on that row:
 * nothing is paid after it); then the next run starts at once, until the same transition budget
 * (episodes × stepsPerEpisode rows) is logged, the last run cut by the budget.
 *
 * One RandomSource per call, drawn in a fixed order (start state, then per step the action and
 * the process noise), so a seed fixes every number.
 */
import { sampleAction, type GaussianPolicy } from '../../src/core/policy';
import { createRandom, type RandomSource } from '../../src/core/random';
import type { TransitionSet } from '../../src/core/transitions';

export interface PlantDynamics {
  readonly stateDim: number; // ds
  readonly actionDim: number; // m
  /** Writes s' (ds) and returns the stage cost c(s, a); noise from rng. */
  step(state: Float64Array, action: Float64Array, rng: RandomSource, next: Float64Array): number;
  /** Runs that really end: true when s' is absorbing (value 0 after; no further cost). Absent: runs end only on a time limit. */
  ends?(next: Float64Array): boolean;
}

/** Writes one start state (ds) drawn from the plant's logged start distribution. */
export type StartSampler = (rng: RandomSource, out: Float64Array) => void;

export interface EpisodeLogOptions {
  readonly episodes: number;
  readonly stepsPerEpisode: number;
  readonly seed: number;
  readonly stateNames: readonly string[];
  readonly actionNames: readonly string[];
  /**
   * Clip each drawn action to [lo, hi] before it acts and is logged: a logger whose noise is
   * correlated across actions and whose valves stop at their ends, which a GaussianPolicy cannot
   * be (bounds need independent noise). Absent: the policy's own law, as drawn.
   */
  readonly actionClip?: { readonly lo: readonly number[]; readonly hi: readonly number[] };
}

export function logEpisodes(dynamics: PlantDynamics, policy: GaussianPolicy, start: StartSampler, options: EpisodeLogOptions): TransitionSet {
  const { episodes, stepsPerEpisode: steps } = options;
  const ds = dynamics.stateDim, m = dynamics.actionDim, count = episodes * steps;
  const rng = createRandom(options.seed);
  const states = new Float64Array(count * ds), actions = new Float64Array(count * m), nextStates = new Float64Array(count * ds);
  const rewards = new Float64Array(count), episode = new Int32Array(count), terminal = new Uint8Array(count);
  const startStates = new Float64Array(count * ds); // at most one run per row; trimmed below
  const s = new Float64Array(ds), a = new Float64Array(m), next = new Float64Array(ds);
  let row = 0, e = 0;
  for (; row < count; e++) {
    start(rng, s);
    startStates.set(s, e * ds);
    for (let t = 0; t < steps && row < count; t++, row++) {
      sampleAction(policy, s, rng, a);
      if (options.actionClip) for (let j = 0; j < m; j++) a[j] = Math.min(options.actionClip.hi[j], Math.max(options.actionClip.lo[j], a[j]));
      rewards[row] = -dynamics.step(s, a, rng, next);
      states.set(s, row * ds);
      actions.set(a, row * m);
      nextStates.set(next, row * ds);
      episode[row] = e;
      s.set(next);
      if (dynamics.ends?.(next)) {
        terminal[row] = 1;
        row++;
        break;
      }
    }
  }
  return {
    count, stateDim: ds, actionDim: m, stateNames: [...options.stateNames], actionNames: [...options.actionNames],
    states, actions, rewards, nextStates, terminal, episode, episodeCount: e, startStates: startStates.slice(0, e * ds),
    sourceLine: Int32Array.from({ length: count }, (_, i) => i + 2),
  };
}

/** Episodes needed for at least `transitions` transitions of `steps` each. */
export function episodesFor(transitions: number, steps: number): number {
  if (!(transitions >= 1) || !(steps >= 1)) throw new RangeError(`simulation: expected transitions ≥ 1 and stepsPerEpisode ≥ 1, got ${transitions} and ${steps}`);
  return Math.ceil(transitions / steps);
}

/**
 * A start sampler that runs the behaviour policy for `burnIn` steps from `from`: the state it ends
 * in is a draw from (close to) the logged steady state, for plants without a closed form for it.
 */
export function burnInStart(dynamics: PlantDynamics, policy: GaussianPolicy, from: ArrayLike<number>, burnIn: number): StartSampler {
  const a = new Float64Array(dynamics.actionDim), next = new Float64Array(dynamics.stateDim);
  return (rng, out) => {
    for (let i = 0; i < out.length; i++) out[i] = from[i];
    for (let t = 0; t < burnIn; t++) {
      sampleAction(policy, out, rng, a);
      dynamics.step(out, a, rng, next);
      out.set(next);
    }
  };
}
