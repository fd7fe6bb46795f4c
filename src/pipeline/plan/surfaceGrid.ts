/**
 * Where to draw the value surface: the project's chosen pair of states (default the first two),
 * spanning the range the logs cover, with the other states held at their logged means.
 */
import type { ValueSurfaceOptions } from '../../core/value';
import type { TransitionSet } from '../../core/transitions';
import type { ProjectDocument } from '../../project/schema';

export const DEFAULT_SURFACE_RESOLUTION = 60;

export function surfaceGridFor(project: ProjectDocument, data: TransitionSet): (ValueSurfaceOptions & { xState: string; yState: string }) | null {
  const names = project.columns.states.map((s) => s.column);
  if (names.length < 2) return null;
  const xAxis = project.surface ? names.indexOf(project.surface.xState) : 0;
  const yAxis = project.surface ? names.indexOf(project.surface.yState) : 1;
  const resolution = project.surface?.resolution ?? DEFAULT_SURFACE_RESOLUTION;
  const ds = data.stateDim;
  const lo = new Float64Array(ds).fill(Infinity), hi = new Float64Array(ds).fill(-Infinity), mean = new Float64Array(ds);
  for (let i = 0; i < data.count; i++) {
    for (let c = 0; c < ds; c++) {
      const v = data.states[i * ds + c];
      if (v < lo[c]) lo[c] = v;
      if (v > hi[c]) hi[c] = v;
      mean[c] += v / data.count;
    }
  }
  const span = (c: number): [number, number] => (hi[c] > lo[c] ? [lo[c], hi[c]] : [lo[c] - 1, lo[c] + 1]);
  return {
    xAxis, yAxis, xState: names[xAxis], yState: names[yAxis],
    xRange: span(xAxis), yRange: span(yAxis), resolution: [resolution, resolution], heldState: Array.from(mean),
  };
}

/** How many logged states fall nearest each grid point of the surface (ny×nx, row-major). */
export function surfaceVisits(data: TransitionSet, grid: ValueSurfaceOptions): Uint32Array {
  const [nx, ny] = grid.resolution, ds = data.stateDim;
  const [x0, x1] = grid.xRange, [y0, y1] = grid.yRange;
  const visits = new Uint32Array(nx * ny);
  for (let i = 0; i < data.count; i++) {
    const ix = Math.round(((data.states[i * ds + grid.xAxis] - x0) / (x1 - x0)) * (nx - 1));
    const iy = Math.round(((data.states[i * ds + grid.yAxis] - y0) / (y1 - y0)) * (ny - 1));
    if (ix >= 0 && ix < nx && iy >= 0 && iy < ny) visits[iy * nx + ix]++;
  }
  return visits;
}
