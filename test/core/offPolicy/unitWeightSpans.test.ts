/**
 * The unit-weight span route (unitWeightSpans.ts: the present controller weighed against itself,
 * every weight 1, no run absorbed) against the straightforward per-decision estimates
 * (perDecisionEstimates, one pass per resample, step by step) and the stepwise block route
 * (perDecisionResamples without the spans): the same terms of weighted per-decision importance
 * sampling and weighted doubly robust (Thomas & Brunskill 2016) added in another order. Each
 * route's sum is within γ_k·A of the exact one, A the sum of the terms' magnitudes and
 * γ_k = k·u/(1 − k·u) with k the longest chain of additions (Higham, "Accuracy and Stability of
 * Numerical Algorithms", 2nd ed., §3.1 and §4.2): so the two differ by at most 2·γ_k·A, the bound
 * checked here, with k = e + H + 8 (a run's total over its span's steps, then the sum over the runs,
 * then over the spans). Logs: the invented cascade log of unevenCascadeLog.ts (runs of 40 and 30
 * steps, time-limit tails) with its end states taken out, and one whose runs all have one length.
 */
import { describe, expect, it } from 'vitest';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { episodeEnds } from '../../../src/core/loggedReturn';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { ImportanceSamplingError, perDecisionData, perDecisionEstimates, type PerDecisionData, type PerDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, prepareResampleEntries, RESAMPLE_BLOCK } from '../../../src/core/offPolicy/perDecisionResamples';
import { createGaussianPolicy } from '../../../src/core/policy';
import type { TransitionSet } from '../../../src/core/transitions';
import { cascadeLogging } from '../testPlants';
import { unevenLog, unevenLogInputs } from './unevenCascadeLog';

const discount = 0.95, u = 2 ** -53;
const logging = createGaussianPolicy({ offset: cascadeLogging.offset, gain: [cascadeLogging.gain], std: cascadeLogging.std }, 3);

/** The present controller's per-decision data on a log (every weight 1), with invented Q̂, V̂ and the time-limit tails. */
function presentInputs(data: TransitionSet, withValues: boolean): PerDecisionData {
  const index = indexEpisodes(data), table = importanceWeightTable(data, index, logging, logging);
  const tails = { finalStateValues: Float64Array.from({ length: data.episodeCount }, (_, k) => -8 - Math.cos(k)), tailWeights: episodeEnds(data, discount).tailWeights };
  const values = { actionValues: Float64Array.from(index.order, (i) => Math.cos(data.rewards[i]) - 3), stateValues: Float64Array.from(index.order, (i) => Math.sin(data.rewards[i]) - 2.5) };
  return withValues ? perDecisionData(table, values, tails) : perDecisionData(table, null, tails);
}

const withoutEnds = (data: TransitionSet): TransitionSet => ({ ...data, terminal: new Uint8Array(data.count) });
/** The cascade log cut to its first 30 steps in every run: one length. */
function evenLog(): TransitionSet {
  const full = withoutEnds(unevenLog()), keep: number[] = [], seen = new Map<number, number>();
  for (let i = 0; i < full.count; i++) {
    const k = full.episode[i], t = seen.get(k) ?? 0;
    seen.set(k, t + 1);
    if (t < 30) keep.push(i);
  }
  const pick = <T extends Float64Array | Int32Array | Uint8Array>(a: T, w: number) => keep.flatMap((i) => Array.from(a.subarray(i * w, (i + 1) * w)));
  return {
    ...full, count: keep.length, states: Float64Array.from(pick(full.states, 3)), actions: Float64Array.from(pick(full.actions, 1)), rewards: Float64Array.from(pick(full.rewards, 1)),
    nextStates: Float64Array.from(pick(full.nextStates, 3)), terminal: new Uint8Array(keep.length), episode: Int32Array.from(pick(full.episode, 1)), sourceLine: Int32Array.from(pick(full.sourceLine, 1)),
  };
}

/** A = Σ_t γ^t [Σ c(|r| + |Q̂|)/N_t + Σ c|V̂|/(N_t + E_t)] + Σ_t γ^t Σ_ends c|V̂_T|/(N_t + E_t): the magnitudes of the estimates' terms (unit weights). */
function termMagnitudes(d: PerDecisionData, c: ArrayLike<number>): number {
  let total = 0, g = 1;
  for (let t = 0; t <= d.horizon; t++, g *= discount) {
    let reached = 0, ending = 0, acting = 0, states = 0;
    for (let j = t < d.horizon ? d.stepOffsets[t] : 0; j < (t < d.horizon ? d.stepOffsets[t + 1] : 0); j++) {
      const ck = c[d.episode[j]];
      reached += ck;
      acting += ck * (Math.abs(d.rewards[j]) + Math.abs(d.actionValues?.[j] ?? 0));
      states += ck * Math.abs(d.stateValues?.[j] ?? 0);
    }
    for (let j = d.endOffsets[t]; j < d.endOffsets[t + 1]; j++) {
      ending += c[d.endEpisode[j]];
      states += 2 * c[d.endEpisode[j]] * Math.abs(d.endValue[j]); // in the correction and in the tail
    }
    if (reached > 0) total += (g * acting) / reached;
    if (reached + ending > 0) total += (g * states) / (reached + ending);
  }
  return total;
}

