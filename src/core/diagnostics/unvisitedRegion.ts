/**
 * The unvisited share of the value-surface grid above which the assessment cautions that the surfaces
 * are mostly extrapolated: more than half the grid (ours, a display choice: below it the share is
 * stated plainly, above it as a caution). The rule (unvisitedNeedsCaution) and the words that state the
 * limit (pipeline/unvisitedWords.ts) both read it, so they cannot drift apart.
 */
export const UNVISITED_CAUTION_SHARE = 0.5;

/** Whether the unvisited share is large enough for a caution: above UNVISITED_CAUTION_SHARE. */
export function unvisitedNeedsCaution(share: number | null): share is number {
  return share !== null && share > UNVISITED_CAUTION_SHARE;
}

/**
 * The state region the logs never visit, on a value-surface grid: a grid point counts as covered
 * when a logged state falls at it or at one of its 8 neighbours (a 3×3 neighbourhood, so the
 * sampling gaps inside a well-covered cloud do not read as holes; our definition, stated in the
 * report). visits: ny×nx counts of logged states nearest each grid point (row-major).
 */
export function uncoveredGridPoints(visits: ArrayLike<number>, nx: number, ny: number): Uint8Array {
  if (visits.length !== nx * ny) throw new RangeError(`visits: expected ${nx}×${ny} = ${nx * ny} counts, got ${visits.length}`);
  const uncovered = new Uint8Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      let seen = false;
      for (let dj = -1; dj <= 1 && !seen; dj++) {
        for (let di = -1; di <= 1 && !seen; di++) {
          const jj = j + dj, ii = i + di;
          if (jj >= 0 && jj < ny && ii >= 0 && ii < nx && visits[jj * nx + ii] > 0) seen = true;
        }
      }
      uncovered[j * nx + i] = seen ? 0 : 1;
    }
  }
  return uncovered;
}

/** Share of grid points not covered. */
export function uncoveredShare(visits: ArrayLike<number>, nx: number, ny: number): number {
  const uncovered = uncoveredGridPoints(visits, nx, ny);
  return uncovered.reduce((a, b) => a + b, 0) / uncovered.length;
}
