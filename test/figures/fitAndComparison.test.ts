import { describe, expect, it } from 'vitest';
import { LOG_TICK_RULE, logAxisRange, logAxisTicks } from '../../src/figures/parts/logTicks';
import { exportPlotSvg } from '../../src/figures/writers/exportSvg';
import { estimatedTextMeasure } from '../../src/figures/writers/textMeasure';
import { convergenceChart, convergenceSeries, convergenceSummary, isNetworkHistory, logTickLabel, logTickLabels } from '../../src/figures/charts/convergence';
import { plotPalette } from '../../src/figures/parts/plotTheme';
import type { PlotLook } from '../../src/figures/parts/plotLook';
import { LOGGED_BEHAVIOUR_LABEL, policyValueAxisTitle, policyValueChart, policyValueRows, policyValueSummary, valueSenseText } from '../../src/figures/charts/policyValueChart';
import { geometricHistory, threeCandidateEvaluation } from './syntheticPlotData';

const look: PlotLook = { palette: plotPalette('dark'), scale: 1, interactive: false };

describe('convergence plot', () => {
  it('linear fits show weight change and Bellman residual', () => {
    const history = geometricHistory(5);
    expect(isNetworkHistory(history)).toBe(false);
    expect(convergenceSeries(history).map((s) => s.field)).toEqual(['weightChange', 'bellmanResidual']);
  });

  it('network fits show loss and held-out Bellman error', () => {
    const history = geometricHistory(3).map((h) => ({ ...h, weightChange: null, loss: 0.1 / h.iteration }));
    expect(isNetworkHistory(history)).toBe(true);
    expect(convergenceSeries(history).map((s) => s.label)).toEqual(['training loss', 'one-step mismatch on held-out runs (mean square)']);
  });

  it('shows in the legend only what is drawn: a network fit with no held-out runs has no held-out entry', () => {
    const history = geometricHistory(3).map((h) => ({ ...h, weightChange: null, loss: 0.1 / h.iteration, bellmanResidual: null }));
    expect(convergenceSeries(history).map((s) => s.label)).toEqual(['training loss']);
    const config = convergenceChart({ history, title: 'fit', theme: 'dark' }, look);
    expect(config.data.datasets.map((d) => d.label)).toEqual(['training loss']);
    expect(config.data.datasets[0].borderDash).toEqual([]); // the loss keeps its own look
    expect(convergenceSummary({ history, title: 'fit', theme: 'dark' })).not.toContain('held-out');
  });

  it('leaves gaps where a log axis cannot show the value', () => {
    const history = geometricHistory(3);
    history[1] = { ...history[1], weightChange: 0, bellmanResidual: null };
    const config = convergenceChart({ history, title: 'fit', theme: 'dark' }, look);
    const data = config.data.datasets.map((d) => d.data.map((p) => p.y));
    expect(data[0][1]).toBeNull();
    expect(data[1][1]).toBeNull();
    expect(data[0][0]).toBe(0.5);
  });

  it('labels only the decades 10^k on the log axis, all as powers of ten', () => {
    expect([1e-4, 2e-3, 0.05, 1, 20, 3, 0.4, 7e5].map(logTickLabel)).toEqual(['10⁻⁴', '', '', '10⁰', '', '', '', '']); // decades only, one notation
    // An axis within one decade (a network's training loss, 0.02–0.09) still has numbers on it: 2, 5 × 10^k, else every tick.
    expect(logTickLabels([1e-3, 2e-3, 5e-3, 1e-2])).toEqual(['10⁻³', '', '', '10⁻²']);
    expect(logTickLabels([0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08, 0.09])).toEqual(['0.02', '', '', '0.05', '', '', '', '']);
    expect(logTickLabels([0.03, 0.04])).toEqual(['0.03', '0.04']);
    // Ticks packed at the low end of a narrow axis are not all labelled (the network's loss axis had 0.0214 … 0.022 on top of each other).
    expect(logTickLabels([0.0214, 0.0216, 0.0218, 0.022, 0.023, 0.025])).toEqual(['0.0214', '', '', '', '0.023', '0.025']);
  });

  it('labels every decade on the axis, and 2 and 5 × 10^k between where fewer than three decades stand (common practice)', () => {
    // Whole decades around the values, so each decade reached is on the axis.
    expect(logAxisRange([0.021, 0.09])).toEqual({ min: 0.01, max: 0.1 });
    expect(logAxisRange([8.3e-5, 0.51, NaN, 0, -1])).toEqual({ min: 1e-5, max: 1 });
    expect(logAxisRange([0.1])).toEqual({ min: 0.1, max: 1 });
    expect(logAxisRange([0, NaN])).toBeNull();
    expect(logAxisTicks(0.01, 0.1).map((t) => t.label)).toEqual(['10⁻²', '2 × 10⁻²', '5 × 10⁻²', '10⁻¹']);
    expect(logAxisTicks(0.01, 0.1).map((t) => t.value)).toEqual([0.01, 0.02, 0.05, 0.1]);
    expect(logAxisTicks(0.01, 1).map((t) => t.label)).toEqual(['10⁻²', '10⁻¹', '10⁰']); // three decades: decades only
    expect(logAxisTicks(1e-5, 1).map((t) => t.label)).toEqual(['10⁻⁵', '10⁻⁴', '10⁻³', '10⁻²', '10⁻¹', '10⁰']);
    expect(logAxisTicks(1e-12, 1e4).length).toBeLessThanOrEqual(LOG_TICK_RULE.maxLabels + 1); // 17 decades: every other one
  });

  it('draws the network fit\'s loss (0.02–0.09) on a log axis with four labelled ticks, and the line clear of the frame', () => {
    const history = Array.from({ length: 120 }, (_, k) => ({ iteration: k + 1, weightChange: null, bellmanResidual: 0.09 - 0.0005 * k, policyValue: null, loss: 0.08 - 0.0005 * k }));
    const config = convergenceChart({ history, title: 'fit', theme: 'light' }, look);
    const y = config.options!.scales!.y as { min: number; max: number; ticks: { callback: (v: number) => string } };
    expect([y.min, y.max]).toEqual([0.01, 0.1]);
    expect([0.01, 0.02, 0.05, 0.1].map((v) => y.ticks.callback(v))).toEqual(['10⁻²', '2 × 10⁻²', '5 × 10⁻²', '10⁻¹']);
    const x = config.options!.scales!.x as { min: number; max: number };
    expect(x.min).toBeLessThan(1);
    expect(x.max).toBeGreaterThan(120); // the last iteration sits inside the plot area, not on its right edge
    const fit = exportPlotSvg({ kind: 'convergence', props: { history, title: 'fit', theme: 'light' } }, { widthPx: 1950, heightPx: 1200, dpi: 300, background: 'white', caption: '', caution: '' }, estimatedTextMeasure)!;
    for (const label of ['2 × 10', '5 × 10']) expect(fit).toContain(label);
  });

  it('summary gives the last values, and says when there is no history', () => {
    expect(convergenceSummary({ history: geometricHistory(2), title: '', theme: 'light' })).toMatch(/2 iterations.*relative weight change 0\.4; one-step mismatch \(mean square\) 0\.435/);
    expect(convergenceSummary({ history: [], title: '', theme: 'light' })).toMatch(/no iterations/);
  });
});

