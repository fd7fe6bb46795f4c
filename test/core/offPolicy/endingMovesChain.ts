/**
 * The invented chain of absorbedRuns.test.ts and cutAndEndedRuns.test.ts: each step the controller's
 * move a is paid r(a) = −1 − a², and the run ends after the step with probability p(a) = Φ(a − 2);
 * logged under N(0, 1). Under a policy a ~ N(μ, σ²), with E_π r = −1 − μ² − σ² and
 * q = E Φ(a − 2) = Φ((μ − 2)/√(1 + σ²)) (the probit–normal identity, e.g. Rasmussen & Williams,
 * "Gaussian Processes for Machine Learning", 2006, §3.9; quoted from memory),
 *   J = E_π r / (1 − γ(1 − q))   (the geometric series; common practice);
 * for the candidate N(0.5, 0.7²) at γ = 0.9, q = 0.109564 and J = −8.76098 (Python's math.erfc).
 * Test data only.
 */
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import type { PerDecisionData } from '../../../src/core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, prepareResampleEntries } from '../../../src/core/offPolicy/perDecisionResamples';
import { createGaussianPolicy } from '../../../src/core/policy';
import { createRandom, type RandomSource } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';

export const discount = 0.9, truth = -8.760977254151745;
export const behaviour = createGaussianPolicy({ offset: [0], gain: [[0]], std: [1] }, 1);
export const candidate = createGaussianPolicy({ offset: [0.5], gain: [[0]], std: [0.7] }, 1);

/** The end chance p(a) = Φ(a − 2), from the rational approximation of erfc (Abramowitz & Stegun 7.1.26, |ε| < 1.5e-7). */
export function endChance(a: number): number {
  const z = (a - 2) / Math.SQRT2, t = 1 / (1 + 0.3275911 * Math.abs(z));
  const erfcAbs = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429)))) * Math.exp(-z * z);
  return z >= 0 ? 1 - 0.5 * erfcAbs : 0.5 * erfcAbs; // Φ(x) = erfc(−x/√2)/2
}

/**
 * Runs logged under N(0, 1), each ending in the absorbing state (terminal 1 on its last step) unless
 * its log is cut first after limitOf(rng) steps (cut 1, drawn before the run's moves).
 */
export function chainRuns(runs: number, seed: number, limitOf: (rng: RandomSource) => number): { data: TransitionSet; cut: Uint8Array; lengths: Int32Array } {
  const rng = createRandom(seed), actions: number[] = [], terminal: number[] = [], episode: number[] = [];
  const cut = new Uint8Array(runs), lengths = new Int32Array(runs);
  for (let k = 0; k < runs; k++) {
    const limit = limitOf(rng);
    for (let t = 0; t < limit; t++) {
      const a = rng.normal(), done = rng.uniform() < endChance(a) ? 1 : 0;
      actions.push(a);
      terminal.push(done);
      episode.push(k);
      lengths[k]++;
      if (done) break;
      if (t === limit - 1) cut[k] = 1;
    }
  }
  const n = actions.length, zeros = new Float64Array(n);
  const data: TransitionSet = {
    count: n, stateDim: 1, actionDim: 1, stateNames: ['level'], actionNames: ['move'], states: zeros, nextStates: zeros,
    actions: Float64Array.from(actions), rewards: Float64Array.from(actions, (a) => -1 - a * a), terminal: Uint8Array.from(terminal),
    episode: Int32Array.from(episode), episodeCount: runs, startStates: new Float64Array(runs), sourceLine: Int32Array.from({ length: n }, (_, i) => i + 2),
  };
  return { data, cut, lengths };
}

/** Exact Q and V of the candidate in the table's episode-major order: Q(a) = r(a) + γ(1 − p(a))·J, V = J. */
export function exactValues(data: TransitionSet): { actionValues: Float64Array; stateValues: Float64Array } {
  const index = indexEpisodes(data), actionValues = new Float64Array(data.count), stateValues = new Float64Array(data.count).fill(truth);
  for (let p = 0; p < data.count; p++) {
    const a = data.actions[index.order[p]];
    actionValues[p] = -1 - a * a + discount * (1 - endChance(a)) * truth;
  }
  return { actionValues, stateValues };
}

/** WPDIS and WDR on 200 bootstrap resamples of the runs (blocks of 8, resample b drawn from (seed, b)). */
export function bootstrapSpread(prepared: PerDecisionData, seed: number): { is: number[]; dr: number[] } {
  const entries = prepareResampleEntries(prepared), is: number[] = [], dr: number[] = [];
  for (let first = 0; first < 200; first += 8) {
    const block = Array.from({ length: 8 }, (_, b) => episodeMultiplicities(prepared.episodes, seed, first + b));
    for (const outcome of perDecisionResamples(entries, discount, block)) {
      if (outcome instanceof Error) throw outcome;
      is.push(outcome.importanceSampling);
      dr.push(outcome.doublyRobust!);
    }
  }
  return { is, dr };
}

/** The sample standard deviation: the bootstrap standard error of a statistic from its resamples. */
export function standardDeviation(x: readonly number[]): number {
  const mean = x.reduce((s, v) => s + v, 0) / x.length;
  return Math.sqrt(x.reduce((s, v) => s + (v - mean) ** 2, 0) / (x.length - 1));
}
