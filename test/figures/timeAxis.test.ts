/** Time-axis ticks at round steps of time, and their labels (hand-worked). */
import { describe, expect, it } from 'vitest';
import { timeStepSeconds, timeTickLabel, timeTicks } from '../../src/figures/parts/timeAxis';
import { envelopePoints, timeAxisTitle } from '../../src/figures/charts/trendChart';

const MARCH_1 = Date.UTC(2024, 2, 1) / 1000;

describe('time axis', () => {
  it('two days in at most 8 ticks: a 6 h step, ticks on 00, 06, 12, 18 h', () => {
    expect(timeStepSeconds(MARCH_1, MARCH_1 + 2 * 86400, 8)).toBe(21600);
    const { values, stepSeconds } = timeTicks(MARCH_1 + 100, MARCH_1 + 2 * 86400, 8);
    expect(values[0]).toBe(MARCH_1 + 21600);
    expect(values).toHaveLength(8);
    expect(timeTickLabel(values[0], true, stepSeconds, 2 * 86400)).toBe('1 Mar 06:00');
    expect(timeTickLabel(values[0], true, 3600, 12 * 3600)).toBe('06:00');
    expect(timeTickLabel(MARCH_1 + 30, true, 10, 600)).toBe('00:00:30');
  });

  it('elapsed seconds are labelled as durations', () => {
    const { values, stepSeconds } = timeTicks(0, 12_000, 6);
    expect(stepSeconds).toBe(3600);
    expect(values.map((v) => timeTickLabel(v, false, stepSeconds, 12_000))).toEqual(['0 s', '1 h', '2 h', '3 h']);
  });

  it('the envelope is drawn through each group’s min then max, with a gap where a group is empty, each point carrying its group', () => {
    const points = envelopePoints(Float64Array.from([0, 10, 20]), { name: 'v', role: 'state', unit: '', lo: Float64Array.from([1, NaN, 2]), hi: Float64Array.from([3, NaN, 2]) });
    expect(points).toEqual([{ x: 0, y: 1, g: 0 }, { x: 0, y: 3, g: 0 }, { x: 10, y: null }, { x: 20, y: 2, g: 2 }]); // g: the group a point is drawn from
  });

  it('a stop in the log (a step over 3 × the median step of 10) is a gap, not a straight line across it', () => {
    const flat = (n: number) => Float64Array.from({ length: n }, () => 1);
    const points = envelopePoints(Float64Array.from([0, 10, 20, 30, 100, 110]), { name: 'v', role: 'state', unit: '', lo: flat(6), hi: flat(6) });
    expect(points.map((p) => p.y)).toEqual([1, 1, 1, 1, null, 1, 1]);
    expect(points[4].x).toBe(65);
  });

  it('leaves a gap where the clock steps back (each run on its own run time), so runs are not joined by a line drawn backwards', () => {
    const flat = (n: number) => new Float64Array(n).fill(1);
    const points = envelopePoints(Float64Array.from([0, 10, 20, 0, 10, 20]), { name: 'v', role: 'state', unit: '', lo: flat(6), hi: flat(6) });
    expect(points.map((p) => p.y === null ? `gap@${p.x}` : p.x)).toEqual([0, 10, 20, 'gap@0', 0, 10, 20]);
  });

  it('titles the trend’s time axis by what its clock is: file lines, the calendar, run time (runs over one another), or time from zero', () => {
    expect(timeAxisTitle({ clock: 'line', calendar: false }, true)).toBe('line in the file'); // no clock: the run-time flag has nothing to say
    expect(timeAxisTitle({ clock: 'seconds', calendar: true }, true)).toBe('time (the log’s clock)');
    expect(timeAxisTitle({ clock: 'seconds', calendar: false }, true)).toBe('time in each run (the runs drawn over one another)');
    expect(timeAxisTitle({ clock: 'seconds', calendar: false })).toBe('time from the log’s zero');
  });
});
