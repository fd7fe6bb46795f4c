/**
 * The block route for bootstrap resamples (perDecisionResamples.ts) against the straightforward one
 * (perDecisionEstimates, one pass per resample): the same weighted per-decision importance sampling
 * and weighted doubly robust sums (Thomas & Brunskill 2016), multiplied in another order, so equal up
 * to rounding — on a log with episodes of unequal length (so the ranked route's runs reach different
 * steps, and a step's weight is split where runs end), terminal ends and time-limit tails, for blocks
 * of every size, with and without Q̂ and V̂.
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { episodeEnds } from '../../../src/core/loggedReturn';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { ImportanceSamplingError, perDecisionData, perDecisionEstimates, type PerDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, prepareResampleEntries, RESAMPLE_BLOCK } from '../../../src/core/offPolicy/perDecisionResamples';
import { createGaussianPolicy } from '../../../src/core/policy';
import type { TransitionSet } from '../../../src/core/transitions';
import { simulateLog, type TestController } from '../linearGaussianPlant';
import { candidateFamily, cascadeLogging, cascadePlant, startLaws } from '../testPlants';

const policyOf = (c: TestController) => createGaussianPolicy({ offset: c.offset, gain: [c.gain], std: c.std }, 3);

/** Episodes of unequal length (every fifth cut at 30 steps), some ending in a terminal state (invented, test only). */
function unevenLog(): TransitionSet {
  const full = simulateLog(cascadePlant, cascadeLogging, { episodes: 25, steps: 40, seed: 3, start: startLaws(cascadePlant, cascadeLogging)[0][1] });
  const keep = Array.from({ length: full.count }, (_, i) => i).filter((i) => full.episode[i] % 5 !== 0 || i % 40 < 30);
  const pick = <T extends Float64Array | Int32Array | Uint8Array>(a: T, w: number) => keep.flatMap((i) => Array.from(a.subarray(i * w, (i + 1) * w)));
  return {
    ...full, count: keep.length, states: Float64Array.from(pick(full.states, 3)), actions: Float64Array.from(pick(full.actions, 1)),
    rewards: Float64Array.from(pick(full.rewards, 1)), nextStates: Float64Array.from(pick(full.nextStates, 3)),
    terminal: Uint8Array.from(keep, (i) => (full.episode[i] % 7 === 3 && i % 40 === 39 ? 1 : 0)),
    episode: Int32Array.from(pick(full.episode, 1)), sourceLine: Int32Array.from(pick(full.sourceLine, 1)),
  };
}

const data = unevenLog(), index = indexEpisodes(data), discount = 0.95;
const table = importanceWeightTable(data, index, policyOf(candidateFamily(cascadeLogging)[3][1]), policyOf(cascadeLogging));
const tails = { finalStateValues: Float64Array.from({ length: data.episodeCount }, (_, k) => -8 - Math.cos(k)), tailWeights: episodeEnds(data, discount).tailWeights };
const values = { actionValues: Float64Array.from(index.order, (i) => Math.cos(data.rewards[i])), stateValues: Float64Array.from(index.order, (i) => Math.sin(data.rewards[i])) };

function expectSame(fast: PerDecisionEstimates | ImportanceSamplingError, plain: PerDecisionEstimates): void {
  if (fast instanceof ImportanceSamplingError) throw fast;
  expect(fast.importanceSampling).toBeCloseTo(plain.importanceSampling, 12);
  expect(fast.importanceSamplingTail).toBeCloseTo(plain.importanceSamplingTail, 12);
  if (plain.doublyRobust === null) expect(fast.doublyRobust).toBeNull();
  else expect(fast.doublyRobust!).toBeCloseTo(plain.doublyRobust, 12);
}

describe('per-decision estimates on a block of resamples', () => {
  it.each([
    ['Q̂, V̂ and tails', perDecisionData(table, values, tails)],
    ['importance sampling alone, no tails', perDecisionData(table, null)],
  ])('equal the one-pass estimates resample by resample (%s)', (_, prepared) => {
    const entries = prepareResampleEntries(prepared);
    for (let size = 1; size <= RESAMPLE_BLOCK; size++) {
      const block = Array.from({ length: size }, (_, b) => episodeMultiplicities(data.episodeCount, 17, 10 * size + b));
      const fast = perDecisionResamples(entries, discount, block);
      expect(fast).toHaveLength(size);
      block.forEach((c, b) => expectSame(fast[b], perDecisionEstimates(prepared, discount, c)));
    }
  });

  it('give the full-data estimates with unit multiplicities', () => {
    const prepared = perDecisionData(table, values, tails), ones = new Uint32Array(data.episodeCount).fill(1);
    expect(prepared.endEpisode.length).toBeGreaterThan(0); // the tails are exercised
    expectSame(perDecisionResamples(prepareResampleEntries(prepared), discount, [ones])[0], perDecisionEstimates(prepared, discount));
  });

  it('refuse entries whose weight before a decision is not the same run’s weight one step earlier (the ranked route rests on it)', () => {
    const prepared = perDecisionData(table, null), scaledBefore = prepared.scaledBefore.slice();
    scaledBefore[prepared.stepOffsets[2] + 1] *= 0.5;
    expect(() => prepareResampleEntries({ ...prepared, scaledBefore })).toThrow(ImportanceSamplingError);
  });

  it('refuse a block of the wrong size or multiplicities of the wrong length', () => {
    const entries = prepareResampleEntries(perDecisionData(table, null));
    expect(() => perDecisionResamples(entries, discount, [])).toThrow(RangeError);
    expect(() => perDecisionResamples(entries, discount, [new Uint32Array(3)])).toThrow(ImportanceSamplingError);
  });
});
