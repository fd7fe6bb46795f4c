/**
 * Weighted per-decision importance sampling and weighted doubly robust (Thomas & Brunskill, ICML
 * 2016) on runs that end in an absorbing state, padded with it (perDecisionEstimators.ts).
 *
 * The chain (invented for this test): each step the controller's move a is paid r(a) = −1 − a², and
 * the run ends after the step with probability p(a) = Φ(a − 2). Moves are drawn afresh each step,
 * so under a policy a ~ N(μ, σ²), with E_π r = −1 − μ² − σ² and q = E_π p(a),
 *   J = E_π r · Σ_t (γ(1 − q))^t = E_π r / (1 − γ(1 − q))          (the geometric series; common practice)
 *   q = E Φ(a − 2) = Φ((μ − 2)/√(1 + σ²))                          (the probit–normal identity, e.g. Rasmussen
 *                                                                    & Williams, "Gaussian Processes for Machine
 *                                                                    Learning", 2006, §3.9; quoted from memory)
 * Logged under N(0, 1), the candidate N(0.5, 0.7²): q = 0.109564 (Python's math.erfc), J = −8.76098.
 * Normalising each step over the runs still going instead would estimate E_π r/(1 − γ) = −17.4: the
 * runs that ended pay 0 and belong in the normaliser.
 * With Q and V exact, Q(a) = r(a) + γ(1 − p(a))·J and V = J, the doubly robust estimate is left with the
 * noise of whether each run ended, weighted: tighter than importance sampling alone, not exact.
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { loggedDiscountedReturn } from '../../../src/core/loggedReturn';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { perDecisionData, perDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, prepareResampleEntries } from '../../../src/core/offPolicy/perDecisionResamples';
import { createGaussianPolicy } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';

const discount = 0.9, truth = -8.760977254151745, goingOnWrongly = -1.74 / (1 - discount);
const behaviour = createGaussianPolicy({ offset: [0], gain: [[0]], std: [1] }, 1);
const candidate = createGaussianPolicy({ offset: [0.5], gain: [[0]], std: [0.7] }, 1);

/** The end chance p(a) = Φ(a − 2), from the rational approximation of erfc (Abramowitz & Stegun 7.1.26, |ε| < 1.5e-7). */
function endChance(a: number): number {
  const z = (a - 2) / Math.SQRT2, t = 1 / (1 + 0.3275911 * Math.abs(z));
  const erfcAbs = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429)))) * Math.exp(-z * z);
  return z >= 0 ? 1 - 0.5 * erfcAbs : 0.5 * erfcAbs; // Φ(x) = erfc(−x/√2)/2
}

/** Runs logged under N(0, 1), each ending in the absorbing state (terminal 1); a 400-step limit is never reached in practice. */
function endingRuns(runs: number, seed: number): TransitionSet {
  const rng = createRandom(seed), actions: number[] = [], terminal: number[] = [], episode: number[] = [];
  for (let k = 0; k < runs; k++) {
    for (let t = 0; t < 400; t++) {
      const a = rng.normal(), done = rng.uniform() < endChance(a) ? 1 : 0;
      actions.push(a);
      terminal.push(done);
      episode.push(k);
      if (done) break;
    }
  }
  const n = actions.length, zeros = new Float64Array(n);
  return {
    count: n, stateDim: 1, actionDim: 1, stateNames: ['level'], actionNames: ['move'], states: zeros, nextStates: zeros,
    actions: Float64Array.from(actions), rewards: Float64Array.from(actions, (a) => -1 - a * a), terminal: Uint8Array.from(terminal),
    episode: Int32Array.from(episode), episodeCount: runs, startStates: new Float64Array(runs), sourceLine: Int32Array.from({ length: n }, (_, i) => i + 2),
  };
}

/** Exact Q and V of the candidate in the table's episode-major order. */
function exactValues(data: TransitionSet) {
  const index = indexEpisodes(data), actionValues = new Float64Array(data.count), stateValues = new Float64Array(data.count).fill(truth);
  for (let p = 0; p < data.count; p++) {
    const a = data.actions[index.order[p]];
    actionValues[p] = -1 - a * a + discount * (1 - endChance(a)) * truth;
  }
  return { actionValues, stateValues };
}

/** The sample standard deviation: the bootstrap standard error of a statistic from its resamples. */
function standardDeviation(x: readonly number[]): number {
  const mean = x.reduce((s, v) => s + v, 0) / x.length;
  return Math.sqrt(x.reduce((s, v) => s + (v - mean) ** 2, 0) / (x.length - 1));
}

describe('per-decision estimators on runs that end in an absorbing state', () => {
  const data = endingRuns(4000, 3), index = indexEpisodes(data);

  it('on-policy, weighted importance sampling is the mean discounted return of every run, 0 after its end', () => {
    // Every weight is 1, and padded every run is present at every step: the on-policy Monte Carlo estimate (Sutton & Barto, 2nd ed., §5.1).
    const table = importanceWeightTable(data, index, behaviour, behaviour);
    expect(perDecisionEstimates(perDecisionData(table, null), discount).importanceSampling).toBeCloseTo(loggedDiscountedReturn(data, discount).value, 10);
  });

  it('hold the closed form for a candidate that changes how soon runs end, within three bootstrap standard errors', () => {
    const table = importanceWeightTable(data, index, candidate, behaviour), exact = perDecisionData(table, exactValues(data));
    const full = perDecisionEstimates(exact, discount), entries = prepareResampleEntries(exact), is: number[] = [], dr: number[] = [];
    for (let first = 0; first < 200; first += 8) {
      const block = Array.from({ length: 8 }, (_, b) => episodeMultiplicities(data.episodeCount, 11, first + b));
      for (const outcome of perDecisionResamples(entries, discount, block)) {
        if (outcome instanceof Error) throw outcome;
        is.push(outcome.importanceSampling);
        dr.push(outcome.doublyRobust!);
      }
    }
    const isError = standardDeviation(is), drError = standardDeviation(dr);
    expect(Math.abs(full.importanceSampling - truth)).toBeLessThan(3 * isError);
    expect(Math.abs(full.doublyRobust! - truth)).toBeLessThan(3 * drError);
    expect(isError).toBeLessThan(0.05 * Math.abs(truth)); // tight enough to tell −8.76 from −17.4
    expect(Math.abs(full.importanceSampling - goingOnWrongly)).toBeGreaterThan(20 * isError);
    expect(drError).toBeLessThan(isError); // exact values remove the rewards' noise; the ends' remains
  });

  it('give the block route the same numbers as the one-pass route on the padded runs', () => {
    const prepared = perDecisionData(importanceWeightTable(data, index, candidate, behaviour), exactValues(data));
    const block = Array.from({ length: 5 }, (_, b) => episodeMultiplicities(data.episodeCount, 5, b));
    perDecisionResamples(prepareResampleEntries(prepared), discount, block).forEach((fast, b) => {
      if (fast instanceof Error) throw fast;
      const plain = perDecisionEstimates(prepared, discount, block[b]);
      expect(fast.importanceSampling).toBeCloseTo(plain.importanceSampling, 12);
      expect(fast.doublyRobust!).toBeCloseTo(plain.doublyRobust!, 12);
    });
  });
});
