/**
 * The logged signals over time on the Plant log step: one band per signal (states, actions, the
 * reward or cost), stacked on a shared time axis, each with its own value axis and its name and
 * unit written in the band. A million rows arrive as min/max envelopes (core/trend/signalEnvelope.ts:
 * per group of rows, about one group per pixel column, the smallest and largest value); the line
 * runs through (t, min), (t, max) of every group in turn, so the drawing looks like the full trace
 * at screen width and a one-row spike still shows. Time windows left out are shaded grey across
 * every band with their reason on top, and so are the runs left out by label (data.csv.excludedRuns),
 * from the first group holding their rows to the last (core/trend/groupsLeftOut.ts): one key "left
 * out" in the legend, the reason on top and on hover. On a clock that starts again in each run the
 * runs lie over one another, so a band would cover runs kept too: there the runs left out are drawn
 * in the muted text colour instead, and the subtitle says so.
 */
import type { ChartConfiguration, ChartDataset, Plugin, Scale, TooltipItem } from 'chart.js';
import { clockText, durationText } from '../../core/clockText';
import type { TrendData, TrendSignal } from '../../core/trend/signalEnvelope';
import { leftOutStretches } from '../../core/trend/groupsLeftOut';
import { BACKED_TEXT_DEFAULTS, drawBackedText } from '../parts/backedText';
import { legendPlugin, type LegendKey } from '../parts/legendBox';
import { axisTitles, sharedOptions, valueAxis } from '../parts/chartStyle';
import { fontString, PLOT_FONTS, type PlotLook } from '../parts/plotLook';
import type { Theme } from '../parts/plotTheme';
import { timeTickLabel, timeTicks } from '../parts/timeAxis';
import { formatValue } from '../parts/tickFormat';

export const TREND_DEFAULTS = { bandHeightPx: 86, frameHeightPx: 96, lineWidthPx: 1, tickSpacingPx: 120 } as const;

/** A window left out, in seconds on the trend's clock. */
export interface TrendWindow {
  readonly fromSeconds: number;
  readonly toSeconds: number;
  readonly label: string;
}

export interface TrendPlotProps {
  trend: TrendData;
  windows: readonly TrendWindow[];
  title: string;
  theme: Theme;
  /** The clock starts again in each run (run time): the runs are drawn over one another on it. */
  runTime?: boolean;
  /** Per range of runs left out by label, in the order of `trend.leftOut`'s indices: what hover and the band say ("runs "1" to "15": before the retune"). */
  runsLeftOut?: readonly string[];
}

/** g: the envelope group the point is drawn from (a gap has none). */
type XY = { x: number; y: number | null; g?: number };

export function trendChartHeight(trend: TrendData): number {
  return TREND_DEFAULTS.frameHeightPx + TREND_DEFAULTS.bandHeightPx * Math.max(1, trend.signals.length);
}

/** "level_m (m) — state"; a cost from an expression is named "cost" and says so once. */
export function signalLabel(s: TrendSignal): string {
  return `${s.name}${s.unit ? ` (${s.unit})` : ''}${s.name === s.role ? '' : ` — ${s.role}`}`;
}

/** A step between groups longer than this many times their median step is a stop in the log, drawn as a gap (a choice: the importer's default run gap is three sampling periods too). */
export const TREND_GAP_STEPS = 3;

/**
 * The envelope as a line: (t, lo), (t, hi) per group; a gap where a group has no readable value
 * and where the log stops (a step over TREND_GAP_STEPS × the median step), so no straight line is
 * drawn across an overnight stop as if the plant had been logged there; and where the clock steps
 * back (each run on its own run time), so the runs are drawn over one another, not joined.
 */
export function envelopePoints(time: Float64Array, signal: TrendSignal): XY[] {
  const gap = TREND_GAP_STEPS * medianStep(time);
  const points: XY[] = [];
  let previous = NaN;
  for (let g = 0; g < time.length; g++) {
    const lo = signal.lo[g], hi = signal.hi[g], x = time[g];
    if (Number.isNaN(x)) continue;
    if (x - previous > gap) points.push({ x: (x + previous) / 2, y: null });
    else if (x < previous) points.push({ x, y: null }); // the clock started again (a new run on run time): no line drawn back
    previous = x;
    if (Number.isNaN(lo)) { points.push({ x, y: null }); continue; }
    points.push({ x, y: lo, g });
    if (hi !== lo) points.push({ x, y: hi, g });
  }
  return points;
}

