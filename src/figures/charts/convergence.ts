/**
 * The fit history on a log axis: for the linear fit, the relative weight change and the Bellman
 * residual per iteration; for a network fit (no weight change), the training loss and the
 * held-out Bellman error. A log axis cannot show zero or negative values, so those points are gaps.
 */
import type { ChartConfiguration, ChartDataset, Plugin } from 'chart.js';
import type { FitStep as FitIteration } from './figureData';
import { axisTitles, sharedOptions, valueAxis } from '../parts/chartStyle';
import { fontString, PLOT_FONTS, type PlotLook } from '../parts/plotLook';
import type { Theme } from '../parts/plotTheme';
import { decadeLabel, formatValue } from '../parts/tickFormat';
import { legendPlugin } from '../parts/legendBox';
import { logAxisRange, logAxisTicks } from '../parts/logTicks';

export const CONVERGENCE_DEFAULTS = {
  heightPx: 320, lineWidthPx: 2, pointRadiusPx: 2.5,
  /** Room past the last iteration, as a share of the iterations and at least this many; before the first, the least (no tick at 0; a choice). */
  edgeShare: 0.02, minEdgeIterations: 0.5,
} as const;

export interface ConvergencePlotProps {
  history: FitIteration[];
  title: string;
  theme: Theme;
}

type XY = { x: number; y: number | null };
type SeriesField = 'weightChange' | 'bellmanResidual' | 'loss';

interface Series {
  readonly field: SeriesField;
  readonly label: string;
  /** The series' place in the palette and dash pattern: its look stays when the other is left out. */
  readonly style: number;
}

/** A network fit reports a loss and no weight change. */
export function isNetworkHistory(history: readonly FitIteration[]): boolean {
  return history.length > 0 && history.every((h) => h.weightChange === null) && history.some((h) => h.loss !== null);
}

/**
 * The series drawn, and so the legend's entries: only those with a value the log axis can show. A
 * network fit with no held-out runs (heldOutFraction 0) records no held-out mismatch, and its legend
 * had an entry for a line that was never drawn. An empty history keeps both, for the empty notice's legend.
 */
export function convergenceSeries(history: readonly FitIteration[]): Series[] {
  const all: Series[] = isNetworkHistory(history)
    ? [{ field: 'loss', label: 'training loss', style: 0 }, { field: 'bellmanResidual', label: 'one-step mismatch on held-out runs (mean square)', style: 1 }]
    : [{ field: 'weightChange', label: 'relative weight change', style: 0 }, { field: 'bellmanResidual', label: 'one-step mismatch (mean square)', style: 1 }];
  const drawn = all.filter((serie) => history.some((h) => positiveOrNull(h[serie.field]) !== null));
  return drawn.length > 0 ? drawn : all;
}

function positiveOrNull(v: number | null): number | null {
  return v !== null && Number.isFinite(v) && v > 0 ? v : null;
}

