import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { niceNumber, niceTicks, TickRangeError } from '../../src/figures/parts/niceTicks';
import { formatTick, formatValue, fractionDigitsOf, tickStepOf } from '../../src/figures/parts/tickFormat';

describe('niceNumber (Heckbert, "Nice numbers for graph labels", Graphics Gems, 1990)', () => {
  // Heckbert's rules: rounded — fraction < 1.5 → 1, < 3 → 2, < 7 → 5, else 10; ceiling — ≤ 1, ≤ 2, ≤ 5, else 10.
  it.each([
    [7.3, true, 10], [2.5, true, 2], [0.034, true, 0.05], [1.4, true, 1], [6.9, true, 5],
    [7.3, false, 10], [2.5, false, 5], [0.034, false, 0.05], [1, false, 1], [120, false, 200],
  ])('niceNumber(%f, %s) = %f', (x, round, expected) => {
    expect(niceNumber(x, round)).toBeCloseTo(expected, 12);
  });
});

describe('niceTicks', () => {
  it('0 … 100 in about 5 ticks gives steps of 20 (Heckbert’s procedure worked by hand)', () => {
    const ticks = niceTicks(0, 100, 5);
    expect(ticks.step).toBe(20);
    expect(ticks.values).toEqual([0, 20, 40, 60, 80, 100]);
    expect(ticks.fractionDigits).toBe(0);
  });

  it('keeps only ticks inside the range and shows decimal steps exactly', () => {
    const ticks = niceTicks(2.03, 2.71, 5);
    expect(ticks.step).toBeCloseTo(0.2, 15);
    expect(ticks.values).toEqual([2.2, 2.4, 2.6]);
    expect(ticks.fractionDigits).toBe(1);
  });

  it('property: ticks lie in [min, max], are equally spaced by a 1-2-5 step, and there are at least two', () => {
    fc.assert(fc.property(
      fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: 1e-6, max: 1e6, noNaN: true }), fc.integer({ min: 2, max: 11 }),
      (min, width, target) => {
        const max = min + width;
        fc.pre(max > min);
        const { step, values } = niceTicks(min, max, target);
        const mantissa = step / 10 ** Math.floor(Math.log10(step) + 1e-12);
        expect([1, 2, 5].some((m) => Math.abs(mantissa - m) < 1e-9)).toBe(true);
        expect(values.length).toBeGreaterThanOrEqual(2);
        for (const v of values) {
          expect(v).toBeGreaterThanOrEqual(min - step * 1e-9);
          expect(v).toBeLessThanOrEqual(max + step * 1e-9);
        }
        // Spacing exact up to the doubles' own resolution at the ticks' magnitude.
        const tolerance = (i: number) => step * 1e-6 + 8 * Number.EPSILON * Math.abs(values[i]);
        for (let i = 1; i < values.length; i++) expect(Math.abs(values[i] - values[i - 1] - step)).toBeLessThan(tolerance(i));
      },
    ), { seed: 4242, numRuns: 300 });
  });

  it('refuses an empty or reversed range', () => {
    expect(() => niceTicks(1, 1)).toThrow(TickRangeError);
    expect(() => niceTicks(2, 1)).toThrow(/min < max/);
    expect(() => niceTicks(0, Infinity)).toThrow(TickRangeError);
  });
});

describe('tick text', () => {
  it('fixed notation with the tick digits, grouping thousands', () => {
    expect(formatTick(1234.5, 1)).toBe('1,234.5');
    expect(formatTick(0.25, 2)).toBe('0.25');
    expect(formatTick(-0, 3)).toBe('0.000'); // zero with the axis' decimals, never '−0'
  });
  it('exponent notation only past the stated tick width (1e9) and for very small magnitudes', () => {
    expect(formatTick(2.5e7, 0)).toBe('25,000,000'); // fixed, as the tables and the command line write millions
    expect(formatTick(2.5e9, 0)).toBe('2.50\u00a0×\u00a010⁹');
    expect(formatTick(3e-6, 6)).toBe('3.00\u00a0×\u00a010⁻⁶'); // true minus sign (U+2212)
    expect(formatValue(123456.789)).toBe('123,500');
    expect(formatValue(0.012345)).toBe('0.01235');
    expect(formatValue(NaN)).toBe('NaN');
  });

  // The screen review saw two colour-bar ticks with one label: in exponent form the mantissa had two
  // digits whatever the step. Every tick set of a narrow range far from 0 (or near 1e9 and beyond)
  // must label each tick differently. The ranges are ours; the property is the one any axis needs.
  it('never writes two ticks of one set alike, in exponent form too', () => {
    const ranges: [number, number][] = [[9.651005724282472e-8, 9.651007378973049e-8], [-7.369244237136676e-15, -7.369243335238679e-15],
      [90457894881.46828, 90531968624.54294], [-85250184957520.19, -85249197898227.19], [2.6547404484146937e-6, 2.6549271256411538e-6],
      [0.99999, 1.00001], [-5e-5, 5e-5], [1e9, 1.0000001e9]];
    for (const [lo, hi] of ranges) {
      for (const target of [2, 5, 11]) {
        const t = niceTicks(lo, hi, target), labels = t.values.map((v) => formatTick(v, t.fractionDigits, t.step));
        expect(new Set(labels).size, `${lo}…${hi}: ${labels.join(' | ')}`).toBe(labels.length);
        // An axis knows only its tick values: the same labels from them.
        expect(t.values.map((v) => formatTick(v, fractionDigitsOf(t.values), tickStepOf(t.values)))).toEqual(labels);
      }
    }
    expect(formatTick(9.6515e-8, 12, 5e-12)).toBe('9.6515\u00a0×\u00a010⁻⁸');
    expect(formatTick(2.5e9, 0, 5e8)).toBe('2.50\u00a0×\u00a010⁹'); // a coarse step keeps the two digits
  });
});