function medianStep(time: Float64Array): number {
  const steps: number[] = [];
  for (let g = 1; g < time.length; g++) if (time[g] > time[g - 1]) steps.push(time[g] - time[g - 1]);
  steps.sort((a, b) => a - b);
  return steps.length ? steps[steps.length >> 1] : Infinity;
}

function timeRange(trend: TrendData): [number, number] {
  let min = Infinity, max = -Infinity;
  for (const t of [...trend.time, trend.endTime]) {
    if (t < min) min = t;
    if (t > max) max = t;
  }
  return min <= max ? [min, max === min ? min + 1 : max] : [0, 1];
}

/** The chart: one line per signal in its own band, the left-out shading and key, band names, time axis and hover. */
export function trendChart(props: TrendPlotProps, look: PlotLook): ChartConfiguration<'line', XY[]> {
  const { trend } = props, [min, max] = timeRange(trend);
  const left = leftOutView(props);
  const shared = sharedOptions(look, props.title, trendSubtitle(trend, left.muted));
  return {
    type: 'line',
    data: { datasets: signalLines(trend, left, look) },
    plugins: [
      ...(left.keyKinds.length ? [legendPlugin(leftOutKeys(left.keyKinds, look), look)] : []),
      windowShading([...props.windows, ...left.bands], look), bandLabels(trend.signals, look),
      ...axisTitles(look, [{ scaleId: 'x', position: 'bottom', text: timeAxisTitle(trend, props.runTime) }]),
    ],
    options: {
      ...shared,
      parsing: false,
      normalized: true,
      interaction: { mode: 'nearest', axis: 'x', intersect: false },
      scales: { x: timeScale(trend, min, max, look), ...bandScales(trend, look) },
      plugins: { ...shared.plugins, tooltip: { ...shared.plugins?.tooltip, callbacks: hoverText(trend, left) } },
    },
  };
}

/** Each signal's envelope as a line on its band's axis; on a muted view, the stretches of runs left out in the muted colour. */
function signalLines(trend: TrendData, left: LeftOutView, look: PlotLook): ChartDataset<'line', XY[]>[] {
  const p = look.palette, s = look.scale, colours = [...p.series];
  return trend.signals.map((signal, k) => {
    const data = envelopePoints(trend.time, signal);
    return {
      label: signalLabel(signal), yAxisID: `y${k}`, data,
      borderColor: colours[k % colours.length], backgroundColor: colours[k % colours.length],
      borderWidth: TREND_DEFAULTS.lineWidthPx * s, pointRadius: 0, pointHitRadius: 4 * s, spanGaps: false,
      ...(left.muted ? { segment: { borderColor: (c: { p1DataIndex: number }) => (left.rangeOf(data[c.p1DataIndex]?.g) >= 0 ? p.mutedText : undefined) } } : {}),
    };
  });
}

/** One value axis per signal, stacked into bands. */
function bandScales(trend: TrendData, look: PlotLook) {
  // Chart.js stacks axes of one stack from the bottom up in the order they are declared: declared
  // last to first, the first signal (a state) is the top band.
  return Object.fromEntries(trend.signals.map((_, k) => [`y${k}`, {
    ...valueAxis(look, 'left'), type: 'linear' as const, stack: 'signals', stackWeight: 1, offset: true,
    ticks: { ...valueAxis(look, 'left').ticks, maxTicksLimit: 4 },
  }]).reverse());
}

/** What the time axis measures: the file's lines, the log's calendar clock, each run's own time, or time from the log's zero. */
export function timeAxisTitle(trend: Pick<TrendData, 'clock' | 'calendar'>, runTime = false): string {
  if (trend.clock === 'line') return 'line in the file';
  if (trend.calendar) return 'time (the log’s clock)';
  return runTime ? 'time in each run (the runs drawn over one another)' : 'time from the log’s zero';
}

