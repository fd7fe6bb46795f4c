/**
 * The padded per-decision estimators (perDecisionEstimators.ts) on a log where runs end in the end
 * state and other runs' logs are cut early by a time limit: the chain of absorbedRuns.test.ts (each
 * step the move a pays r(a) = −1 − a² and the run ends after it with probability Φ(a − 2)), logged
 * under N(0, 1), with each run's log cut after a length drawn uniformly from 1 … 25 steps,
 * independently of the chain. Closed form, as there (the geometric series and the probit–normal
 * identity; common practice, Rasmussen & Williams 2006 §3.9 from memory): for the candidate
 * N(0.5, 0.7²) at γ = 0.9, J = −8.76098. With the exact value V = J past each time limit (the tail),
 * both estimators are consistent for J; dropping the cut runs from the steps after their cut while
 * keeping the ended ones would overstate the chance of an end.
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { perDecisionData, perDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, prepareResampleEntries } from '../../../src/core/offPolicy/perDecisionResamples';
import { createGaussianPolicy } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';

const discount = 0.9, truth = -8.760977254151745;
const behaviour = createGaussianPolicy({ offset: [0], gain: [[0]], std: [1] }, 1);
const candidate = createGaussianPolicy({ offset: [0.5], gain: [[0]], std: [0.7] }, 1);

/** Φ(a − 2) from the rational approximation of erfc (Abramowitz & Stegun 7.1.26, |ε| < 1.5e-7). */
function endChance(a: number): number {
  const z = (a - 2) / Math.SQRT2, t = 1 / (1 + 0.3275911 * Math.abs(z));
  const erfcAbs = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429)))) * Math.exp(-z * z);
  return z >= 0 ? 1 - 0.5 * erfcAbs : 0.5 * erfcAbs;
}

/** Runs under N(0, 1), each cut after 1 … 25 steps unless it ends first (terminal 1 on its last step). */
function cutOrEndedRuns(runs: number, seed: number): { data: TransitionSet; cut: Uint8Array; lengths: Int32Array } {
  const rng = createRandom(seed), actions: number[] = [], terminal: number[] = [], episode: number[] = [];
  const cut = new Uint8Array(runs), lengths = new Int32Array(runs);
  for (let k = 0; k < runs; k++) {
    const limit = 1 + Math.floor(25 * rng.uniform());
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

function standardDeviation(x: readonly number[]): number {
  const mean = x.reduce((s, v) => s + v, 0) / x.length;
  return Math.sqrt(x.reduce((s, v) => s + (v - mean) ** 2, 0) / (x.length - 1));
}

describe('padded estimators where some runs end and others are cut early by a time limit', () => {
  it('hold the closed form within three bootstrap standard errors, with the exact value past each cut', () => {
    const { data, cut, lengths } = cutOrEndedRuns(4000, 7), index = indexEpisodes(data);
    const actionValues = new Float64Array(data.count), stateValues = new Float64Array(data.count).fill(truth);
    for (let p = 0; p < data.count; p++) {
      const a = data.actions[index.order[p]];
      actionValues[p] = -1 - a * a + discount * (1 - endChance(a)) * truth;
    }
    const tails = { finalStateValues: new Float64Array(data.episodeCount).fill(truth), tailWeights: Float64Array.from(cut, (c, k) => (c ? discount ** lengths[k] : 0)) };
    const prepared = perDecisionData(importanceWeightTable(data, index, candidate, behaviour), { actionValues, stateValues }, tails);
    expect(prepared.cutEpisode.length).toBeGreaterThan(1000); // many runs are cut, at many lengths
    const full = perDecisionEstimates(prepared, discount), entries = prepareResampleEntries(prepared), is: number[] = [], dr: number[] = [];
    for (let first = 0; first < 200; first += 8) {
      const block = Array.from({ length: 8 }, (_, b) => episodeMultiplicities(data.episodeCount, 13, first + b));
      for (const outcome of perDecisionResamples(entries, discount, block)) {
        if (outcome instanceof Error) throw outcome;
        is.push(outcome.importanceSampling);
        dr.push(outcome.doublyRobust!);
      }
    }
    expect(Math.abs(full.importanceSampling - truth)).toBeLessThan(3 * standardDeviation(is));
    expect(Math.abs(full.doublyRobust! - truth)).toBeLessThan(3 * standardDeviation(dr));
    expect(standardDeviation(is)).toBeLessThan(0.03 * Math.abs(truth));
  });
});
