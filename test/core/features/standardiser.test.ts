import { describe, expect, it } from 'vitest';
import { fitStandardiser, fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import type { TransitionSet } from '../../../src/core/transitions';

describe('input standardiser', () => {
  it('matches the textbook mean and population standard deviation', () => {
    // Hand-computed: column [2, 4, 4, 4, 5, 5, 7, 9] has mean 5 and population sd 2 (a standard worked example; common practice).
    const col = [2, 4, 4, 4, 5, 5, 7, 9];
    const rows = col.flatMap((v) => [v, 1e9 + v * 1e-3]);
    const fit = fitStandardiser(rows, col.length, 2);
    expect(fit.spec.mean[0]).toBeCloseTo(5, 14);
    expect(fit.spec.scale[0]).toBeCloseTo(2, 14);
    // A large offset with small spread is not "constant": the two-pass formula keeps its 2e-3 spread,
    // up to the rounding of 1e9 + v·1e-3 itself (half an ulp of 1e9 is 6e-8 per value).
    expect(Math.abs(fit.spec.scale[1] - 2e-3)).toBeLessThan(1.2e-7);
    expect(fit.constantColumns).toEqual([]);
  });

  it('reports constant columns and gives them scale 1', () => {
    const data = {
      count: 3, stateDim: 2, actionDim: 1,
      states: Float64Array.from([1, 7, 2, 7, 3, 7]),
      actions: Float64Array.from([0.5, 0.5, 0.5]),
    } as unknown as TransitionSet;
    const fit = fitStateActionStandardiser(data);
    expect(fit.constantColumns).toEqual([1, 2]);
    expect(fit.spec.mean).toEqual([2, 7, 0.5]);
    expect(fit.spec.scale[1]).toBe(1);
    expect(fit.spec.scale[2]).toBe(1);
  });
});
