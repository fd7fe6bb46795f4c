/**
 * The report's "value ± standard error" (figures/parts/uncertainNumber.ts, valueWithError, which the report calls): the
 * error to two significant digits (JCGM 100, the GUM, §7.2.2 — common practice). A positive standard
 * error must never print as zero: where two significant digits need more than the ten decimals the
 * fixed style allows, the plain number style (exponent form) is the honest one. Numbers by hand.
 */
import { describe, expect, it } from 'vitest';
import { valueWithError } from '../../src/figures/parts/uncertainNumber';

/** The typeset text read back as a number: "−1 × 10⁻¹¹" (core/exponentText.ts) → −1e-11. */
const SUPERSCRIPTS = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const asNumber = (text: string) => Number(text.replace('\u2212', '-')
  .replace(/\u00a0×\u00a010([⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+)/, (_, e: string) => `e${[...e].map((c) => (c === '⁻' ? '-' : SUPERSCRIPTS.indexOf(c))).join('')}`));

describe('report value ± standard error at tiny errors', () => {
  it('keeps a positive error positive (5 ± 1e-11; 3e-12 ± 1e-12)', () => {
    expect(asNumber(valueWithError(5, 1e-11).error)).toBeGreaterThan(0);
    expect(asNumber(valueWithError(3e-12, 1e-12).error)).toBeGreaterThan(0);
    expect(asNumber(valueWithError(3e-12, 1e-12).value)).toBeGreaterThan(0);
  });

  it('still gives two significant digits where ten decimals suffice (5.7612 ± 0.1834 → 5.76 ± 0.18)', () => {
    expect(valueWithError(5.7612, 0.1834)).toEqual({ value: '5.76', error: '0.18' });
  });
});
