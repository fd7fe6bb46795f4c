/**
 * The terminal's numbers at the precision of their uncertainty, against the GUM's worked way of
 * quoting a result (JCGM 100:2008 §7.2.2: m_S = 100.021 47 g with u_c = 0.35 mg is written
 * "(100.021 47 ± 0.000 35) g" — the value to the decimal place of the uncertainty's two significant
 * digits; from memory) and against the report's own writer of the same rule, so screen, report and
 * terminal print one interval alike (figures/parts/uncertainNumber.ts with U+2212 minus, as the report calls it).
 */
import { describe, expect, it } from 'vitest';
import { atDecimals, errorDecimals, intervalText, ratioText, rowDecimals } from '../../src/cli/uncertainNumberText';
import { intervalAtPrecision, valueAtPrecision } from '../../src/figures/parts/uncertainNumber';

describe('numbers at the precision of their uncertainty, on the command line', () => {
  it('writes the GUM §7.2.2 example as the GUM does', () => {
    const d = errorDecimals(0.00035);
    expect([atDecimals(100.02147, d), atDecimals(0.00035, d)]).toEqual(['100.02147', '0.00035']);
  });

  it('writes a value and its standard error at the error’s two significant digits', () => {
    expect([atDecimals(7.71825, errorDecimals(1.27478)), atDecimals(1.27478, errorDecimals(1.27478))]).toEqual(['7.7', '1.3']);
    expect(atDecimals(-0.84659, errorDecimals(0.0123))).toBe('-0.847');
  });

  it('prints an interval and a value read with it as the report does (apart from the minus sign)', () => {
    const cases: [number, [number, number]][] = [[8.3582, [6.581, 10.34]], [-0.84659, [-1.0445, -0.62981]], [38.527, [-108.25, 130.92]], [0.012345, [0.0101, 0.0149]]];
    for (const [value, iv] of cases) {
      expect(intervalText(iv)).toBe(intervalAtPrecision(iv).replace(/\u2212/g, '-'));
      expect(atDecimals(value, rowDecimals(iv))).toBe(valueAtPrecision(value, iv).replace(/\u2212/g, '-'));
    }
    expect(intervalText([6.581, 10.34])).toBe('[6.58, 10.34]');
  });

  it('falls back to four significant digits where no interval or error sets the precision', () => {
    expect(atDecimals(7.28581, rowDecimals(null))).toBe('7.286');
    expect(atDecimals(7.28581, rowDecimals(null, 0))).toBe('7.286');
    expect(intervalText(null)).toBe('—');
    expect(atDecimals(Number.NaN, 2)).toBe('—');
  });

  it('never writes negative zero, and writes large ratios as whole numbers', () => {
    expect(atDecimals(-0.0004, 2)).toBe('0.00');
    expect([ratioText(4354.5), ratioText(4.4964), ratioText(240.56)]).toEqual(['4355', '4.5', '241']);
  });

  // A cost summed over a long horizon easily reaches millions (J = 1,234,567.9 ± 3.2): the GUM §7.2.2 rule
  // (the value to the place of the uncertainty's two significant digits; common practice) holds at any
  // magnitude, so the value must not fall back to three significant digits ("1.23e+6 ± 3.2" claims ±3
  // beside a rounding of ±5,000, and two candidates 100 apart print alike).
  it('keeps a large value at the precision of its uncertainty rather than three significant digits', () => {
    const d = errorDecimals(3.2);
    expect([atDecimals(1234567.891, d), atDecimals(3.2, d)]).toEqual(['1234567.9', '3.2']);
    const iv: [number, number] = [1234500.2, 1234600.7]; // width 100.5: three significant digits at the units
    expect(intervalText(iv)).toBe('[1234500, 1234601]');
    expect(atDecimals(1234555.55, rowDecimals(iv))).toBe('1234556');
    expect(intervalText([-2345678.9, -2345600.1])).toBe('[-2345678.9, -2345600.1]');
  });
});