function expectWithin(fast: PerDecisionEstimates | ImportanceSamplingError, plain: PerDecisionEstimates, bound: number): void {
  if (fast instanceof ImportanceSamplingError) throw fast;
  expect(Math.abs(fast.importanceSampling - plain.importanceSampling)).toBeLessThanOrEqual(bound);
  expect(Math.abs(fast.importanceSamplingTail - plain.importanceSamplingTail)).toBeLessThanOrEqual(bound);
  if (plain.doublyRobust === null) expect(fast.doublyRobust).toBeNull();
  else expect(Math.abs(fast.doublyRobust! - plain.doublyRobust)).toBeLessThanOrEqual(bound);
}

describe('the unit-weight span route for the present controller', () => {
  it.each([
    ['runs of 40 and 30 steps, Q̂, V̂ and tails', () => presentInputs(withoutEnds(unevenLog()), true), 3],
    ['runs of 40 and 30 steps, importance sampling alone', () => presentInputs(withoutEnds(unevenLog()), false), 3],
    ['runs of one length, Q̂, V̂ and tails', () => presentInputs(evenLog(), true), 2],
  ])('agrees with the stepwise estimates to the rounding bound on every resample (%s)', (_, make, spanCount) => {
    const prepared = make(), entries = prepareResampleEntries(prepared, discount), stepwise = { ...entries, spans: null };
    expect(entries.spans).not.toBeNull();
    expect(entries.spans!.first.length - 1).toBe(spanCount); // the spans of steps reached by the same runs, and step H
    expect(prepared.endEpisode.length).toBeGreaterThan(0); // the tails are exercised
    const k = prepared.episodes + prepared.horizon + 8, gamma = (k * u) / (1 - k * u);
    for (const [first, size] of [[0, RESAMPLE_BLOCK], [8, 5], [13, 1]]) {
      const block = Array.from({ length: size }, (_, b) => episodeMultiplicities(prepared.episodes, 41, first + b));
      const fast = perDecisionResamples(entries, discount, block), steps = perDecisionResamples(stepwise, discount, block);
      block.forEach((c, b) => {
        const plain = perDecisionEstimates(prepared, discount, c), bound = 2 * gamma * termMagnitudes(prepared, c);
        expectWithin(fast[b], plain, bound);
        expectWithin(steps[b], plain, bound);
        expect((fast[b] as PerDecisionEstimates).importanceSampling).toBeCloseTo(plain.importanceSampling, 12);
      });
    }
  });

  it('gives the full-data estimates with unit multiplicities, to the rounding bound', () => {
    const prepared = presentInputs(withoutEnds(unevenLog()), true), ones = new Uint32Array(prepared.episodes).fill(1);
    const k = prepared.episodes + prepared.horizon + 8, bound = (2 * k * u * termMagnitudes(prepared, ones)) / (1 - k * u);
    expectWithin(perDecisionResamples(prepareResampleEntries(prepared, discount), discount, [ones])[0], perDecisionEstimates(prepared, discount), bound);
  });

  it('is not taken where a run is absorbed, where a weight is not 1, without the discount, or at another discount', () => {
    const absorbed = unevenLogInputs(discount, true);
    expect(prepareResampleEntries(perDecisionData(absorbed.table, absorbed.values, absorbed.tails), discount).spans).toBeNull();
    const candidate = unevenLogInputs(discount);
    expect(prepareResampleEntries(perDecisionData(candidate.table, candidate.values, candidate.tails), discount).spans).toBeNull();
    const prepared = presentInputs(withoutEnds(unevenLog()), true);
    expect(prepareResampleEntries(prepared).spans).toBeNull();
    const other = prepareResampleEntries(prepared, 0.9), block = [episodeMultiplicities(prepared.episodes, 5, 0)];
    expect(perDecisionResamples(other, discount, block)).toEqual(perDecisionResamples({ ...other, spans: null }, discount, block)); // the stepwise route, bit for bit
  });
});
