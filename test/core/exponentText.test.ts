/**
 * Small and large numbers to the user: "9.88 × 10⁻¹¹" typeset (ISO 80000-1 §7.3 writes a power of ten
 * with ×; common practice), "9.88e-11" on the terminal, from one writer; and the pipeline's messages
 * typeset for the app and the report.
 */
import { describe, expect, it } from 'vitest';
import { ASCII_MINUS, exponentText, powerOfTen, TRUE_MINUS } from '../../src/core/exponentText';
import { typesetText } from '../../src/core/typesetText';
import { plainNumber } from '../../src/figures/parts/uncertainNumber';
import { significant } from '../../src/cli/textTable';

const NBSP = '\u00a0';

describe('exponentText', () => {
  it('writes a power of ten where text is typeset and the ASCII e-form on the terminal', () => {
    expect(exponentText(9.88e-11, 2)).toBe(`9.88${NBSP}×${NBSP}10⁻¹¹`);
    expect(exponentText(-9.88e-11, 2, TRUE_MINUS)).toBe(`\u22129.88${NBSP}×${NBSP}10⁻¹¹`);
    expect(exponentText(9.88e-11, 2, ASCII_MINUS)).toBe('9.88e-11');
    expect(exponentText(2.5e15, 3, ASCII_MINUS)).toBe('2.5e15'); // no "e+"
    expect(exponentText(1e6, 0, ASCII_MINUS)).toBe('1e6');
    expect(exponentText(3e-6, 2, TRUE_MINUS, true)).toBe(`3.00${NBSP}×${NBSP}10⁻⁶`);
    expect(powerOfTen(-11)).toBe('10⁻¹¹');
    expect(powerOfTen(0)).toBe('10⁰');
  });

  it('is the plain style\'s exponent form, and the terminal table\'s', () => {
    expect(plainNumber(9.876e-11, 3)).toBe(`9.88${NBSP}×${NBSP}10⁻¹¹`);
    expect(plainNumber(9.876e-11, 3, ASCII_MINUS)).toBe('9.88e-11');
    expect(significant(1.234e-5, 3)).toBe('1.2e-5');
    expect(significant(2.5e7, 4)).toBe('2.50e7'); // was "2.50e+7"
  });

  it('typesets the terminal forms in a shared message, and nothing inside words', () => {
    expect(typesetText('relative residual 9.88e-11; s·ρ(A)² near 1')).toBe(`relative residual 9.88${NBSP}×${NBSP}10⁻¹¹; s·ρ(A)² near 1`);
    expect(typesetText('J = -0.5 in [-3.4, 12.3], linear-quadratic, v2e-5x')).toBe('J = \u22120.5 in [\u22123.4, 12.3], linear-quadratic, v2e-5x');
    expect(typesetText('beyond 1e6 after 3 iterations')).toBe(`beyond 1${NBSP}×${NBSP}10⁶ after 3 iterations`);
  });
});
