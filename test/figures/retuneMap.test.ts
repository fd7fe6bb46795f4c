/**
 * The retune-map figure on invented maps (test/figures/syntheticRetuneMap.ts: made-up numbers, not
 * data): the cells sit at their grid index, the colour scale spans the supported and thin-log
 * cells only, unsupported cells are greyed and strongly hatched, thin-log cells lightly hatched,
 * the best supported cell outlined, and the one-axis map is a curve with its band on a log axis.
 */
import type { Chart, Plugin } from 'chart.js';
import { describe, expect, it } from 'vitest';
import { retuneMapChart, retuneMapSummary, hoverOrder } from '../../src/figures/charts/retuneMap';
import { lineRange, retuneMapLineChart } from '../../src/figures/charts/retuneMapLine';
import { geometricSpacing } from '../../src/figures/parts/tuningAxis';
import { pointReadout, type RetuneMapPlotProps } from '../../src/figures/charts/retuneMapText';
import { createColourScale, rgbText } from '../../src/figures/parts/colourScale';
import { cellFill } from '../../src/figures/parts/mapCellLayer';
import { mapCellLayout, MapShapeError, shadeCount } from '../../src/figures/parts/mapCells';
import { screenLook } from '../../src/figures/parts/plotLook';
import type { RetuneMapData } from '../../src/figures/charts/figureData';
import { GAINS, syntheticRetuneLine, syntheticRetuneMap, TIMES } from './syntheticRetuneMap';

const look = screenLook('light');
const props = (map: RetuneMapData = syntheticRetuneMap()): RetuneMapPlotProps => ({ map, valueLabel: 'J, discounted cost (kWh)', sense: 'cost', title: 'Retune map', theme: 'light' });

/** A canvas context that records fillRect, strokeRect and the clip rectangles given to rect(). */
function recordingContext() {
  const calls: { name: string; args: unknown[]; fillStyle?: unknown }[] = [];
  const state: Record<string, unknown> = {};
  const ctx = new Proxy(state, {
    get: (target, name: string) => (name in target ? target[name] : (...args: unknown[]) => {
      calls.push({ name, args, fillStyle: target.fillStyle });
      return name === 'measureText' ? { width: 10 } : undefined;
    }),
    set: (target, name: string, value) => ((target[name] = value), true),
  });
  return { ctx: ctx as unknown as CanvasRenderingContext2D, calls };
}

/** A chart stand-in 600×500 px: cell centre k at 50 + 100k px across, 450 − 100k px up. */
function fakeChart(ctx: CanvasRenderingContext2D): Chart {
  return {
    ctx, chartArea: { left: 0, right: 600, top: 0, bottom: 500 },
    scales: { x: { getPixelForValue: (v: number) => 50 + 100 * v }, y: { getPixelForValue: (v: number) => 450 - 100 * v } },
  } as unknown as Chart;
}

