/**
 * Logs whose making breaks one of the method's assumptions, as months of real plant data do (probe37;
 * what is counted on them: the rule in test/battery/README.md, "Three plants whose logs break an
 * assumption"). Each run e of E may meet its own plant (a plant that drifts over the months) and its own
 * controller (a loop retuned partway), and the log may hold a noisy reading of the state rather than the
 * state itself (a noisy sensor). The plant a bench rolls the truth out on is the plant's `dynamics` (the
 * plant as it is at the END of the log) under each policy as it acts on the true state (`truthPolicy`).
 *
 * One RandomSource per call, drawn in a fixed order (the run's start, the first reading, then per step the
 * action, the process noise, the next reading), so a seed fixes every number.
 */
import { createGaussianPolicy, sampleAction, type GaussianPolicy, type GaussianPolicySpec } from '../../../src/core/policy';
import { createRandom, type RandomSource } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';
import type { BatteryPlant } from '../batteryPlant';
import type { EpisodeLogOptions, PlantDynamics, StartSampler } from '../episodeLog';
import type { RolloutTruthPlant } from '../rolloutTruthPlants';

/** What run e of E met: the plant, the controller in force, and where the run started. */
export interface RunConditions {
  readonly dynamics: PlantDynamics;
  readonly policy: GaussianPolicy;
  readonly start: StartSampler;
}

/** The episode log's options (episodeLog.ts; no action clip: each run's policy clips), with what changes by run. */
export interface BrokenLogOptions extends Omit<EpisodeLogOptions, 'actionClip'> {
  /** Run e (0-based) of `episodes`. */
  runConditions(e: number, episodes: number): RunConditions;
  /** Standard deviation of white Gaussian noise on each state's reading (ds); absent: the log holds the true state. */
  readonly readingNoise?: readonly number[];
}

/**
 * Episodes of a plant whose conditions change by run, logged as a project holds them: the state written
 * (and acted on) is the reading y = x + n, the next state written is the next reading (the next row's
 * state), the reward is −cost of the TRUE state and action. `startStates` are the TRUE start states of the
 * runs (what a truth is rolled out from; the log's first rows hold their readings).
 */
export function logBrokenRuns(options: BrokenLogOptions): TransitionSet {
  const { episodes, stepsPerEpisode: steps } = options;
  const probe = options.runConditions(0, episodes).dynamics, ds = probe.stateDim, m = probe.actionDim, count = episodes * steps;
  const rng = createRandom(options.seed);
  const states = new Float64Array(count * ds), actions = new Float64Array(count * m), nextStates = new Float64Array(count * ds);
  const rewards = new Float64Array(count), episode = new Int32Array(count), startStates = new Float64Array(episodes * ds);
  const x = new Float64Array(ds), y = new Float64Array(ds), a = new Float64Array(m), next = new Float64Array(ds), nextY = new Float64Array(ds);
  let row = 0;
  for (let e = 0; e < episodes; e++) {
    const run = options.runConditions(e, episodes);
    run.start(rng, x);
    startStates.set(x, e * ds);
    readInto(x, options.readingNoise, rng, y);
    for (let t = 0; t < steps; t++, row++) {
      sampleAction(run.policy, y, rng, a);
      rewards[row] = -run.dynamics.step(x, a, rng, next);
      readInto(next, options.readingNoise, rng, nextY);
      states.set(y, row * ds);
      actions.set(a, row * m);
      nextStates.set(nextY, row * ds);
      episode[row] = e;
      x.set(next);
      y.set(nextY);
    }
  }
  return {
    count, stateDim: ds, actionDim: m, stateNames: [...options.stateNames], actionNames: [...options.actionNames],
    states, actions, rewards, nextStates, terminal: new Uint8Array(count), episode, episodeCount: episodes, startStates,
    sourceLine: Int32Array.from({ length: count }, (_, i) => i + 2),
  };
}

function readInto(x: Float64Array, noise: readonly number[] | undefined, rng: RandomSource, out: Float64Array): void {
  for (let j = 0; j < x.length; j++) out[j] = x[j] + (noise ? noise[j] * rng.normal() : 0);
}

