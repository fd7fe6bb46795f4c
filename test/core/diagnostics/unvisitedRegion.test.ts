/** The never-visited region on a grid, by hand on a 4×3 example (a 3×3 neighbourhood counts as covered). */
import { describe, expect, it } from 'vitest';
import { uncoveredGridPoints, uncoveredShare } from '../../../src/core/diagnostics/unvisitedRegion';

describe('uncoveredGridPoints', () => {
  it('marks grid points with no visit at themselves or a neighbour', () => {
    const visits = [
      1, 0, 0, 0,
      0, 0, 0, 0,
      0, 0, 0, 0,
    ];
    expect(Array.from(uncoveredGridPoints(visits, 4, 3))).toEqual([
      0, 0, 1, 1,
      0, 0, 1, 1,
      1, 1, 1, 1,
    ]);
    expect(uncoveredShare(visits, 4, 3)).toBeCloseTo(8 / 12, 12);
    expect(() => uncoveredGridPoints([1, 2], 4, 3)).toThrow(/4×3/);
  });
});
