/**
 * The block route for bootstrap resamples (perDecisionResamples.ts) against the straightforward one
 * (perDecisionEstimates, one pass per resample): the same weighted per-decision importance sampling
 * and weighted doubly robust sums (Thomas & Brunskill 2016), multiplied in another order, so equal up
 * to rounding — on a log with episodes of unequal length (so the ranked route's runs reach different
 * steps, and a step's weight is split where runs end), terminal ends and time-limit tails, for blocks
 * of every size, with and without Q̂ and V̂. The present controller weighed against itself (every
 * weight 1) takes a shorter route that does not read the weights; it must give the general route's
 * numbers to the last bit (c·1 = c exactly, and the sums of counts are exact).
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

  it.each([
    ['Q̂, V̂ and tails', true],
    ['importance sampling alone, no tails', false],
  ])('with every weight 1, equal the general route bit for bit over several blocks of odd sizes (%s)', (_, withValues) => {
    const present = unevenLogInputs(discount, true), prepared = withValues ? perDecisionData(present.table, present.values, present.tails) : perDecisionData(present.table, null);
    const entries = prepareResampleEntries(prepared), general = { ...entries, unitWeight: false };
    expect(entries.unitWeight).toBe(true);
    for (const [first, size] of [[0, 7], [7, 5], [12, 1], [13, 3], [16, RESAMPLE_BLOCK]]) {
      const block = Array.from({ length: size }, (_, b) => episodeMultiplicities(present.data.episodeCount, 29, first + b));
      const short = perDecisionResamples(entries, discount, block), long = perDecisionResamples(general, discount, block);
      expect(short).toEqual(long); // toEqual on numbers is Object.is: bit for bit, −0 apart from +0
      block.forEach((c, b) => expectSame(short[b], perDecisionEstimates(prepared, discount, c)));
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