/** Hover: the time, each signal's value, and what was left out there. */
function hoverText(trend: TrendData, left: LeftOutView) {
  return {
    title: (items: TooltipItem<'line'>[]) => (items.length ? timeText(trend, items[0].parsed.x ?? NaN) : ''),
    label: (item: TooltipItem<'line'>) => `${item.dataset.label}: ${formatValue(item.parsed.y ?? NaN)}`,
    footer: (items: TooltipItem<'line'>[]) => (items.length ? left.hover(items[0].parsed.x ?? NaN, (items[0].raw as XY | undefined)?.g) : ''),
  };
}

function timeText(trend: TrendData, x: number): string {
  return trend.clock === 'line' ? `line ${Math.round(x)}` : clockText(x, trend.calendar);
}

function timeScale(trend: TrendData, min: number, max: number, look: PlotLook) {
  const base = valueAxis(look, 'bottom');
  if (trend.clock === 'line') return { ...base, type: 'linear' as const, min, max, ticks: { ...base.ticks, precision: 0 } };
  let step = 1;
  return {
    ...base, type: 'linear' as const, min, max,
    afterBuildTicks: (axis: Scale) => {
      const ticks = timeTicks(min, max, Math.max(2, Math.floor(axis.width / (TREND_DEFAULTS.tickSpacingPx * look.scale))));
      step = ticks.stepSeconds;
      axis.ticks = ticks.values.map((value) => ({ value }));
    },
    ticks: { ...base.ticks, callback: (value: number | string) => timeTickLabel(Number(value), trend.calendar, step, max - min) },
  };
}

function trendSubtitle(trend: TrendData, muted = false): string {
  const rows = trend.rowCount.toLocaleString('en-US');
  const drawn = trend.rowsPerGroup > 1
    ? `${rows} rows, drawn as the smallest and largest value of every ${trend.rowsPerGroup.toLocaleString('en-US')} rows`
    : `${rows} rows`;
  return muted ? `${drawn}; ${MUTED_RUNS_WORDS}` : drawn;
}

/** Grey shading over each window left out, its reason written at the top. */
function windowShading(windows: readonly TrendWindow[], look: PlotLook): Plugin<'line'> {
  return {
    id: 'setpointTrendWindows',
    beforeDatasetsDraw(chart) {
      const { ctx, chartArea: a } = chart, x = chart.scales.x;
      ctx.save();
      ctx.font = fontString(look, PLOT_FONTS.tickPx);
      ctx.textBaseline = 'top';
      for (const w of windows) {
        const left = Math.max(a.left, x.getPixelForValue(w.fromSeconds)), right = Math.min(a.right, x.getPixelForValue(w.toSeconds));
        if (!(right >= left)) continue;
        ctx.fillStyle = look.palette.bandFill;
        ctx.fillRect(left, a.top, Math.max(right - left, 2 * look.scale), a.bottom - a.top);
        ctx.strokeStyle = look.palette.axis;
        ctx.lineWidth = look.scale;
        ctx.strokeRect(left, a.top, Math.max(right - left, 2 * look.scale), a.bottom - a.top);
        const text = `left out${w.label ? `: ${w.label}` : ''}`;
        if (ctx.measureText(text).width + 6 * look.scale <= right - left) {
          ctx.fillStyle = look.palette.mutedText;
          ctx.fillText(text, left + 3 * look.scale, a.top + 2 * look.scale);
        }
      }
      ctx.restore();
    },
  };
}

/** Each band's signal name, unit and role at its top left, on a backing so the trace never hides it. */
function bandLabels(signals: readonly TrendSignal[], look: PlotLook): Plugin<'line'> {
  return {
    id: 'setpointTrendBandLabels',
    afterDatasetsDraw(chart) {
      const { ctx } = chart, pad = BACKED_TEXT_DEFAULTS.paddingPx * look.scale;
      ctx.save();
      ctx.font = fontString(look, PLOT_FONTS.legendPx, 'bold');
      ctx.textBaseline = 'top';
      signals.forEach((signal, k) => {
        const axis = chart.scales[`y${k}`];
        if (!axis) return;
        const text = signalLabel(signal), width = ctx.measureText(text).width;
        const box = { left: chart.chartArea.right - width - 2 * pad, top: axis.top + pad, width, height: PLOT_FONTS.legendPx * look.scale };
        drawBackedText(ctx, text, box, look.palette.series[k % look.palette.series.length], look);
      });
      ctx.restore();
    },
  };
}