describe('policy value chart', () => {
  const evaluation = threeCandidateEvaluation();

  it('one bar per candidate and one for the baseline, with status notes', () => {
    const baseline = { ...evaluation, presentController: { estimate: { policyValue: 3.5, standardError: 0.2 } } };
    expect(policyValueRows(baseline).map((r) => r.label)).toEqual(['gentle gain', 'aggressive gain (iteration limit)', 'wide noise', LOGGED_BEHAVIOUR_LABEL]);
    expect(policyValueRows(baseline).at(-1)!.value).toBe(3.5); // the present controller's model, not the logged return
    // Without a model of the present controller, the logged return stands in under its own name.
    expect(policyValueRows({ ...evaluation, presentController: null }).at(-1)).toMatchObject({ label: 'logged return (check)', value: evaluation.behaviour.value });
  });

  it('the value sense is in the axis title', () => {
    const config = policyValueChart({ evaluation, theme: 'dark' }, look);
    expect(config.plugins?.map((p) => p.id)).toContain('setpointAxisTitle-x');
    expect(policyValueAxisTitle({ evaluation, theme: 'dark', unit: '€' })).toBe('J, discounted cost (€): lower is better');
    expect(valueSenseText('reward')).toBe('reward: higher is better');
  });

  it('the axis reaches past the largest whisker', () => {
    const config = policyValueChart({ evaluation, theme: 'dark' }, look);
    const x = config.options?.scales?.x as { suggestedMin: number; suggestedMax: number };
    expect(x.suggestedMin).toBe(0);
    expect(x.suggestedMax).toBeGreaterThan(47.9 + 2.6);
  });

  it('summary lists J ± s.e. for every row', () => {
    expect(policyValueSummary({ evaluation, theme: 'light' })).toContain('gentle gain 41.2 ± 1.8; aggressive gain (iteration limit) 47.9 ± 2.6');
  });
});
