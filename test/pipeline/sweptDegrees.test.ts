import { describe, expect, it } from 'vitest';
import { sweptDegrees } from '../../src/pipeline/assessSensitivity';
import { COMPARED_DEGREES } from '../../src/pipeline/assessClasses';
import { POLYNOMIAL_DEGREE_RANGE } from '../../src/core/limits';

// The sensitivity sweep's degrees: three neighbours of the project's own, never below the lowest degree
// the function-class check compares unless the project's own is lower. Why degree 1 is left out: a Q linear
// in (s, a) cannot hold the value of a quadratic cost, whose Q is quadratic in (s, a) (the linear-quadratic
// regulator's value; common practice, e.g. Bertsekas, Dynamic Programming and Optimal Control, vol. 1, ch. 4,
// from memory), so a ranking that turned at degree 1 would say nothing about the candidates.
describe('sweptDegrees', () => {
  const highest = POLYNOMIAL_DEGREE_RANGE.max;

  it('takes three degrees from the compared classes’ lowest up, the project’s own among them', () => {
    expect(COMPARED_DEGREES[0]).toBe(2);
    expect(sweptDegrees(2, highest)).toEqual([2, 3, 4]);
    expect(sweptDegrees(3, highest)).toEqual([2, 3, 4]);
    expect(sweptDegrees(4, highest)).toEqual([3, 4, 5]);
  });

  it('keeps three at the schema’s highest degree, and goes below 2 only for a project that is below it', () => {
    expect(sweptDegrees(highest, highest)).toEqual([highest - 2, highest - 1, highest]);
    expect(sweptDegrees(1, highest)).toEqual([1, 2, 3]);
  });

  it('always holds the project’s own degree, in order, within the schema’s range', () => {
    for (let own = POLYNOMIAL_DEGREE_RANGE.min; own <= highest; own++) {
      const degrees = sweptDegrees(own, highest);
      expect(degrees).toContain(own);
      expect(degrees.length).toBe(3);
      expect([...degrees].sort((a, b) => a - b)).toEqual(degrees);
      expect(Math.min(...degrees)).toBeGreaterThanOrEqual(Math.min(own, COMPARED_DEGREES[0]));
    }
  });
});
