/**
 * Q between the points of a slice, by linear interpolation on the (ascending) action grid — used
 * to place the quadrature nodes on the Q curve. Outside the grid there is nothing to read: null.
 */
export function interpolateOnGrid(grid: Float64Array, values: Float64Array, at: number): number | null {
  const n = grid.length;
  if (n === 0 || !(at >= grid[0] && at <= grid[n - 1])) return null;
  let lo = 0, hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (grid[mid] <= at) lo = mid;
    else hi = mid;
  }
  if (hi === lo) return values[lo];
  const t = (at - grid[lo]) / (grid[hi] - grid[lo]);
  return values[lo] + t * (values[hi] - values[lo]);
}
