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
import { ImportanceSamplingError, perDecisionData, perDecisionEstimates, type PerDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, prepareResampleEntries, RESAMPLE_BLOCK } from '../../../src/core/offPolicy/perDecisionResamples';
import { unevenLogInputs } from './unevenCascadeLog';

const discount = 0.95, { data, table, tails, values } = unevenLogInputs(discount);

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
