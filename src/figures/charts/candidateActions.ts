/**
 * Each candidate's mean applied action against the logged actions, over one state axis with the
 * other states held: the logged (state, action) pairs as dots, one line per candidate (its mean
 * after the actuator limits, parts/meanActionCurve.ts), the present controller's fitted line in
 * its grey dashes on top of them, and the limits as dotted lines. The action axis shows the limits
 * and the logged actions, not the whole of a line that heads beyond a limit.
 */
import type { ChartConfiguration, ChartDataset } from 'chart.js';
import { axisTitles, sharedOptions, valueAxis } from '../parts/chartStyle';
import { legendPlugin, type LegendKey } from '../parts/legendBox';
import type { Curve } from '../parts/meanActionCurve';
import type { PlotLook } from '../parts/plotLook';
import { PRESENT_CONTROLLER, PRESENT_DASH_PX, type Theme } from '../parts/plotTheme';
import { formatValue } from '../parts/tickFormat';

export const CANDIDATE_ACTIONS_DEFAULTS = {
  heightPx: 360,
  lineWidthPx: 2.4,
  presentLineWidthPx: 2.6,
  loggedRadiusPx: 1.6,
  /** Room above and below the limits and the logged actions, as a share of their span (a choice). */
  margin: 0.06,
  title: 'Mean action of each candidate',
} as const;

export interface CandidateActionsPlotProps {
  /** Logged (state, action) pairs, an evenly spaced sample. */
  logged: Curve;
  candidates: readonly ({ name: string } & Curve)[];
  /** The present controller as fitted to the log; null when it could not be fitted. */
  present: Curve | null;
  /** The actuator limits on this action (null where a side is open). */
  limits: { lo: number | null; hi: number | null } | null;
  xLabel: string;
  yLabel: string;
  title: string;
  /** One line, or one entry per line (the limits, then what the other states are held at: one line squeezed its type in a half-width panel). */
  subtitle?: string | readonly string[];
  theme: Theme;
}

type XY = { x: number; y: number | null };

const points = (c: Curve): XY[] => Array.from(c.x, (x, i) => ({ x, y: c.y[i] }));

/** The action axis: the limits and the logged actions with a margin; lines beyond are cut at the plot edge. */
export function actionAxisRange(props: CandidateActionsPlotProps): { min: number; max: number } | Record<string, never> {
  const values = [...props.logged.y, ...(props.limits ? [props.limits.lo, props.limits.hi].filter((v): v is number => v !== null) : [])].filter(Number.isFinite);
  if (!props.limits || values.length === 0) return {};
  const lo = Math.min(...values), hi = Math.max(...values), pad = (hi - lo || 1) * CANDIDATE_ACTIONS_DEFAULTS.margin;
  return { min: lo - pad, max: hi + pad };
}

function limitLines(props: CandidateActionsPlotProps, look: PlotLook): ChartDataset<'line', XY[]>[] {
  const l = props.limits, x = props.logged.x.length ? props.logged.x : props.candidates[0]?.x ?? new Float64Array(0);
  if (!l || x.length === 0) return [];
  const xs = [Math.min(...x), Math.max(...x), ...props.candidates.flatMap((c) => [c.x[0], c.x[c.x.length - 1]])];
  const x0 = Math.min(...xs), x1 = Math.max(...xs);
  const at = (v: number | null) => (v === null ? [] : [{ x: x0, y: v }, { x: x1, y: v }, { x: x1, y: null }]);
  return [{
    type: 'line', label: 'actuator limits', data: [...at(l.lo), ...at(l.hi)], order: 4, spanGaps: false,
    borderColor: look.palette.mutedText, borderWidth: 1.2 * look.scale, borderDash: [2 * look.scale, 3 * look.scale], pointRadius: 0, pointHoverRadius: 0,
  }];
}

