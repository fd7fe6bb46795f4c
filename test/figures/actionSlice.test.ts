import { describe, expect, it } from 'vitest';
import { actionSliceChart, actionSliceSummary, ActionSliceShapeError } from '../../src/figures/charts/actionSlice';
import { plotPalette } from '../../src/figures/parts/plotTheme';
import type { PlotLook } from '../../src/figures/parts/plotLook';
import { pointMassesAtBounds } from '../../src/figures/parts/pointMasses';
import { interpolateOnGrid } from '../../src/figures/parts/sliceInterpolation';
import { clippedSlice, SLICE_POLICY } from './syntheticPlotData';

const look: PlotLook = { palette: plotPalette('light'), scale: 1, interactive: false };
const props = { slice: clippedSlice(), actionLabel: 'valve move (%)', valueLabel: 'cost (kWh)', title: 'Q at s', theme: 'light' as const };

// Abramowitz & Stegun (1964), Table 26.1: Φ(1.0) = 0.8413447461, Φ(2.5) = 0.9937903347 (from memory).
const MASS_BELOW = 1 - 0.9937903347; // P(a ≤ lo) = Φ(−2.5): lo is 2.5σ below the mean
const MASS_ABOVE = 1 - 0.8413447461; // P(a ≥ hi) = 1 − Φ(1): hi is 1σ above the mean

describe('point masses of a clipped policy', () => {
  it('are the bound nodes of the quadrature, with the censored-normal probabilities', () => {
    expect((SLICE_POLICY.mean - SLICE_POLICY.lo) / SLICE_POLICY.std).toBeCloseTo(2.5, 12);
    expect((SLICE_POLICY.hi - SLICE_POLICY.mean) / SLICE_POLICY.std).toBeCloseTo(1, 12);
    const masses = pointMassesAtBounds(props.slice.nodes, props.slice.bounds);
    expect(masses.map((m) => m.side)).toEqual(['lower', 'upper']);
    expect(masses[0].action).toBe(SLICE_POLICY.lo);
    expect(masses[0].probability).toBeCloseTo(MASS_BELOW, 9);
    expect(masses[1].probability).toBeCloseTo(MASS_ABOVE, 9);
  });

  it('truncation and unbounded policies have none', () => {
    expect(pointMassesAtBounds(props.slice.nodes, { lo: -1, hi: 1.1, mode: 'truncate' })).toEqual([]);
    expect(pointMassesAtBounds(props.slice.nodes, undefined)).toEqual([]);
  });
});

describe('interpolateOnGrid', () => {
  it('is exact for a linear function and null outside the grid', () => {
    const grid = Float64Array.of(0, 1, 3), values = Float64Array.of(1, 3, 7); // 1 + 2a
    expect(interpolateOnGrid(grid, values, 2.5)).toBeCloseTo(6, 12);
    expect(interpolateOnGrid(grid, values, 3)).toBe(7);
    expect(interpolateOnGrid(grid, values, -0.1)).toBeNull();
    expect(interpolateOnGrid(grid, values, NaN)).toBeNull();
  });
});

describe('actionSliceChart', () => {
  const config = actionSliceChart(props, look);
  const datasets = config.data.datasets as unknown as { label: string; data: { x: number; y: number }[]; pointRadius?: number[] }[];

  it('draws Q, the nodes, the density and the point masses', () => {
    expect(datasets.map((d) => d.label)).toEqual([
      'Q(s, a)', 'quadrature nodes (marker area ∝ weight)', 'policy density π(a | s)', 'point mass at a bound (bar height = probability)',
    ]);
    expect(datasets[3].data.map((p) => p.x)).toEqual([SLICE_POLICY.lo, SLICE_POLICY.hi]);
  });

  it('node markers have area proportional to weight (radius ∝ √w above the minimum radius)', () => {
    const { points, weights } = props.slice.nodes, radii = datasets[1].pointRadius!;
    const nodes = datasets[1].data;
    const big = Array.from(weights, (w, j) => ({ w, x: points[j] })).filter((n) => n.w > 0.05);
    const ratio = (a: number, b: number) => radii[nodes.findIndex((p) => p.x === a)] ** 2 / radii[nodes.findIndex((p) => p.x === b)] ** 2;
    expect(ratio(big[0].x, big[1].x)).toBeCloseTo(big[0].w / big[1].w, 9);
  });

  it('puts each node on the Q curve', () => {
    for (const p of datasets[1].data) expect(p.y).toBeCloseTo(5 - (p.x - 0.3) ** 2, 2);
  });

  it('refuses mismatched arrays, naming the field', () => {
    const bad = { ...props, slice: { ...props.slice, density: new Float64Array(3) } };
    expect(() => actionSliceChart(bad, look)).toThrow(ActionSliceShapeError);
    expect(() => actionSliceChart(bad, look)).toThrow(/slice.density: expected 81/);
  });

  it('summary names the best action and the point masses', () => {
    const text = actionSliceSummary(props);
    expect(text).toContain('highest 5 at 0.3');
    expect(text).toContain('lower bound −1');
    expect(text).toContain('upper bound 1.1');
  });
});

describe('densityOutline', () => {
  it('drops to zero exactly at the bounds, with the edge value extrapolated from inside', async () => {
    const { densityOutline } = await import('../../src/figures/parts/densityOutline');
    const actions = Float64Array.of(0, 1, 2, 3, 4), density = Float64Array.of(9, 1, 2, 3, 9); // 9s lie outside the bounds
    const outline = densityOutline(actions, density, { lo: 0.5, hi: 3.5, mode: 'truncate' });
    expect(outline).toEqual([
      { x: 0, y: 0 }, { x: 0.5, y: 0 }, { x: 0.5, y: 0.5 }, { x: 1, y: 1 }, { x: 2, y: 2 }, { x: 3, y: 3 },
      { x: 3.5, y: 3.5 }, { x: 3.5, y: 0 }, { x: 4, y: 0 },
    ]);
    expect(densityOutline(actions, density, undefined)).toHaveLength(5);
  });
});

describe('actionRange', () => {
  it('reaches past a slice end that carries a point mass, and not otherwise', async () => {
    const { actionRange } = await import('../../src/figures/charts/actionSlice');
    const actions = Float64Array.of(-1, 0, 1.1);
    expect(actionRange(actions, [])).toEqual({ min: -1, max: 1.1 });
    const range = actionRange(actions, [{ action: 1.1, probability: 0.16, side: 'upper' }]);
    expect(range.min).toBe(-1);
    expect(range.max).toBeCloseTo(1.1 + 0.03 * 2.1, 12);
  });
});
