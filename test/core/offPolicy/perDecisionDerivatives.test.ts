/**
 * The per-run derivatives of the per-decision estimators (perDecisionDerivatives.ts) and the
 * first-order standard error built on them, checked three ways:
 *  - against central finite differences of perDecisionEstimates itself (the same function at
 *    c = 1 ± h e_k; the error of a central difference is O(h²), common practice), on logs that
 *    exercise every term: unequal lengths, time-limit tails, runs absorbed in an end state, runs cut
 *    early (the padded weights' κ < 1);
 *  - against a closed form: with every weight 1, no tail and runs of one length, WPDIS is the plain
 *    mean of the runs' discounted returns, whose linearised bootstrap standard error is the plug-in
 *    sd of the returns over √e (Efron & Tibshirani 1993, §5.2 and §21.3: the bootstrap's standard
 *    error of a mean is the plug-in sd / √n);
 *  - against the resampled standard error (perDecisionResamples, 2,000 resamples) on constructed
 *    logs with many runs or unit weights, within 10 %; and where a few of 25 runs carry the weight it
 *    understates the spread badly (a limit of any first-order route, kept as a test so it is not forgotten).
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { firstOrderStandardError, linearisedPerDecision, perDecisionDerivatives } from '../../../src/core/offPolicy/perDecisionDerivatives';
import { perDecisionData, perDecisionEstimates, type PerDecisionData } from '../../../src/core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, prepareResampleEntries, RESAMPLE_BLOCK } from '../../../src/core/offPolicy/perDecisionResamples';
import { behaviour, candidate, chainRuns, discount as chainDiscount, exactValues, standardDeviation, truth } from './endingMovesChain';
import { unevenLogInputs } from './unevenCascadeLog';

const discount = 0.95;

/** Central differences of one estimator in run k's multiplicity. */
function finiteDifference(prepared: PerDecisionData, gamma: number, k: number, which: 'importanceSampling' | 'doublyRobust'): number {
  const h = 1e-5, c = new Float64Array(prepared.episodes).fill(1);
  c[k] = 1 + h;
  const up = perDecisionEstimates(prepared, gamma, c)[which]!;
  c[k] = 1 - h;
  return (up - perDecisionEstimates(prepared, gamma, c)[which]!) / (2 * h);
}

function expectDerivatives(prepared: PerDecisionData, gamma: number, runs: readonly number[]): void {
  const d = perDecisionDerivatives(prepared, gamma);
  const scale = Math.max(...Array.from(d.importanceSampling, Math.abs));
  for (const k of runs) {
    expect(Math.abs(d.importanceSampling[k] - finiteDifference(prepared, gamma, k, 'importanceSampling'))).toBeLessThan(1e-6 * scale);
    if (prepared.actionValues) expect(Math.abs(d.doublyRobust![k] - finiteDifference(prepared, gamma, k, 'doublyRobust'))).toBeLessThan(1e-6 * scale);
  }
  // Degree 0 in c: the derivatives sum to 0 (Euler).
  expect(Math.abs(d.importanceSampling.reduce((a, b) => a + b, 0))).toBeLessThan(1e-9 * scale * prepared.episodes);
}