function keys(props: CandidateActionsPlotProps, look: PlotLook): LegendKey[] {
  const p = look.palette, d = CANDIDATE_ACTIONS_DEFAULTS;
  return [
    ...(props.logged.x.length ? [{ label: 'logged actions', kind: 'marker' as const, colour: p.mutedText, markerRadiusPx: 2.5 }] : []),
    ...props.candidates.map((c, i) => ({ label: c.name, kind: 'line' as const, colour: p.series[i % p.series.length], lineWidthPx: d.lineWidthPx })),
    ...(props.present ? [{ label: PRESENT_CONTROLLER, kind: 'line' as const, colour: p.reference, dash: PRESENT_DASH_PX, lineWidthPx: d.presentLineWidthPx }] : []),
    ...(props.limits ? [{ label: 'actuator limits', kind: 'line' as const, colour: p.mutedText, dash: [2, 3], lineWidthPx: 1.2 }] : []),
  ];
}

export function candidateActionsChart(props: CandidateActionsPlotProps, look: PlotLook): ChartConfiguration<'line', XY[]> {
  const p = look.palette, s = look.scale, d = CANDIDATE_ACTIONS_DEFAULTS;
  const shared = sharedOptions(look, props.title, props.subtitle ?? null);
  // Chart.js draws a lower `order` on top: the present controller over the candidates over the dots.
  const datasets: ChartDataset<'line' | 'scatter', XY[]>[] = [
    ...(props.present ? [{
      type: 'line' as const, label: PRESENT_CONTROLLER, data: points(props.present), order: 0,
      borderColor: p.reference, borderWidth: d.presentLineWidthPx * s, borderDash: PRESENT_DASH_PX.map((v) => v * s), pointRadius: 0, pointHoverRadius: 0,
    }] : []),
    ...props.candidates.map((c, i) => ({
      type: 'line' as const, label: c.name, data: points(c), order: 1,
      borderColor: p.series[i % p.series.length], backgroundColor: p.series[i % p.series.length], borderWidth: d.lineWidthPx * s, pointRadius: 0, pointHoverRadius: 0,
    })),
    {
      type: 'scatter', label: 'logged actions', data: points(props.logged), order: 3,
      pointRadius: d.loggedRadiusPx * s, pointHoverRadius: d.loggedRadiusPx * s, backgroundColor: p.theme === 'dark' ? 'rgba(200, 210, 220, 0.35)' : 'rgba(60, 70, 80, 0.3)', borderWidth: 0,
    },
    ...limitLines(props, look),
  ];
  return {
    type: 'line',
    data: { datasets: datasets as ChartDataset<'line', XY[]>[] },
    plugins: [
      legendPlugin(keys(props, look), look),
      ...axisTitles(look, [{ scaleId: 'x', position: 'bottom', text: props.xLabel }, { scaleId: 'y', position: 'left', text: props.yLabel }]),
    ],
    options: {
      ...shared,
      parsing: false,
      interaction: { mode: 'nearest', intersect: false },
      scales: {
        x: { type: 'linear', ...valueAxis(look, 'bottom') },
        y: { type: 'linear', ...actionAxisRange(props), ...valueAxis(look, 'left') },
      },
      plugins: {
        ...shared.plugins,
        tooltip: { ...shared.plugins?.tooltip, callbacks: { label: (item) => `${item.dataset.label}: ${formatValue(item.parsed.y ?? NaN)} at ${formatValue(item.parsed.x ?? NaN)}` } },
      },
    },
  };
}

export function candidateActionsSummary(props: CandidateActionsPlotProps): string {
  const limits = props.limits ? ` Actuator limits: ${[props.limits.lo, props.limits.hi].map((v) => (v === null ? 'none' : formatValue(v))).join(' to ')}.` : '';
  const ends = (c: Curve) => `${formatValue(c.y[0])} at ${formatValue(c.x[0])} to ${formatValue(c.y[c.y.length - 1])} at ${formatValue(c.x[c.x.length - 1])}`;
  return `Mean action against ${props.xLabel}: ${props.candidates.map((c) => `${c.name} from ${ends(c)}`).join('; ') || 'no candidates'}`
    + `${props.present ? `; ${PRESENT_CONTROLLER} from ${ends(props.present)}` : ''}. ${props.logged.x.length} logged actions shown as dots.${limits}`;
}
