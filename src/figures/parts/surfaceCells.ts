/**
 * Geometry of a value surface's grid: the grid points are cell centres on a uniform grid (as
 * core/value.ts makes them), each cell reaching half a spacing either side, so the heat map covers
 * [x₀ − Δx/2, x_last + Δx/2] × [y₀ − Δy/2, y_last + Δy/2]. Also the never-visited cells
 * (visits = 0) merged into horizontal runs, so hatching clips to few rectangles.
 *
 * Shapes: x: nx, y: ny, values and visits: ny×nx row-major (row j is y[j]).
 */
import type { SurfaceData as ValueSurface } from '../charts/figureData';

export class SurfaceShapeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SurfaceShapeError';
  }
}

export interface SurfaceGeometry {
  readonly nx: number;
  readonly ny: number;
  readonly dx: number;
  readonly dy: number;
  /** Outer edges of the cells. */
  readonly xExtent: readonly [number, number];
  readonly yExtent: readonly [number, number];
}

/** A run of never-visited cells in row iy, columns ixStart…ixEnd inclusive. */
export interface CellRun {
  readonly iy: number;
  readonly ixStart: number;
  readonly ixEnd: number;
}

/** Relative tolerance on equal spacing: far above rounding of lo + (hi−lo)·i/(n−1), far below a visible step. */
const SPACING_TOLERANCE = 1e-6;

export function surfaceGeometry(surface: ValueSurface): SurfaceGeometry {
  const nx = surface.x.length, ny = surface.y.length;
  if (nx < 2 || ny < 2) throw new SurfaceShapeError(`surface: needs at least 2 grid points per axis, got ${nx}×${ny}`);
  if (surface.values.length !== nx * ny) {
    throw new SurfaceShapeError(`surface.values: expected ${ny}×${nx} = ${nx * ny} values, got ${surface.values.length}`);
  }
  if (surface.visits.length !== nx * ny) {
    throw new SurfaceShapeError(`surface.visits: expected ${ny}×${nx} = ${nx * ny} counts, got ${surface.visits.length}`);
  }
  const dx = uniformStep(surface.x, 'surface.x'), dy = uniformStep(surface.y, 'surface.y');
  return {
    nx, ny, dx, dy,
    xExtent: [surface.x[0] - dx / 2, surface.x[nx - 1] + dx / 2],
    yExtent: [surface.y[0] - dy / 2, surface.y[ny - 1] + dy / 2],
  };
}

function uniformStep(axis: Float64Array, name: string): number {
  const n = axis.length, step = (axis[n - 1] - axis[0]) / (n - 1);
  if (!Number.isFinite(step) || !(step > 0)) {
    throw new SurfaceShapeError(`${name}: expected finite, increasing grid values, got ${axis[0]} … ${axis[n - 1]}`);
  }
  for (let i = 1; i < n; i++) {
    const gap = axis[i] - axis[i - 1];
    if (Math.abs(gap - step) > SPACING_TOLERANCE * step) {
      throw new SurfaceShapeError(`${name}: expected equally spaced grid values (step ${step}), but entries ${i} and ${i + 1} are ${gap} apart`);
    }
  }
  return step;
}

export function unvisitedRuns(visits: Uint32Array, nx: number, ny: number): CellRun[] {
  const runs: CellRun[] = [];
  for (let iy = 0; iy < ny; iy++) {
    let start = -1;
    for (let ix = 0; ix <= nx; ix++) {
      const empty = ix < nx && visits[iy * nx + ix] === 0;
      if (empty && start < 0) start = ix;
      if (!empty && start >= 0) {
        runs.push({ iy, ixStart: start, ixEnd: ix - 1 });
        start = -1;
      }
    }
  }
  return runs;
}

export function unvisitedCount(visits: Uint32Array): number {
  let count = 0;
  for (let i = 0; i < visits.length; i++) if (visits[i] === 0) count++;
  return count;
}