/**
 * An affine law acting on a reading y = x + n with white noise n (sd per state), clip(m + G·(x + n) + σ·z),
 * is the same law on the true state with the dither √(σ² + Σ_j (G_ij·n_j)²): G·n and σ·z are independent
 * zero-mean normals, so their sum is one (the sum of independent normals; common practice), drawn before the
 * clip. Exact, clipping included, for independent dithers on affine laws (the only kind accepted).
 */
export function lawOnTrueState(spec: GaussianPolicySpec, noise: readonly number[]): GaussianPolicySpec {
  if (!spec.std || spec.covariance || spec.schedules || spec.rateLimit) throw new Error('lawOnTrueState: an affine law with a dither per action only');
  const std = spec.std.map((s, i) => Math.sqrt(s * s + spec.gain[i].reduce((sum, g, j) => sum + (g * noise[j]) ** 2, 0)));
  return { ...spec, std };
}

/** A hold-out plant whose log breaks an assumption: its truth is rolled out on `dynamics` with `truthPolicy` of each law. */
export interface BrokenLogPlant extends RolloutTruthPlant {
  /** Which assumption the log breaks, in a line. */
  readonly breaks: string;
  /** A law written on the logged state (a candidate, the logging controller) as it acts on the true state; absent: itself. */
  readonly truthPolicy?: (spec: GaussianPolicySpec) => GaussianPolicySpec;
}

/** A plant with a log of its own: `plant`'s truth plumbing and start sets, with `simulate` replaced. */
export function withBrokenLog(plant: BatteryPlant, breaks: string, options: Omit<BrokenLogOptions, 'episodes' | 'seed' | 'stepsPerEpisode' | 'stateNames' | 'actionNames'>,
  truthPolicy?: (spec: GaussianPolicySpec) => GaussianPolicySpec): BrokenLogPlant {
  if (!plant.dynamics) throw new Error(`${plant.name}: a plant with a broken log needs its end-of-log dynamics for the truth`);
  return {
    ...plant, dynamics: plant.dynamics, breaks, ...(truthPolicy ? { truthPolicy } : {}),
    simulate: (o) => {
      if (o.runStarts === 'wide') throw new Error(`${plant.name}: its logs start runs at the logged steady state only`);
      const steps = o.stepsPerEpisode ?? plant.stepsPerEpisode;
      return logBrokenRuns({ ...options, episodes: Math.ceil(o.transitions / steps), stepsPerEpisode: steps, seed: o.seed, stateNames: plant.stateNames, actionNames: plant.actionNames });
    },
  };
}

/** The run's conditions for a fixed plant and controller, with a burn-in start under them. */
export function steadyRun(dynamics: PlantDynamics, spec: GaussianPolicySpec, operatingState: readonly number[], burnIn: number): RunConditions {
  const policy = createGaussianPolicy(spec, dynamics.stateDim), a = new Float64Array(dynamics.actionDim), next = new Float64Array(dynamics.stateDim);
  const start: StartSampler = (rng, out) => {
    out.set(operatingState);
    for (let t = 0; t < burnIn; t++) {
      sampleAction(policy, out, rng, a);
      dynamics.step(out, a, rng, next);
      out.set(next);
    }
  };
  return { dynamics, policy, start };
}

/** A plant parameter on a straight line through the log: `first` at run 0, `last` at run E − 1 (the last alone in a one-run log). */
export function alongRuns(ends: { readonly first: number; readonly last: number }): (e: number, episodes: number) => number {
  return (e, episodes) => (episodes > 1 ? ends.first + (ends.last - ends.first) * e / (episodes - 1) : ends.last);
}

/**
 * A plant that drifts through its log (run e of E meets `dynamicsAtRun(e, E)`, the logging law throughout,
 * each run started by a burn-in under that run's plant), or with `kept` its control: the end-of-log plant
 * (`plant.dynamics`) on every run. `breaks`: the words for each.
 */
export function driftingLog(plant: BatteryPlant, kept: boolean, breaks: { readonly drifts: string; readonly kept: string },
  dynamicsAtRun: (e: number, episodes: number) => PlantDynamics, operatingState: readonly number[], burnIn: number): BrokenLogPlant {
  const steady = steadyRun(plant.dynamics!, plant.behaviour, operatingState, burnIn);
  return withBrokenLog(plant, kept ? breaks.kept : breaks.drifts, {
    runConditions: (e, episodes) => (kept ? steady : steadyRun(dynamicsAtRun(e, episodes), plant.behaviour, operatingState, burnIn)),
  });
}
