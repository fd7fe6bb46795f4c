/** The sensitivity chart: one line per series, the behaviour dashed in the reference colour, the project's setting marked, gaps kept. */
import { describe, expect, it } from 'vitest';
import { screenLook } from '../../src/figures/parts/plotLook';
import { BEYOND_POSSIBLE_KEY, beyondPossibleSentence, unconvergedPointsSentence, rankingVerdict, SENSITIVITY_DEFAULTS, sensitivityChart, sensitivitySummary } from '../../src/figures/charts/sensitivity';
import { plotScreenHeight } from '../../src/figures/writers/plotSpec';
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
    expect(rankingVerdict(curve)).toBe('the ranking is the same at every setting without a crossed J (left out: 0.99, where a J is crossed)');
    expect(beyondPossibleSentence(curve)).toMatch(/^Crossed points: J of “sharp gain” at 0\.99\. .* cannot both be right/);
    expect(sensitivitySummary({ ...props, curve })).toContain('(left out: 0.99, where a J is crossed).');
    // Nothing crossed: no cross key, no sentence, the verdict as before.
    expect(beyondPossibleSentence(base)).toBeNull();
    expect(rankingVerdict(base)).toBe('the ranking is the same at every setting');
    expect(BEYOND_POSSIBLE_KEY.length).toBeLessThan(50); // one legend line in the app's half-width card at 1280 px (seen cut at 72 characters)
  });

  it('names every gap with its fit’s status in the reader’s words, and says nothing when every point has a J', () => {
    const base = discountSweep(); // "sharp gain" has no J at 0.95 (a failed fit)
    expect(unconvergedPointsSentence(base)).toMatch(/^No J where the fit at that setting failed or did not converge: “sharp gain” at 0\.95 \(.+\); the line has a gap there/);
    const statuses = (status: string) => ({ ...base, series: [base.series[0], { ...base.series[1], status: base.series[1].status.map((s, i) => (i === 2 ? status : s)) }, base.series[2]] });
    expect(unconvergedPointsSentence(statuses('maxIterations'))).toContain('(stopped at its iteration limit)'); // FIT_STATUS_WORDS, core/fqe/fitStatus.ts
    expect(unconvergedPointsSentence(statuses('singular'))).toContain('(no solution: its equations are singular)');
    expect(unconvergedPointsSentence(statuses('expected at most 300 features'))).toContain('(expected at most 300 features)'); // an engine's own message as it is
    // A J drawn as the fit reached it (a network at its iteration limit, the project's own unconverged fit) is named too.
    const reached = { ...base, series: [{ ...base.series[0], status: base.series[0].status.map((s, i) => (i === 0 ? 'maxIterations' : s)) }, base.series[1], base.series[2]] };
    expect(unconvergedPointsSentence(reached)).toMatch(/ Drawn where the fit reached it without converging, so not to be relied on: “gentle gain” at 0\.9\d* \(stopped at its iteration limit\)\.$/);
    const whole = { ...base, series: base.series.map((s) => ({ ...s, values: s.values.map((v) => v ?? 1), status: s.status.map((x) => (x === 'diverged' ? 'converged' : x)) })) };
    expect(unconvergedPointsSentence(whole)).toBeNull();
    expect(unconvergedPointsSentence({ ...whole, series: whole.series.map((s) => ({ ...s, status: s.status.map((x, i) => (i === 2 && !s.reference ? 'project setting' : x)) })) })).toBeNull();
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

  describe('with crossed points (a pair of swept J that cannot both be right)', () => {
    // The heating-loop sample's pattern (test/pipeline/discountSweepCheck.test.ts): a cost that falls as the horizon grows, crossed at the two longest.
    const base = discountSweep();
    const curve = {
      ...base, leftOut: [3, 4],
      series: [{ ...base.series[0], values: [9.1, 10.6, 10.69, 7.14, 0.66], beyondPossible: [false, false, false, true, true] }, base.series[2]],
    };
    const config = sensitivityChart({ ...props, curve }, look);

    it('draws the crossed points as crosses and keeps the verdict on a line of its own under the title', () => {
      expect(config.data.datasets[0].pointStyle).toEqual(['circle', 'circle', 'circle', 'crossRot', 'crossRot']);
      // One squeezed line of 150 characters was unreadable in the app and cut at both ends in the exported SVG.
      const subtitle = config.options?.plugins?.subtitle?.text;
      expect(subtitle).toEqual(['large points: the project’s setting (0.95)', 'the ranking is the same at every setting without a crossed J']);
    });

    it('is taller on screen by the subtitle line and legend row the crosses add', () => {
      // At 300 px the heating loop's plot area was shorter than its value axis's title, which ran up into the legend's cross (screen review, 1280 and 1920).
      expect(plotScreenHeight({ kind: 'sensitivity', props: { ...props, curve } })).toBe(SENSITIVITY_DEFAULTS.heightPx + SENSITIVITY_DEFAULTS.crossedExtraPx);
      expect(plotScreenHeight({ kind: 'sensitivity', props })).toBe(SENSITIVITY_DEFAULTS.heightPx);
    });

    it('names the crosses without claiming more than a failing pair shows', () => {
      // The change fails by being too small here (J falls while every cost is positive): "by more than" was wrong, and a pair does not say which of its two is wrong.
      expect(BEYOND_POSSIBLE_KEY).not.toMatch(/more than|cannot be right/);
      expect(BEYOND_POSSIBLE_KEY.length).toBeLessThanOrEqual(40); // one legend row beside the others (it was cut off at the plot's edge)
      const sentence = beyondPossibleSentence(curve)!;
      expect(sentence).toMatch(/^Crossed points: J of “gentle gain” at 0\.97 and 0\.99\. /);
      expect(sentence).toContain('cannot both be right');
      expect(sentence).not.toMatch(/more than/);
      expect(sensitivitySummary({ ...props, curve })).toContain('The ranking is the same at every setting without a crossed J (left out: 0.97, 0.99, where a J is crossed).');
    });
  });
});
