/**
 * A bound in words is rounded outward, so the sentence stays true of every row (src/figures/parts/boundText.ts).
 * Values worked by hand: −0.1/19 = −0.0052631578…, whose nearest 4-digit text −0.005263 lies above it.
 */
import { describe, expect, it } from 'vitest';
import { boundText } from '../../src/figures/parts/boundText';
import { ASCII_MINUS } from '../../src/figures/parts/uncertainNumber';

describe('a bound in words', () => {
  it('rounds a floor down and a ceiling up where the nearest rounding would move it inward', () => {
    expect(boundText(-0.1 / 19, 'lower', 4, ASCII_MINUS)).toBe('-0.005264');
    expect(boundText(-0.1 / 19, 'upper', 4, ASCII_MINUS)).toBe('-0.005263');
    expect(boundText(0.1 / 19, 'upper', 4, ASCII_MINUS)).toBe('0.005264');
    expect(boundText(-0.1 / 19 / 0.05, 'lower', 4, ASCII_MINUS)).toBe('-0.1053');
    expect(boundText(123456, 'upper', 4, ASCII_MINUS)).toBe('123500');
    expect(boundText(123456, 'lower', 4, ASCII_MINUS)).toBe('123400');
  });

  it('keeps an end that is its own text up to the certain bounds\' 1e−12 widening, and 0 and the infinities as they are', () => {
    expect(boundText(4 * (1 + 1e-12), 'upper', 4, ASCII_MINUS)).toBe('4');
    expect(boundText(-4 * (1 + 1e-12), 'lower', 4, ASCII_MINUS)).toBe('-4');
    expect(boundText(0, 'lower')).toBe('0');
    expect(boundText(-Infinity, 'lower')).toBe('−∞');
  });
});
