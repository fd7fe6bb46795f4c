import { describe, expect, it } from 'vitest';
import { createColourScale } from '../../src/figures/parts/colourScale';
import { SurfaceShapeError, surfaceGeometry, unvisitedCount, unvisitedRuns } from '../../src/figures/parts/surfaceCells';
import { colourBarRaster, surfaceRaster } from '../../src/figures/parts/surfaceRaster';
import { bowlSurface } from './syntheticPlotData';

describe('surface geometry', () => {
  it('cells are centred on the grid points, half a step either side', () => {
    const g = surfaceGeometry(bowlSurface(4, 3)); // x: −1, 0, 1, 2; y: −1, 0.25, 1.5
    expect(g.dx).toBeCloseTo(1, 12);
    expect(g.dy).toBeCloseTo(1.25, 12);
    expect(g.xExtent[0]).toBeCloseTo(-1.5, 12);
    expect(g.xExtent[1]).toBeCloseTo(2.5, 12);
    expect(g.yExtent[0]).toBeCloseTo(-1.625, 12);
    expect(g.yExtent[1]).toBeCloseTo(2.125, 12);
  });

  it('names the field when shapes disagree or the grid is uneven', () => {
    const s = bowlSurface(4, 3);
    expect(() => surfaceGeometry({ ...s, values: new Float64Array(11) })).toThrow(/surface.values: expected 3×4 = 12/);
    expect(() => surfaceGeometry({ ...s, visits: new Uint32Array(5) })).toThrow(/surface.visits/);
    expect(() => surfaceGeometry({ ...s, x: Float64Array.of(0, 1, 3, 4) })).toThrow(SurfaceShapeError);
    expect(() => surfaceGeometry({ ...s, y: Float64Array.of(2, 1, 0) })).toThrow(/increasing/);
    expect(() => surfaceGeometry({ ...s, x: Float64Array.of(0), values: new Float64Array(3), visits: new Uint32Array(3) })).toThrow(/at least 2/);
  });
});

describe('never-visited runs', () => {
  it('merges neighbouring empty cells of a row', () => {
    // 4×2, rows: [0 0 3 0] and [1 0 0 0]
    const visits = Uint32Array.of(0, 0, 3, 0, 1, 0, 0, 0);
    expect(unvisitedRuns(visits, 4, 2)).toEqual([
      { iy: 0, ixStart: 0, ixEnd: 1 }, { iy: 0, ixStart: 3, ixEnd: 3 }, { iy: 1, ixStart: 1, ixEnd: 3 },
    ]);
    expect(unvisitedCount(visits)).toBe(6);
  });

  it('the synthetic surface has its empty patch in the upper right only', () => {
    const s = bowlSurface();
    const runs = unvisitedRuns(s.visits, s.x.length, s.y.length);
    for (const r of runs) {
      expect(s.x[r.ixStart]).toBeGreaterThan(1.2);
      expect(s.y[r.iy]).toBeGreaterThan(0.8);
      expect(r.ixEnd).toBe(s.x.length - 1);
    }
  });
});

describe('rasters', () => {
  it('y increases upward: bitmap row 0 shows the last surface row', () => {
    const s = bowlSurface(5, 4), scale = createColourScale(s.values);
    const r = surfaceRaster(s.values, 5, 4, scale, [1, 2, 3]);
    expect([r.width, r.height]).toEqual([5, 4]);
    for (let ix = 0; ix < 5; ix++) {
      expect(Array.from(r.rgba.subarray(ix * 4, ix * 4 + 3))).toEqual([...scale.colour(s.values[3 * 5 + ix])!]);
      const bottom = (3 * 5 + ix) * 4;
      expect(Array.from(r.rgba.subarray(bottom, bottom + 3))).toEqual([...scale.colour(s.values[ix])!]);
    }
    expect(r.rgba[3]).toBe(255);
  });

  it('non-finite cells take the no-value colour', () => {
    const values = Float64Array.of(1, NaN, 2, 3), scale = createColourScale(values);
    const r = surfaceRaster(values, 2, 2, scale, [9, 8, 7]);
    expect(Array.from(r.rgba.subarray(12, 15))).toEqual([9, 8, 7]); // surface row 0, column 1 → bitmap row 1
  });

  it('the colour-bar ramp has the maximum at the top', () => {
    const scale = createColourScale([0, 10]), r = colourBarRaster(scale);
    expect([r.width, r.height]).toEqual([1, 256]);
    expect(Array.from(r.rgba.subarray(0, 3))).toEqual([...scale.colourAt(1)]);
    expect(Array.from(r.rgba.subarray(255 * 4, 255 * 4 + 3))).toEqual([...scale.colourAt(0)]);
  });
});