export function convergenceChart(props: ConvergencePlotProps, look: PlotLook): ChartConfiguration<'line', XY[]> {
  const { history } = props, p = look.palette, s = look.scale, d = CONVERGENCE_DEFAULTS;
  const series = convergenceSeries(history);
  const datasets: ChartDataset<'line', XY[]>[] = series.map(({ label, field, style: k }) => ({
    label,
    data: history.map((h) => ({ x: h.iteration, y: positiveOrNull(h[field]) })),
    borderColor: p.series[k], backgroundColor: p.series[k], borderWidth: d.lineWidthPx * s,
    borderDash: k === 1 ? [6 * s, 3 * s] : [], pointRadius: history.length > 60 ? 0 : d.pointRadiusPx * s, spanGaps: false,
  }));
  const shared = sharedOptions(look, props.title, history.length ? `${history.length} iteration${history.length === 1 ? '' : 's'}, log scale` : null);
  const hasData = datasets.some((set) => set.data.some((pt) => pt.y !== null));
  const yRange = logAxisRange(datasets.flatMap((set) => set.data.map((pt) => pt.y ?? NaN)));
  const yTicks = yRange ? logAxisTicks(yRange.min, yRange.max) : [];
  // The line's first and last points sit inside the frame, not on it (the screens showed it running into the right edge).
  const xPad = Math.max(CONVERGENCE_DEFAULTS.minEdgeIterations, CONVERGENCE_DEFAULTS.edgeShare * history.length);
  return {
    type: 'line',
    data: { datasets },
    plugins: [
      legendPlugin(series.map(({ label, style: k }) => ({ label, kind: 'line' as const, colour: p.series[k], dash: k === 1 ? [6, 3] : [], lineWidthPx: d.lineWidthPx })), look),
      ...axisTitles(look, [{ scaleId: 'x', position: 'bottom', text: 'iteration' }, { scaleId: 'y', position: 'left', text: 'value (log scale)' }]),
      ...(hasData ? [] : [emptyNotice(look)]),
    ],
    options: {
      ...shared,
      parsing: false,
      interaction: { mode: 'index', intersect: false },
      scales: {
        x: { ...valueAxis(look, 'bottom'), type: 'linear', min: 1 - CONVERGENCE_DEFAULTS.minEdgeIterations, max: Math.max(2, history.length) + xPad, ticks: { ...valueAxis(look, 'bottom').ticks, precision: 0, includeBounds: false } },
        y: yRange
          ? {
            ...valueAxis(look, 'left'), type: 'logarithmic', min: yRange.min, max: yRange.max,
            afterBuildTicks: (scale) => { scale.ticks = yTicks.map((t) => ({ value: t.value, label: t.label })); },
            ticks: { ...valueAxis(look, 'left').ticks, autoSkip: false, callback: (v) => yTicks.find((t) => t.value === v)?.label ?? '' },
          }
          : { ...valueAxis(look, 'left'), type: 'logarithmic', ticks: { ...valueAxis(look, 'left').ticks, callback: (_v, i, ticks) => logTickLabels(ticks.map((t) => t.value))[i] } },
      },
      plugins: {
        ...shared.plugins,
        tooltip: { ...shared.plugins?.tooltip, callbacks: { label: (item) => `${item.dataset.label}: ${formatValue(item.parsed.y ?? NaN)}` } },
      },
    },
  };
}

/** Label only the decades, all in one notation ("10⁻⁵"); ticks between decades stay unlabelled. */
export function logTickLabel(value: number): string {
  return decadeLabel(value);
}

/**
 * The labels of a log axis's ticks: the decades where the axis holds one; where it spans less than a
 * decade (a network's training loss between 0.02 and 0.09 has no power of ten inside), the ticks at 1,
 * 2 and 5 times a power of ten, in plain numbers, else ticks spaced a fifth of the span apart — never an
 * axis with no number on it.
 */
export function logTickLabels(values: readonly number[]): string[] {
  const decades = values.map(logTickLabel);
  if (decades.some((l) => l !== '')) return decades;
  const mantissa = (v: number) => v / 10 ** Math.floor(Math.log10(v) + 1e-9);
  const round = (v: number) => v > 0 && [1, 2, 5].some((m) => Math.abs(mantissa(v) - m) < 1e-6);
  if (values.some(round)) return values.map((v) => (round(v) ? formatValue(v) : ''));
  return spacedLabels(values);
}

/** Ticks labelled at least a fifth of the axis's span apart on the log scale (Chart.js packs the ticks of a narrow axis at its low end: 0.0214, 0.0216, 0.0218, 0.022 overlapped). */
function spacedLabels(values: readonly number[]): string[] {
  const logs = values.map((v) => (v > 0 ? Math.log10(v) : NaN)), finite = logs.filter(Number.isFinite);
  const gap = (Math.max(...finite) - Math.min(...finite)) / 5;
  let last = -Infinity;
  return logs.map((l, i) => {
    if (!Number.isFinite(l) || l - last < gap) return '';
    last = l;
    return formatValue(values[i]);
  });
}

function emptyNotice(look: PlotLook): Plugin {
  return {
    id: 'setpointEmptyHistory',
    afterDraw(chart) {
      const { ctx, chartArea: a } = chart;
      ctx.save();
      ctx.fillStyle = look.palette.mutedText;
      ctx.font = fontString(look, PLOT_FONTS.axisTitlePx);
      ctx.textAlign = 'center';
      ctx.textBaseline = 'middle';
      ctx.fillText('no iteration history to show', (a.left + a.right) / 2, (a.top + a.bottom) / 2);
      ctx.restore();
    },
  };
}

export function convergenceSummary(props: ConvergencePlotProps): string {
  const { history } = props;
  if (history.length === 0) return 'Fit history: no iterations recorded.';
  const last = history[history.length - 1];
  const parts = convergenceSeries(history)
    .filter((serie) => last[serie.field] !== null)
    .map((serie) => `${serie.label} ${formatValue(last[serie.field] as number)}`);
  return `Fit history over ${history.length} iterations on a log scale. At the last iteration: ${parts.join('; ') || 'no values'}.`;
}
