/**
 * Policy value J ± standard error per candidate, next to the present controller's (its model,
 * evaluated the same way; the logged return where there is none), as horizontal bars with whiskers. The axis title carries the value sense (a cost: lower
 * is better; a reward: higher is better), because the numbers stay in the project's sense.
 */
import type { ChartConfiguration } from 'chart.js';
import type { FitOutcome as FitStatus, PolicyValueData as Evaluation } from './figureData';
import { axisTitles, sharedOptions, valueAxis } from '../parts/chartStyle';
import { errorWhiskersPlugin } from '../parts/errorWhiskers';
import { font, fontString, PLOT_FONTS, type PlotLook } from '../parts/plotLook';
import type { Theme } from '../parts/plotTheme';
import { formatEstimate } from '../parts/tickFormat';
import { valueAxisTitle } from '../parts/valueAxisTitle';
import { LOGGED_RETURN_LABEL, PRESENT_CONTROLLER, VALUES_CHART_TITLE } from '../parts/plotTheme';

export const POLICY_VALUE_DEFAULTS = {
  /** On-screen height: base plus one row per bar, CSS px. */
  baseHeightPx: 150,
  rowHeightPx: 46,
  /** Bar thickness as a share of its row, and its cap in CSS px. */
  barShare: 0.55,
  maxBarThicknessPx: 44,
  /** Axis room past the largest whisker, as a fraction of the span; on the right the value labels get a box of their own. */
  labelRoom: 0.05,
  /** Left of a negative bar the labels share the plot area, so the axis reaches further (a choice). */
  negativeLabelRoom: 0.3,
  title: VALUES_CHART_TITLE,
} as const;

export interface PolicyValueChartProps {
  evaluation: Evaluation;
  theme: Theme;
  title?: string;
  /** The cost's or reward's own unit, e.g. "€" or "kWh"; J is in it, discounted. */
  unit?: string;
  /** Each row's interval where one is shown beside the chart (candidates, then the baseline): its labels take the interval's decimals. */
  intervals?: readonly ([number, number] | null)[];
}

export const LOGGED_BEHAVIOUR_LABEL = PRESENT_CONTROLLER;

const STATUS_NOTE: Record<FitStatus, string> = { converged: '', maxIterations: ' (iteration limit)', diverged: ' (diverged)' };

interface Row {
  readonly label: string;
  readonly value: number;
  readonly error: number | null;
}

export function policyValueRows(evaluation: Evaluation): Row[] {
  return [
    ...evaluation.policies.map((p) => ({ label: `${p.name}${STATUS_NOTE[p.status]}`, value: p.policyValue, error: p.standardError })),
    // The baseline: the present controller's model, evaluated like the candidates; the logged return where there is none.
    evaluation.presentController
      ? { label: LOGGED_BEHAVIOUR_LABEL, value: evaluation.presentController.estimate.policyValue, error: evaluation.presentController.estimate.standardError }
      : { label: LOGGED_RETURN_LABEL, value: evaluation.behaviour.value, error: evaluation.behaviour.standardError },
  ];
}

/** "J, discounted cost (€): lower is better" — the value axis's one title (valueAxisTitle) and the sense. */
export function policyValueAxisTitle(props: PolicyValueChartProps): string {
  const sense = props.evaluation.valueSense;
  return `${valueAxisTitle('J', sense, props.unit ?? '')}: ${sense === 'cost' ? 'lower' : 'higher'} is better`;
}

export function valueSenseText(sense: Evaluation['valueSense']): string {
  return sense === 'cost' ? 'cost: lower is better' : 'reward: higher is better';
}

export function policyValueChartHeight(evaluation: Evaluation): number {
  return POLICY_VALUE_DEFAULTS.baseHeightPx + POLICY_VALUE_DEFAULTS.rowHeightPx * (evaluation.policies.length + 1);
}

export function policyValueChart(props: PolicyValueChartProps, look: PlotLook): ChartConfiguration<'bar', number[], string> {
  const rows = policyValueRows(props.evaluation), p = look.palette, s = look.scale, d = POLICY_VALUE_DEFAULTS;
  const ends = rows.flatMap((r) => [r.value - (r.error ?? 0), r.value + (r.error ?? 0), 0]);
  const lo = Math.min(...ends), hi = Math.max(...ends), span = hi - lo || 1;
  const labels = rows.map((r, i) => formatEstimate(r.value, r.error, props.intervals?.[i] ?? null));
  const colours = rows.map((_, i) => (i === rows.length - 1 ? p.reference : p.series[i % p.series.length]));
  const shared = sharedOptions(look, props.title ?? d.title, 'bars: estimate of J; whiskers: ±1 standard error over the start states (not the fit’s own error)');
  return {
    type: 'bar',
    data: {
      labels: rows.map((r) => r.label),
      datasets: [{ label: 'J', data: rows.map((r) => r.value), backgroundColor: colours, borderColor: colours, borderWidth: 0, barPercentage: d.barShare, categoryPercentage: 1, maxBarThickness: d.maxBarThicknessPx * s }],
    },
    plugins: [
      errorWhiskersPlugin({ values: rows.map((r) => r.value), errors: rows.map((r) => r.error), labels, look }),
      ...axisTitles(look, [{ scaleId: 'x', position: 'bottom', text: policyValueAxisTitle(props) }]),
    ],
    options: {
      ...shared,
      indexAxis: 'y',
      scales: {
        x: {
          // Suggested, so Chart.js rounds the ends out to its own ticks.
          type: 'linear', suggestedMin: lo < 0 ? lo - span * d.negativeLabelRoom : 0, suggestedMax: hi > 0 ? hi + span * d.labelRoom : 0,
          ...valueAxis(look, 'bottom'),
        },
        y: {
          type: 'category', ticks: { color: p.text, font: font(look, PLOT_FONTS.tickPx), padding: 6 * s }, grid: { display: false }, border: { color: p.axis, width: s },
          // Chart.js caps a side axis at a share of the width; candidate names must stay whole.
          afterFit: (scale) => {
            scale.ctx.save();
            scale.ctx.font = fontString(look, PLOT_FONTS.tickPx);
            const widest = Math.max(...rows.map((r) => scale.ctx.measureText(r.label).width));
            scale.ctx.restore();
            scale.width = Math.max(scale.width, widest + 16 * s); // label, tick padding, border
          },
        },
      },
      plugins: {
        ...shared.plugins,
        legend: { display: false },
        tooltip: { ...shared.plugins?.tooltip, callbacks: { label: (item) => `J = ${labels[item.dataIndex]}` } },
      },
    },
  };
}

export function policyValueSummary(props: PolicyValueChartProps): string {
  const rows = policyValueRows(props.evaluation);
  return `Policy value J per candidate (${valueSenseText(props.evaluation.valueSense)}), ±1 standard error: `
    + rows.map((r, i) => `${r.label} ${formatEstimate(r.value, r.error, props.intervals?.[i] ?? null)}`).join('; ') + '.';
}
