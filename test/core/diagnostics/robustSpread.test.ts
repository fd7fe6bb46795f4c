/**
 * The robust spread of replicates (robustSpread.ts) against outside facts: the normal law's upper
 * quartile Φ⁻¹(0.75) = 0.6745 (standard normal table, e.g. Abramowitz & Stegun, "Handbook of
 * Mathematical Functions", 1964, Table 26.5 — value from memory); a sample whose quartiles are
 * ±0.6745σ reads exactly σ; and the 25 % breakdown point of the interquartile range (Rousseeuw &
 * Croux, JASA 1993): a few wild values leave it nearly where it was, while the standard deviation
 * follows them.
 */
import { describe, expect, it } from 'vitest';
import { NORMAL_INTERQUARTILE_RANGE, normalisedInterquartileRange } from '../../../src/core/diagnostics/robustSpread';
import { createRandom } from '../../../src/core/random';

describe('normalised interquartile range', () => {
  it('uses the normal table quartile 0.6745', () => {
    expect(NORMAL_INTERQUARTILE_RANGE / 2).toBeCloseTo(0.6745, 4);
  });

  it('reads σ from a sample whose quartiles are ±0.6745σ (Hyndman–Fan 7: with 5 values they are the 2nd and 4th)', () => {
    const sigma = 0.3, q = (NORMAL_INTERQUARTILE_RANGE / 2) * sigma;
    expect(normalisedInterquartileRange([9, -q, 0, q, -4])).toBeCloseTo(sigma, 12);
  });

  it('matches the standard deviation on normal draws and ignores 3 % runaway values that inflate it tenfold', () => {
    const rng = createRandom(5), n = 1000, sigma = 0.25;
    const clean = Array.from({ length: n }, () => -12 + sigma * rng.normal());
    const wild = clean.map((v, k) => (k % 33 === 0 ? v + (k % 2 === 0 ? 40 : -40) : v));
    const sd = (xs: number[]) => { const m = xs.reduce((s, x) => s + x, 0) / xs.length; return Math.sqrt(xs.reduce((s, x) => s + (x - m) ** 2, 0) / (xs.length - 1)); };
    expect(normalisedInterquartileRange(clean) / sigma).toBeGreaterThan(0.9); // sampling of 1000 draws: IQR-based σ̂ has ≈ 3.7 % relative error
    expect(normalisedInterquartileRange(clean) / sigma).toBeLessThan(1.1);
    expect(sd(wild)).toBeGreaterThan(10 * sigma);
    expect(normalisedInterquartileRange(wild) / sigma).toBeLessThan(1.15);
  });

  it('gives NaN when a value is not finite, and refuses fewer than two values', () => {
    expect(normalisedInterquartileRange([1, Number.NaN, 2])).toBeNaN();
    expect(() => normalisedInterquartileRange([1])).toThrow(/at least 2/);
  });
});
