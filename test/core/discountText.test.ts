/**
 * A discount as the sentences name it (src/core/horizonText.ts discountText): 1 − γ to two
 * significant digits. The swept discounts of a project at γ = 0.999 (γ^(1/f), f = ½ … 2) were written
 * "0.998", "0.999", "0.999", "0.999", "0.999" at three significant digits — four alike — and at
 * γ = 0.9992 the longest horizon's (0.9996) as "1", which no discount is. Values worked by hand.
 */
import { describe, expect, it } from 'vitest';
import { discountText } from '../../src/core/horizonText';
import { plainNumber } from '../../src/figures/parts/uncertainNumber';

describe('discountText', () => {
  it('keeps the swept discounts of γ = 0.999 apart and below 1', () => {
    const swept = [0.5, 0.75, 1, 1.5, 2].map((f) => 0.999 ** (1 / f));
    expect(swept.map((g) => plainNumber(g, 3))).toEqual(['0.998', '0.999', '0.999', '0.999', '0.999']); // what the warning said before
    expect(plainNumber(0.9992 ** 0.5, 3)).toBe('1');
    expect(discountText(0.9992 ** 0.5)).toBe('0.9996');
    const texts = swept.map(discountText);
    expect(texts).toEqual(['0.998', '0.9987', '0.999', '0.99933', '0.9995']);
    for (const t of texts) expect(Number(t)).toBeLessThan(1);
  });

  it('writes the usual discounts as they are typed, and the heating loop’s swept ones at three decimals', () => {
    expect([0.9, 0.95, 0.97, 0.99, 0.5].map(discountText)).toEqual(['0.9', '0.95', '0.97', '0.99', '0.5']);
    expect([0.95 ** 2, 0.95 ** (1 / 0.75), 0.95 ** (1 / 1.5), 0.95 ** 0.5].map(discountText)).toEqual(['0.902', '0.934', '0.966', '0.975']);
    expect(discountText(0.999996)).toBe('0.999996');
  });
});