describe('retune map cells', () => {
  const map = syntheticRetuneMap(), layout = mapCellLayout(map);

  it('places point p at column ⌊p / rows⌋ and row p mod rows (second axis fastest)', () => {
    expect([layout.columns, layout.rows]).toEqual([GAINS.length, TIMES.length]);
    const p = 2 * TIMES.length + 3; // gain 30, 2400 s
    expect(layout.cells[p]).toMatchObject({ column: 2, row: 3 });
    expect(map.points[p].coordinates).toEqual([GAINS[2], TIMES[3]]);
  });

  it('shades by support: null supported, caution light, serious and unknown unsupported, no value apart', () => {
    const expected = { supported: 0, caution: 0, unsupported: 0, noValue: 1 };
    map.points.forEach((q) => {
      if (q.value === null) return;
      if (q.support === null) expected.supported++;
      else if (q.support === 'caution') expected.caution++;
      else expected.unsupported++;
    });
    for (const shade of ['supported', 'caution', 'unsupported', 'noValue'] as const) expect(shadeCount(layout, shade)).toBe(expected[shade]);
    expect(expected.supported).toBeGreaterThan(0);
    expect(expected.caution).toBeGreaterThan(0);
    expect(map.points.some((q) => q.support === 'unknown')).toBe(true);
  });

  it('spans the colour scale over the supported cells only', () => {
    const trusted = map.points.filter((q) => q.value !== null && q.support === null).map((q) => q.value as number);
    expect([...layout.domainValues].sort()).toEqual([...trusted].sort());
    const everything = map.points.flatMap((q) => (q.value === null ? [] : [q.value]));
    expect(Math.max(...everything)).toBeGreaterThan(Math.max(...trusted)); // the unsupported cells reach further, and are clamped
  });

  it('colours a supported cell by the scale, greys an unsupported one, and paints a cell without a value in the no-value colour', () => {
    const scale = createColourScale(layout.domainValues);
    const supported = layout.cells.find((c) => c.shade === 'supported')!, unsupported = layout.cells.find((c) => c.shade === 'unsupported')!;
    expect(cellFill(supported, scale, look)).toBe(rgbText(scale.colour(supported.value!)!));
    expect(cellFill(unsupported, scale, look)).not.toBe(rgbText(scale.colour(unsupported.value!)!));
    expect(cellFill(layout.cells.find((c) => c.shade === 'noValue')!, scale, look)).toBe(look.palette.noValue);
  });

  it('refuses a point count that does not fill the grid', () => {
    expect(() => mapCellLayout({ ...map, points: map.points.slice(1) })).toThrow(MapShapeError);
  });
});

describe('retune map heat map', () => {
  const p = props(), config = retuneMapChart(p, look);

  it('fills every cell once, at its index, and outlines the best one', () => {
    const plugin = (config.plugins as Plugin[]).find((q) => q.id === 'setpointMapCells')!;
    const { ctx, calls } = recordingContext();
    (plugin.beforeDatasetsDraw as (c: Chart) => void)(fakeChart(ctx));
    const fills = calls.filter((c) => c.name === 'fillRect');
    expect(fills).toHaveLength(GAINS.length * TIMES.length);
    expect(fills[0].args).toEqual([0, 400, 100, 100]); // point 0: column 0, row 0 → x 0…100, y 400…500
    const best = p.map.best!.index, column = Math.floor(best / TIMES.length), row = best % TIMES.length;
    const outlines = calls.filter((c) => c.name === 'strokeRect');
    expect(outlines).toHaveLength(2); // dark under light
    const [x, y] = outlines[0].args as number[];
    expect(x).toBeGreaterThanOrEqual(100 * column);
    expect(x).toBeLessThan(100 * column + 10);
    expect(y).toBeGreaterThanOrEqual(400 - 100 * row);
    expect(y).toBeLessThan(400 - 100 * row + 10);
  });

  it('labels the gain axis at its cells and the integral-time axis in minutes at round ticks, and has a colour bar and legend', () => {
    type Axis = { min: number; max: number; ticks: { callback: (v: number) => string }; afterBuildTicks: (a: { ticks: { value: number }[] }) => void };
    const x = config.options!.scales!.x as Axis;
    expect([x.min, x.max]).toEqual([-0.5, GAINS.length - 0.5]);
    expect(x.ticks.callback(2)).toBe('30');
    expect(x.ticks.callback(0.5)).toBe('');
    // 300 · 2^k s = 5 … 80 min; cell edges 3.54 … 113 min: 1-2-5 × 10^k (two decades on the axis, so 2 and 5 too), by hand.
    const y = config.options!.scales!.y as Axis, built = { ticks: [] as { value: number }[] };
    y.afterBuildTicks(built);
    expect(built.ticks.map((t) => y.ticks.callback(t.value))).toEqual(['5', '10', '20', '50', '100']);
    expect(built.ticks.map((t) => t.value)).toEqual([0, 1, 2, Math.log2(10), Math.log2(20)].map((v) => expect.closeTo(v, 12)));
    expect(y.ticks.callback(4)).toBe(''); // the 4,800 s cell centre is no longer labelled
    const ids = (config.plugins as Plugin[]).map((q) => q.id);
    expect(ids).toEqual(expect.arrayContaining(['setpointMapCells', 'setpointColourBar', 'setpointLegend']));
    expect(config.options!.plugins!.subtitle!.text).toContain('lower is better');
  });

  it('orders the hover points in rows of the heat map, as the keyboard grid expects, and reads each one out', () => {
    const order = hoverOrder(mapCellLayout(p.map));
    expect(order.slice(0, 3)).toEqual([0, TIMES.length, 2 * TIMES.length]); // row 0 across the gains
    expect(order[GAINS.length]).toBe(1); // row 1 starts at the second time
    const readout = pointReadout(p, p.map.best!.index);
    expect(readout).toEqual(expect.arrayContaining(['proportional gain Kc (%/°C): 40', 'integral time Ti (s): 2,400', 'supported by the logs', 'best supported point']));
    expect(readout).toContain('J: 5.02 [4.22, 5.92]'); // at the interval's precision (width 1.70: three significant digits, JCGM 100 §7.2.6): 5 + 0.004·(40 − 42)², interval −0.8 / +0.9
    expect(pointReadout(p, GAINS.length * TIMES.length - 1)).toEqual(expect.arrayContaining(['J: no solution', 'fit: diverged']));
  });

  it('summarises the counts, the best point and the present controller', () => {
    const text = retuneMapSummary(p);
    expect(text).toContain('Best supported point: proportional gain Kc (%/°C) 40, integral time Ti (min) 40'); // 2,400 s in the figure's minutes
    expect(text).toContain('integral time Ti (min) (5 to 80)');
    expect(text).toContain('Present controller: J 6.1');
    expect(text).toContain(`${GAINS.length * TIMES.length} points`);
  });
});

