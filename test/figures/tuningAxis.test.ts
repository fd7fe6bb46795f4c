/**
 * The retune map's tuning axes (src/figures/parts/tuningAxis.ts; rule /work/notes/axis38-rule.md): a time in
 * the engineer's unit, round ticks at their true places between cell centres. Every expected tick below is
 * worked by hand from the rule: the grid's cell edges, the 1-2-5 × 10^k values between them (two or fewer
 * powers of ten on the axis, so 2 and 5 too; common practice for log axes, as logTicks.ts), or Heckbert's
 * nice numbers (Graphics Gems, 1990) on an even grid. Minutes from 10 min and hours above 10 h are the
 * engineers' usual reading of integral times (common practice).
 */
import { describe, expect, it } from 'vitest';
import { axisValues } from '../../src/core/retune/retuneAxes';
import { cellAxisTicks, cellPosition, roundTicks, shownTimeUnit, tuningAxisView } from '../../src/figures/parts/tuningAxis';

const timeAxis = (from: number, to: number, count: number, spacing: 'linear' | 'logarithmic' = 'logarithmic') =>
  ({ label: 'integral time T_{i} (s)', unit: 's', values: axisValues({ from, to, count, spacing }) });
const labels = (axis: Parameters<typeof tuningAxisView>[0]) => cellAxisTicks(tuningAxisView(axis)).map((t) => t.label);

describe('a retune map axis in the engineer’s units', () => {
  it('the heating sample’s 300 … 6,000 s (10 points, log) reads 5, 10, 20, 50, 100 min, never 4,301', () => {
    const axis = timeAxis(300, 6000, 10), view = tuningAxisView(axis);
    expect(view.title).toBe('integral time T_{i} (min)');
    expect(labels(axis)).toEqual(['5', '10', '20', '50', '100']);
    // Cell edges 300 · 20^(∓1/18) s = 4.23 … 118 min; position of v: 9 ln(v / 5) / ln 20.
    const positions = cellAxisTicks(view).map((t) => t.position);
    [0, 9 * Math.log(2) / Math.log(20), 9 * Math.log(4) / Math.log(20), 9 * Math.log(10) / Math.log(20), 9].forEach((p, i) => expect(positions[i]).toBeCloseTo(p, 12));
    expect(labels(axis).join(' ')).not.toMatch(/4,301|4301/);
  });

  it('a constructed 600 … 7,200 s map (8 points, log) reads 10, 20, 50, 100 min', () => {
    expect(labels(timeAxis(600, 7200, 8))).toEqual(['10', '20', '50', '100']);
  });

  it('a fast loop stays in seconds, a slow one goes to hours', () => {
    const fast = timeAxis(2, 60, 6), slow = timeAxis(3600, 72000, 5);
    expect(shownTimeUnit(fast)).toEqual({ unit: 's', seconds: 1, perShownUnit: 1 });
    expect(tuningAxisView(fast).title).toBe('integral time T_{i} (s)');
    expect(labels(fast)).toEqual(['2', '5', '10', '20', '50']); // edges 1.42 … 84.3 s
    expect(shownTimeUnit(slow)).toEqual({ unit: 'h', seconds: 3600, perShownUnit: 3600 });
    expect(labels(slow)).toEqual(['1', '2', '5', '10', '20']); // edges 0.688 … 29.1 h
    expect(shownTimeUnit(timeAxis(60, 599, 4))?.unit).toBe('s'); // largest 599 s: below 10 min
    expect(shownTimeUnit(timeAxis(60, 600, 4))?.unit).toBe('min');
    expect(shownTimeUnit(timeAxis(600, 36000, 4))?.unit).toBe('min'); // 10 h exactly: not above it
    expect(shownTimeUnit(timeAxis(600, 36001, 4))?.unit).toBe('h');
  });

  it('an evenly spaced time axis gets Heckbert’s steps at their places: 300 … 3,000 s in 10 points reads 10 … 50 min', () => {
    const ticks = cellAxisTicks(tuningAxisView(timeAxis(300, 3000, 10, 'linear')));
    // Edges 2.5 … 52.5 min; range 50 → step nice(12.5) = 10; position (v − 5) / 5.
    expect(ticks.map((t) => t.label)).toEqual(['10', '20', '30', '40', '50']);
    expect(ticks.map((t) => t.position)).toEqual([1, 3, 5, 7, 9].map((p) => expect.closeTo(p, 12)));
  });

  it('a narrow log axis with one 1-2-5 value falls back to Heckbert’s steps, placed on the log grid', () => {
    const ticks = cellAxisTicks(tuningAxisView(timeAxis(1200, 2700, 5))); // 20 … 45 min, edges 18.1 … 49.8
    expect(ticks.map((t) => t.label)).toEqual(['20', '30', '40']);
    expect(ticks[1].position).toBeCloseTo(2, 12); // 30 min = 20 · 1.5 = 20 · (2.25^(1/4))²
  });

  it('a gain axis keeps one label per cell; a log gain axis gets decades', () => {
    const gain = { label: 'proportional gain K_{c} (%/°C)', unit: '%/°C', values: axisValues({ from: 10, to: 100, count: 10, spacing: 'linear' }) };
    expect(labels(gain)).toEqual(['10', '20', '30', '40', '50', '60', '70', '80', '90', '100']);
    expect(cellAxisTicks(tuningAxisView(gain)).map((t) => t.position)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
    const logGain = { ...gain, values: axisValues({ from: 0.1, to: 10, count: 5, spacing: 'logarithmic' }) };
    expect(labels(logGain)).toEqual(['0.1', '1', '10']); // three powers of ten on the axis: decades only
  });

  it('an axis saved without its unit keeps its numbers and title, with round ticks where it is a log grid', () => {
    const saved = { label: 'integral time T_i (s)', values: axisValues({ from: 300, to: 6000, count: 10, spacing: 'logarithmic' }) };
    expect(tuningAxisView(saved).title).toBe('integral time T_i (s)');
    expect(labels(saved)).toEqual(['500', '1,000', '2,000', '5,000']); // edges 254 … 7,087 s
  });

  it('places ticks on a descending grid too, and writes 1-2-5 ticks with their own decimals', () => {
    const down = axisValues({ from: 6000, to: 300, count: 10, spacing: 'logarithmic' }).map((v) => v / 60);
    expect(cellPosition(down, 100, true)).toBeCloseTo(0, 12);
    expect(cellPosition(down, 5, true)).toBeCloseTo(9, 12);
    expect(roundTicks(0.3, 12, true).map((t) => t.label)).toEqual(['0.5', '1', '2', '5', '10']);
  });
});
