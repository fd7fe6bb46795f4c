/**
 * The sweep ranking's tie rule (src/core/rankingTie.ts): relative to the larger |J|, with a scale that
 * cannot vanish near 0, the size of the terms a J sums. The rounding values are IEEE 754 binary64 facts
 * (what any conforming double arithmetic gives); the scale's arithmetic is worked by hand below.
 */
import { describe, expect, it } from 'vitest';
import { RANKING_TIE_RELATIVE } from '../../src/core/limits';
import { rewardTermScale, tiedValues } from '../../src/core/rankingTie';

describe('the term scale S = mean |r| / (1 − γ)', () => {
  it('is the rewards’ mean magnitude over the discounted horizon', () => {
    // |1| + |−3| + |2| = 6, mean 2; 1/(1 − 0.5) = 2: S = 4 (by hand).
    expect(rewardTermScale(Float64Array.from([1, -3, 2]), 0.5)).toBe(4);
    // Gains and costs that cancel: the mean reward is 0, the scale is not.
    expect(rewardTermScale(Float64Array.from([5, -5, 5, -5]), 0.9)).toBeCloseTo(50, 12);
    expect(rewardTermScale(new Float64Array(0), 0.9)).toBe(0);
  });
});

describe('two J tied', () => {
  it('ties two zeros, with or without a scale', () => {
    expect(tiedValues(0, 0, 0)).toBe(true);
    expect(tiedValues(0, -0, 3)).toBe(true);
  });

  it('ties two values of zero reached by sums in another order, one each side of 0 too — which the relative rule alone never did', () => {
    // IEEE 754 binary64: (0.1 + 0.2) − 0.3 = 5.551115123125783e−17 and 0.1 + (0.2 − 0.3) = 2.7755575615628914e−17, both 0 exactly.
    const a = (0.1 + 0.2) - 0.3, b = 0.1 + (0.2 - 0.3);
    expect(a).toBe(5.551115123125783e-17);
    expect(b).toBe(2.7755575615628914e-17);
    expect(tiedValues(a, b, 0)).toBe(false); // relative to max(|a|, |b|) the tolerance is 5.6e−26: rounding read as a gap
    const scale = rewardTermScale(Float64Array.from([0.1, 0.2, -0.3]), 0.9); // mean 0.2 over 1/(1 − 0.9): S = 2
    expect(tiedValues(a, b, scale)).toBe(true);
    expect(tiedValues(a, -b, scale)).toBe(true); // opposite signs, both rounding about 0
  });

  it('still ranks a real gap near 0 and of mixed sign (−0.0004 against +0.0003)', () => {
    expect(tiedValues(-0.0004, 0.0003, 0)).toBe(false);
    expect(tiedValues(-0.0004, 0.0003, 2)).toBe(false);
    // Mixed signs differ by at least the larger magnitude, so they tie only within RANKING_TIE_RELATIVE · S of 0.
    expect(tiedValues(-0.4 * RANKING_TIE_RELATIVE, 0.3 * RANKING_TIE_RELATIVE, 1)).toBe(true);
    expect(tiedValues(-0.6 * RANKING_TIE_RELATIVE, 0.6 * RANKING_TIE_RELATIVE, 1)).toBe(false);
  });

  it('is the relative rule where |J| is above the scale', () => {
    expect(tiedValues(7, 7.000000000000001, 1)).toBe(true); // one unit in the last place
    expect(tiedValues(7, 7 * (1 + 1e-7), 1)).toBe(false); // a hundred times the rule
    expect(tiedValues(1e6, 1e6 * (1 + 0.5e-9), 1)).toBe(true);
    expect(tiedValues(1e6, 1e6 * (1 + 2e-9), 1)).toBe(false);
  });
});
