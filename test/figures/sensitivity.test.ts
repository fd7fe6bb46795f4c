/** The sensitivity chart: one line per series, the behaviour dashed in the reference colour, the project's setting marked, gaps kept. */
import { describe, expect, it } from 'vitest';
import { screenLook } from '../../src/figures/parts/plotLook';
import { BEYOND_POSSIBLE_KEY, beyondPossibleSentence, rankingVerdict, sensitivityChart, sensitivitySummary } from '../../src/figures/charts/sensitivity';
import { discountSweep } from './syntheticSensitivity';

describe('sensitivity chart', () => {
  const props = { curve: discountSweep(), valueLabel: 'J (cost)', title: 'J against γ', theme: 'light' as const };
  const look = screenLook('light');

  it('draws each series over the settings, the behaviour as the dashed reference', () => {
    const config = sensitivityChart(props, look);
    const sets = config.data.datasets;
    expect(sets.map((s) => s.label)).toEqual(['gentle gain', 'sharp gain', 'logged return (check)']);
    expect(sets[1].data[2]).toEqual({ x: 0.95, y: null }); // a failed fit is a gap, not a zero
    expect(sets[2].borderColor).toBe(look.palette.reference);
    expect(sets[2].borderDash).not.toEqual([]);
    expect(sets[0].borderColor).toBe(look.palette.series[0]);
    const radii = sets[0].pointRadius as number[];
    expect(radii[2]).toBeGreaterThan(radii[0]); // the project's own setting (projectIndex 2)
  });

  it('draws as the reference only the series the pipeline marks (or, unmarked, the one labelled the logged return), never a candidate named like it', () => {
    const base = discountSweep();
    const named = (name: string) => ({ ...base.series[0], name });
    const curve = { ...base, series: [named('logged-in cascade trim'), named('present controller, retuned'), base.series[2]] };
    const sets = sensitivityChart({ ...props, curve }, look).data.datasets;
    expect(sets.map((s) => s.label)).toEqual(['logged-in cascade trim', 'present controller, retuned', 'logged return (check)']);
    expect(sets.map((s) => s.borderColor === look.palette.reference)).toEqual([false, false, true]);
    const saved = { ...base, series: [base.series[0], { ...base.series[2], reference: undefined }] }; // results saved before the mark
    expect(sensitivityChart({ ...props, curve: saved }, look).data.datasets[1].borderColor).toBe(look.palette.reference);
  });

  it('draws a point that cannot be right as a cross, keys it in the legend, and names the settings the ranking leaves out', () => {
    const base = discountSweep();
    const curve = { ...base, leftOut: [4], series: [base.series[0], { ...base.series[1], beyondPossible: [false, false, false, false, true] }, base.series[2]] };
    const config = sensitivityChart({ ...props, curve }, look), sets = config.data.datasets;
    expect((sets[1].pointStyle as readonly string[])).toEqual(['circle', 'circle', 'circle', 'circle', 'crossRot']);
    expect((sets[0].pointStyle as readonly string[]).every((p) => p === 'circle')).toBe(true);
    expect(rankingVerdict(curve)).toBe('the ranking is the same at every setting where every J can be right (left out: 0.99, where a J cannot be right)');
    expect(rankingVerdict(curve, true)).toBe('the ranking is the same at every setting where every J can be right');
    expect(beyondPossibleSentence(curve)).toMatch(/^Crossed points: J of “sharp gain” at 0\.99 cannot be right/);
    expect(sensitivitySummary({ ...props, curve })).toContain('(left out: 0.99, where a J cannot be right).');
    // Nothing crossed: no cross key, no sentence, the verdict as before.
    expect(beyondPossibleSentence(base)).toBeNull();
    expect(rankingVerdict(base)).toBe('the ranking is the same at every setting');
    expect(BEYOND_POSSIBLE_KEY.length).toBeLessThan(50); // one legend line in the app's half-width card at 1280 px (seen cut at 72 characters)
  });

  it('puts a whole-valued setting (the polynomial degree) on whole-number ticks only, a discount on fractional ones', () => {
    const degrees = { ...discountSweep(), parameter: 'degree', label: 'polynomial degree of the features', settings: [1, 2, 3], projectIndex: 1 };
    degrees.series = degrees.series.map((serie) => ({ ...serie, values: serie.values.slice(0, 3), status: serie.status.slice(0, 3) }));
    const xTicks = (curve: typeof degrees) => (sensitivityChart({ ...props, curve }, look).options?.scales?.x as { ticks?: { precision?: number } }).ticks;
    expect(xTicks(degrees)?.precision).toBe(0); // Chart.js rounds the tick step to whole numbers: no "1.2" degrees
    expect(xTicks(discountSweep())?.precision).toBeUndefined();
  });

  it('summarises the range of each series and whether the ranking holds', () => {
    const text = sensitivitySummary(props);
    expect(text).toContain('sharp gain from 24 to 230');
    expect(text).toContain('The ranking is the same at every setting.');
  });
});