describe('per-run derivatives of the per-decision estimators', () => {
  it('equal finite differences on an uneven log with terminal ends, cut runs, Q̂, V̂ and tails', () => {
    const { data, table, tails, values } = unevenLogInputs(discount);
    const prepared = perDecisionData(table, values, tails);
    expect(prepared.endEpisode.length).toBeGreaterThan(0);
    expect(prepared.absorbedEpisode.length).toBeGreaterThan(0);
    expectDerivatives(prepared, discount, Array.from({ length: data.episodeCount }, (_, k) => k));
    expectDerivatives(perDecisionData(table, null), discount, [0, 3, 7, 11]);
  });

  it('equal finite differences where runs end in an end state and others are cut early (padded weights, κ < 1)', () => {
    const { data, cut, lengths } = chainRuns(300, 7, (rng) => 1 + Math.floor(25 * rng.uniform())), index = indexEpisodes(data);
    const tails = { finalStateValues: new Float64Array(data.episodeCount).fill(truth), tailWeights: Float64Array.from(cut, (c, k) => (c ? chainDiscount ** lengths[k] : 0)) };
    const prepared = perDecisionData(importanceWeightTable(data, index, candidate, behaviour), exactValues(data), tails);
    expect(prepared.cutEpisode.length).toBeGreaterThan(50);
    expect(prepared.absorbedEpisode.length).toBeGreaterThan(50);
    expectDerivatives(prepared, chainDiscount, Array.from({ length: 60 }, (_, i) => 5 * i));
  });

  it('give the plain mean return’s standard error where every weight is 1, runs are of one length and have no tail (closed form)', () => {
    const { data, index, table } = unevenLogInputs(discount, true), length = (k: number) => index.offsets[k + 1] - index.offsets[k];
    // The runs logged to the full 40 steps that do not end in an end state: one length, no tail, no absorbed run.
    const keep = Array.from({ length: index.episodes }, (_, k) => k).filter((k) => length(k) === 40 && !data.terminal[index.order[index.offsets[k + 1] - 1]]);
    expect(keep.length).toBeGreaterThan(10);
    const kept = subLog(perDecisionData(table, null), keep), dk = perDecisionDerivatives(kept, discount);
    const returns = keep.map((k) => {
      let g = 0;
      for (let t = 0; t < 40; t++) g += discount ** t * data.rewards[index.order[index.offsets[k] + t]];
      return g;
    });
    const mean = returns.reduce((a, b) => a + b, 0) / returns.length;
    const plugInSd = Math.sqrt(returns.reduce((a, r) => a + (r - mean) ** 2, 0) / returns.length);
    expect(perDecisionEstimates(kept, discount).importanceSampling).toBeCloseTo(mean, 10);
    expect(firstOrderStandardError(dk.importanceSampling)).toBeCloseTo(plugInSd / Math.sqrt(returns.length), 10);
    dk.importanceSampling.forEach((g, i) => expect(g).toBeCloseTo((returns[i] - mean) / returns.length, 12));
  });

  it.each([
    ['the ending-chain log, 1,000 runs, cut early and ended (moderate weights)', () => chainInputs(1000)],
    ['the uneven cascade log with every weight 1', () => cascadeInputs(true)],
  ])('give a standard error within a tenth of the resampled one, and linearised resamples on the same draws whose sd is it (%s)', (_, make) => {
    const { prepared, gamma } = make(), d = perDecisionDerivatives(prepared, gamma), point = perDecisionEstimates(prepared, gamma);
    const entries = prepareResampleEntries(prepared), is: number[] = [], dr: number[] = [], linIs: number[] = [];
    for (let first = 0; first < 2000; first += RESAMPLE_BLOCK) {
      const block = Array.from({ length: RESAMPLE_BLOCK }, (_, b) => episodeMultiplicities(prepared.episodes, 5, first + b));
      perDecisionResamples(entries, gamma, block).forEach((r, b) => {
        if (r instanceof Error) throw r;
        is.push(r.importanceSampling);
        dr.push(r.doublyRobust!);
        linIs.push(linearisedPerDecision(point, d, block[b]).importanceSampling);
      });
    }
    // The sd of 2,000 resamples has a relative Monte Carlo error of about 1/√(2·2000) ≈ 1.6 %; the terms the
    // first order leaves out are O(1/e). 10 % is our tolerance for these logs; the battery measures the rest.
    const seIs = firstOrderStandardError(d.importanceSampling), seDr = firstOrderStandardError(d.doublyRobust!);
    expect(Math.abs(seIs / standardDeviation(is) - 1)).toBeLessThan(0.1);
    expect(Math.abs(seDr / standardDeviation(dr) - 1)).toBeLessThan(0.1);
    expect(Math.abs(standardDeviation(linIs) / seIs - 1)).toBeLessThan(0.05);
  });

  it('understate the spread where a few of 25 runs carry the weight (the first order’s known limit, the reason for the battery’s rule)', () => {
    const { prepared, gamma } = cascadeInputs(false), d = perDecisionDerivatives(prepared, gamma), is: number[] = [];
    for (let b = 0; b < 400; b++) is.push(perDecisionEstimates(prepared, gamma, episodeMultiplicities(prepared.episodes, 5, b)).importanceSampling);
    expect(firstOrderStandardError(d.importanceSampling) / standardDeviation(is)).toBeLessThan(0.5);
  });
});

function chainInputs(runs: number): { prepared: PerDecisionData; gamma: number } {
  const { data, cut, lengths } = chainRuns(runs, 11, (rng) => 1 + Math.floor(25 * rng.uniform())), index = indexEpisodes(data);
  const tails = { finalStateValues: new Float64Array(data.episodeCount).fill(truth), tailWeights: Float64Array.from(cut, (c, k) => (c ? chainDiscount ** lengths[k] : 0)) };
  return { prepared: perDecisionData(importanceWeightTable(data, index, candidate, behaviour), exactValues(data), tails), gamma: chainDiscount };
}

function cascadeInputs(present: boolean): { prepared: PerDecisionData; gamma: number } {
  const { table, tails, values } = unevenLogInputs(discount, present);
  return { prepared: perDecisionData(table, values, tails), gamma: discount };
}

function subLog(p: PerDecisionData, runs: readonly number[]): PerDecisionData {
  const at = new Map(runs.map((k, i) => [k, i])), H = p.horizon;
  const pick: number[] = [], stepOffsets = new Int32Array(H + 1);
  for (let t = 0; t < H; t++) {
    for (let j = p.stepOffsets[t]; j < p.stepOffsets[t + 1]; j++) if (at.has(p.episode[j])) pick.push(j);
    stepOffsets[t + 1] = pick.length;
  }
  const take = (a: Float64Array) => Float64Array.from(pick, (j) => a[j]), none = new Int32Array(H + 2);
  return {
    ...p, episodes: runs.length, stepOffsets, episode: Int32Array.from(pick, (j) => at.get(p.episode[j])!),
    scaled: take(p.scaled), scaledBefore: take(p.scaledBefore), rewards: take(p.rewards), actionValues: null, stateValues: null,
    endOffsets: none, endEpisode: new Int32Array(0), endWeight: new Float64Array(0), endValue: new Float64Array(0),
    absorbedOffsets: none, absorbedEpisode: new Int32Array(0), absorbedWeight: new Float64Array(0),
    cutOffsets: none, cutEpisode: new Int32Array(0), cutWeight: new Float64Array(0),
  };
}
