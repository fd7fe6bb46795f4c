/**
 * The policy's action density as a curve to fill, with sharp edges at actuator bounds. Clipping
 * and truncation both leave no density outside [lo, hi] (the clipped mass sits on the bounds
 * themselves), so on a grid that does not land on a bound, straight lines to the next grid point
 * would smear density past the bound. Here the curve drops vertically at each bound inside the
 * grid, with the edge value extrapolated linearly from the two nearest grid points inside.
 *
 * Shapes: actions and density: n, actions ascending.
 */
import type { SliceBounds } from './pointMasses';

type XY = { x: number; y: number };

export function densityOutline(actions: Float64Array, density: Float64Array, bounds: SliceBounds | undefined): XY[] {
  const n = actions.length;
  const plain = Array.from({ length: n }, (_, i) => ({ x: actions[i], y: density[i] }));
  if (!bounds) return plain;
  const { lo, hi } = bounds;
  const inside = plain.filter((p) => p.x >= lo && p.x <= hi);
  if (inside.length === 0) return plain.map((p) => ({ x: p.x, y: 0 }));
  const outline: XY[] = plain.filter((p) => p.x < lo).map((p) => ({ x: p.x, y: 0 }));
  if (lo > actions[0] && lo < actions[n - 1]) outline.push({ x: lo, y: 0 }, { x: lo, y: edgeValue(inside, lo) });
  outline.push(...inside);
  if (hi > actions[0] && hi < actions[n - 1]) outline.push({ x: hi, y: edgeValue(inside, hi) }, { x: hi, y: 0 });
  outline.push(...plain.filter((p) => p.x > hi).map((p) => ({ x: p.x, y: 0 })));
  return outline;
}

/** Density at a bound from the two inside points nearest it (linear), never below zero. */
function edgeValue(inside: XY[], at: number): number {
  const near = at <= inside[0].x ? inside.slice(0, 2) : inside.slice(-2).reverse();
  if (near.length < 2 || near[1].x === near[0].x) return near[0].y;
  const slope = (near[1].y - near[0].y) / (near[1].x - near[0].x);
  return Math.max(0, near[0].y + slope * (at - near[0].x));
}
