/** Numbers on screen and in fields: significant digits, exponents only at extremes, exact round trips. */
import { describe, expect, it } from 'vitest';
import { editableNumber, formatDuration, formatNumber, parseNumber, screenMessage } from '../../../src/renderer/src/format/numberFormat';

describe('number format', () => {
  it('shows a few significant digits with a true minus sign', () => {
    expect(formatNumber(8.358179, 6)).toBe('8.35818');
    expect(formatNumber(-29.18)).toBe('−29.18');
    expect(formatNumber(0.0002505)).toBe('0.0002505');
    expect(formatNumber(9.69e-11)).toBe('9.69\u00a0×\u00a010⁻¹¹');
    expect(formatNumber(1.5e6)).toBe('1500000'); // fixed notation for millions, one rule with the report and the terminal (figures/parts/uncertainNumber.ts)
    expect(formatNumber(Infinity)).toBe('∞');
  });

  it('typesets the exponents of a pipeline message as formatNumber does', () => {
    // The fit's message is written for the terminal too ("9.92e-11", core/fqe/fqeIteration.ts); on screen it reads as formatNumber writes 9.92e-11.
    expect(screenMessage('converged in 643 iterations (relative weight change 9.92e-11 ≤ tolerance 1.00e-10)'))
      .toBe(`converged in 643 iterations (relative weight change ${formatNumber(9.92e-11, 3)} ≤ tolerance 1.00\u00a0×\u00a010⁻¹⁰)`);
    expect(screenMessage('grew 3.5e+4-fold; degree-2 fit; 1e5 rows')).toBe('grew 3.5\u00a0×\u00a010⁴-fold; degree-2 fit; 1\u00a0×\u00a010⁵ rows');
    // A negative number's minus as the app writes it (U+2212, as formatNumber does); a hyphen after a word stays one.
    expect(screenMessage('J = -1.5e-3, range x-2e-3')).toBe(`J = \u22121.5\u00a0×\u00a010⁻³, range x-2\u00a0×\u00a010⁻³`);
  });

  it('writes field values that read back to the same number', () => {
    for (const x of [1e-6, 1e-10, 0.95, 189, -60, 123456.789, 5000, 1e12]) expect(parseNumber(editableNumber(x))).toBe(x);
    expect(editableNumber(1e-6)).toBe('1e-6');
    expect(editableNumber(null)).toBe('');
  });

  // The screen review: a script-written project file's 0.1 + 0.2 showed "0.30000000000000004" in a field.
  // 15 significant digits always read back for decimal text of up to 15 digits (IEEE 754-2008 §5.12.2).
  it('shows a script’s floating-point noise as the number meant, at 15 significant digits', () => {
    expect(editableNumber(0.1 + 0.2)).toBe('0.3');
    expect(editableNumber(1.1 * 3)).toBe('3.3'); // 3.3000000000000003
    expect(editableNumber(-(0.7 + 0.1))).toBe('-0.8'); // −0.7999999999999999
    expect(editableNumber(1e-7 * 3)).toBe('3e-7'); // 2.9999999999999997e-7
    for (const x of [0.123456789012345, 98765.4321098765, 1.5e-9, 2.5e11]) expect(parseNumber(editableNumber(x))).toBe(x);
  });

  it('refuses text that is not a number', () => {
    for (const text of ['', 'abc', '1,5', '1.2.3', '0x1A', 'Infinity', '1e400']) expect(parseNumber(text)).toBeNull();
    expect(parseNumber(' −2.5 ')).toBe(-2.5);
    expect(parseNumber('.5')).toBe(0.5);
  });

  it('says durations the way people do', () => {
    expect(formatDuration(400)).toBe('< 1 s');
    expect(formatDuration(12_400)).toBe('12 s');
    expect(formatDuration(65_000)).toBe('1 min 05 s');
    expect(formatDuration(3_720_000)).toBe('1 h 02 min');
  });
});