export function trendSummary(props: TrendPlotProps): string {
  const { trend, windows } = props;
  const [min, max] = timeRange(trend);
  const span = trend.clock === 'line' ? `lines ${min} to ${max}` : `${clockText(min, trend.calendar)} to ${clockText(max, trend.calendar)} (${durationText(max - min)})`;
  const left = windows.length === 0 ? 'No time window left out.' : `${windows.length} time window${windows.length === 1 ? '' : 's'} left out, shaded: ${windows.map((w) => `${w.label || 'window'} from ${timeText(trend, w.fromSeconds)} to ${timeText(trend, w.toSeconds)}`).join('; ')}.`;
  const runs = props.runsLeftOut ?? [], view = leftOutView(props);
  const byLabel = runs.length === 0 ? '' : ` Runs left out by label, ${view.muted ? 'drawn muted' : 'shaded'}: ${runs.join('; ')}.`;
  const over = props.runTime ? `${span} of run time, the runs drawn over one another` : span;
  return `Trend of ${trend.signals.map(signalLabel).join(', ')} over ${over}; ${trendSubtitle(trend, view.muted)}. ${left}${byLabel}`;
}

/** Said under the title where the runs left out are drawn muted rather than shaded. */
export const MUTED_RUNS_WORDS = 'runs left out drawn muted (each run on its own clock: a band would cover runs kept too)';

/** How the runs left out by label are shown: bands (with the windows' look) or muted lines, the legend key, and what hover says. */
interface LeftOutView {
  readonly bands: readonly TrendWindow[];
  readonly muted: boolean;
  /** The legend's keys: "left out" for a band's swatch, and a muted line for runs drawn muted ("runs left out" where bands are shown too). */
  readonly keyKinds: readonly ('area' | 'line')[];
  /** The range of a group (−1: none). */
  rangeOf(g: number | undefined): number;
  /** The hover's footer at x on the time axis, for a point of group g: what is left out there. */
  hover(x: number, g: number | undefined): string;
}

function leftOutKeys(kinds: readonly ('area' | 'line')[], look: PlotLook): LegendKey[] {
  const p = look.palette, line = kinds.length > 1 ? 'runs left out' : 'left out';
  return kinds.map((kind) => (kind === 'line'
    ? { label: line, kind, colour: p.mutedText, lineWidthPx: TREND_DEFAULTS.lineWidthPx }
    : { label: 'left out', kind, colour: p.bandFill, border: p.axis }));
}

function leftOutView(props: TrendPlotProps): LeftOutView {
  const { trend, windows } = props, labels = props.runsLeftOut ?? [], marked = trend.leftOut;
  const muted = Boolean(props.runTime && marked && labels.length > 0);
  const rangeOf = (g: number | undefined): number => (g === undefined || !marked ? -1 : marked[g] - 1);
  const bands: TrendWindow[] = muted || !marked ? [] : leftOutStretches(marked).map((r) => ({
    fromSeconds: trend.time[r.first], toSeconds: r.last + 1 < trend.time.length ? trend.time[r.last + 1] : trend.endTime, label: labels[r.range] ?? '',
  }));
  return {
    bands, muted, rangeOf,
    keyKinds: [...(windows.length + bands.length > 0 ? ['area' as const] : []), ...(muted ? ['line' as const] : [])],
    hover(x, g) {
      const there = [...windows, ...bands].filter((w) => x >= w.fromSeconds && x <= w.toSeconds).map((w) => `left out${w.label ? `: ${w.label}` : ''}`);
      const range = muted ? rangeOf(g) : -1;
      return [...there, ...(range >= 0 ? [`left out: ${labels[range] ?? ''}`] : [])].join('\n');
    },
  };
}