describe('retune map over one axis', () => {
  const p = props(syntheticRetuneLine()), config = retuneMapLineChart(p, look);

  it('draws a doubling axis on a logarithmic scale', () => {
    expect(geometricSpacing(TIMES)).toBe(true);
    expect(geometricSpacing(GAINS)).toBe(false);
    expect((config.options!.scales!.x as { type: string }).type).toBe('logarithmic');
  });

  it('draws the integral time in minutes with round ticks between its first and last points', () => {
    type Axis = { min: number; max: number; ticks: { callback: (v: number) => string }; afterBuildTicks: (a: { ticks: { value: number }[] }) => void };
    const x = config.options!.scales!.x as Axis, built = { ticks: [] as { value: number }[] };
    x.afterBuildTicks(built);
    // 300 … 4,800 s = 5 … 80 min, by hand: the 1-2-5 values inside.
    expect([x.min, x.max]).toEqual([5, 80]);
    expect(built.ticks.map((t) => t.value)).toEqual([5, 10, 20, 50]);
    expect(built.ticks.map((t) => x.ticks.callback(t.value))).toEqual(['5', '10', '20', '50']);
    expect(config.data.datasets[2].data.map((d) => d.x)).toEqual([5, 10, 20, 40, 80]);
  });

  it('draws J with its band, rings the best point and draws the present controller dashed', () => {
    const [low, high, line, present] = config.data.datasets;
    expect(high.fill).toBe('-1');
    expect(low.data.map((d) => d.y)).toEqual(p.map.points.map((q) => q.interval?.[0] ?? null));
    const radii = line.pointRadius as number[];
    expect(radii[p.map.best!.index]).toBeGreaterThan(radii[0]);
    expect(present.data.map((d) => d.y)).toEqual([6.1, 6.1]);
    expect(present.borderDash).not.toEqual([]);
  });

  it('ranges the value axis over the supported and thin-log points with their intervals', () => {
    const trusted = p.map.points.filter((q) => q.value !== null && (q.support === null || q.support === 'caution'));
    const [lo, hi] = lineRange(p)!;
    expect(lo).toBeLessThan(Math.min(...trusted.map((q) => q.interval![0])));
    expect(hi).toBeGreaterThan(Math.max(...trusted.map((q) => q.interval![1])));
    const y = config.options!.scales!.y as { min: number; max: number };
    expect([y.min, y.max]).toEqual([lo, hi]);
  });
});
