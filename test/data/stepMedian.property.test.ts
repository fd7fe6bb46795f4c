/**
 * The run rule's sampling period (stepMedian.ts) against the textbook median of the same steps: the
 * positive differences of adjacent kept timestamps, sorted (Array.prototype.sort with a numeric
 * comparison), the middle one or the mean of the two middle ones — on random clocks with a few step
 * values (the tally's ground), with many (past TALLIED_STEPS, the selection's), with repeated and
 * backward timestamps, unreadable ones (NaN) and excluded rows; the same double, bit for bit.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { medianStepSeconds, TALLIED_STEPS } from '../../src/data/stepMedian';

function textbookMedian(t: number[], kept: number[]): number {
  const steps: number[] = [];
  for (let r = 1; r < t.length; r++) {
    const step = t[r] - t[r - 1];
    if (kept[r] && kept[r - 1] && step > 0) steps.push(step);
  }
  if (steps.length === 0) return NaN;
  steps.sort((a, b) => a - b);
  const mid = steps.length >> 1;
  return steps.length % 2 ? steps[mid] : (steps[mid - 1] + steps[mid]) / 2;
}

/** A clock that moves by one of `periods` per row, now and then repeating, stepping back or unreadable. */
const clock = (periods: fc.Arbitrary<number[]>) => fc.tuple(periods, fc.array(fc.tuple(fc.nat(1000), fc.nat(19), fc.boolean()), { maxLength: 400 }))
  .map(([choices, rows]) => {
    const t: number[] = [], kept: number[] = [];
    let now = 1000;
    for (const [pick, event, keep] of rows) {
      if (event === 0) now -= choices[0];
      else if (event === 1) t.push(NaN);
      else if (event > 2) now += choices[pick % choices.length];
      if (event !== 1) t.push(now);
      kept.push(keep || event > 5 ? 1 : 0);
    }
    return { t: t.slice(0, kept.length), kept };
  });

const few = fc.array(fc.oneof(fc.constantFrom(0.1, 1, 10, 0.25), fc.double({ min: 1e-3, max: 1e3, noNaN: true })), { minLength: 1, maxLength: 4 });
const many = fc.array(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), { minLength: TALLIED_STEPS + 1, maxLength: 3 * TALLIED_STEPS });

describe('the sampling period is the median of the steps', () => {
  it.each([['a few step values (tallied)', few], ['many step values (selected)', many]])('%s: 2,000 random clocks', (_, periods) => {
    fc.assert(
      fc.property(clock(periods), ({ t, kept }) => {
        expect(Object.is(medianStepSeconds(Float64Array.from(t), Uint8Array.from(kept)), textbookMedian(t, kept))).toBe(true);
      }),
      { seed: 35, numRuns: 2000 },
    );
  });

  it('a fixed period of 10 s over a million rows, and one more step value in the middle', () => {
    const t = Float64Array.from({ length: 1_000_000 }, (_, r) => 10 * r), kept = new Uint8Array(t.length).fill(1);
    expect(medianStepSeconds(t, kept)).toBe(10);
    t.fill(0).forEach((_, r) => { t[r] = r < 500_000 ? 2 * r : 1e6 + 3 * (r - 500_000); });
    // 500,000 steps of 2 (the last from 999,998 to 10⁶), then 499,999 of 3: the middle one of 999,999 is a 2
    expect(medianStepSeconds(t, kept)).toBe(2);
    kept[0] = 0; // 999,998 steps: 499,999 of 2 and 499,999 of 3, the two middle ones are 2 and 3
    expect(medianStepSeconds(t, kept)).toBe(2.5);
    expect(medianStepSeconds(t, kept)).toBe(textbookMedian(Array.from(t), Array.from(kept)));
  });
});
