/**
 * Estimates with their intervals, one row each (a "forest plot", common practice for comparing
 * estimates): an open dot at the value, a bar with end caps over the interval, the value written at
 * the right, and optionally the present controller's value as a dashed vertical line. Rows of the
 * present controller itself are drawn in its grey.
 */
import type { ChartConfiguration, Plugin } from 'chart.js';
import { axisTitles, sharedOptions, valueAxis } from '../parts/chartStyle';
import { legendPlugin } from '../parts/legendBox';
import { font, fontString, PLOT_FONTS, type PlotLook } from '../parts/plotLook';
import { PRESENT_CONTROLLER, PRESENT_DASH_PX, type Theme } from '../parts/plotTheme';
import { formatValue, formatValueInInterval } from '../parts/tickFormat';
import { valueInInterval } from '../parts/uncertainNumber';

export const INTERVAL_CHART_DEFAULTS = { rowHeightPx: 30, baseHeightPx: 120, dotRadiusPx: 4.5, capPx: 10, lineWidthPx: 2.5, labelGapPx: 8 } as const;

export interface IntervalRowData {
  label: string;
  value: number;
  interval: readonly [number, number] | null;
  /** Draw in the present controller's grey. */
  present?: boolean;
}

export interface IntervalChartProps {
  rows: readonly IntervalRowData[];
  /** Rich-text axis title, e.g. "J, discounted cost (€)". */
  axisLabel: string;
  title: string;
  subtitle?: string;
  /** The present controller's value, drawn as a dashed line across the rows. */
  reference?: number;
  theme: Theme;
}

type XY = { x: number; y: number };

export function intervalChartHeight(rows: number): number {
  return INTERVAL_CHART_DEFAULTS.baseHeightPx + INTERVAL_CHART_DEFAULTS.rowHeightPx * rows;
}

/**
 * The interval whose decimals a value is written at: its own row's, else the first row's that has
 * one (a check without an interval, the model rollouts, beside J's), and for the present
 * controller's line its own row's — so one chart writes one precision ("6.40", not "6.399" in the
 * key over a row "6.40", or "5.737" among "5.63").
 */
function precisionOf(props: IntervalChartProps, value: number, own?: readonly [number, number] | null): readonly [number, number] | null {
  if (own) return own;
  const same = props.rows.find((r) => r.present && r.value === value && r.interval);
  return same?.interval ?? props.rows.find((r) => r.interval)?.interval ?? null;
}

export function intervalChart(props: IntervalChartProps, look: PlotLook): ChartConfiguration<'scatter', XY[]> {
  const p = look.palette, s = look.scale, d = INTERVAL_CHART_DEFAULTS, n = props.rows.length;
  const colour = (i: number) => (props.rows[i].present ? p.reference : p.series[i % p.series.length]);
  const ends = props.rows.flatMap((r) => [r.value, ...(r.interval ?? [])]).concat(props.reference === undefined ? [] : [props.reference]);
  const lo = Math.min(...ends), hi = Math.max(...ends), pad = (hi - lo) * 0.06 || Math.abs(hi) * 0.05 || 1;
  const shared = sharedOptions(look, props.title, props.subtitle ?? null);
  const keys = props.reference === undefined ? [] : [{ label: `${PRESENT_CONTROLLER}: ${formatValueInInterval(props.reference, precisionOf(props, props.reference))}`, kind: 'line' as const, colour: p.reference, dash: PRESENT_DASH_PX, lineWidthPx: 1.6 }];
  return {
    type: 'scatter',
    data: {
      datasets: [{
        label: 'estimate', data: props.rows.map((r, i) => ({ x: r.value, y: i })),
        pointRadius: d.dotRadiusPx * s, pointBackgroundColor: p.background, pointBorderColor: props.rows.map((_, i) => colour(i)), pointBorderWidth: 2 * s,
      }],
    },
    plugins: [
      intervalBars(props, colour, look), legendPlugin(keys, look),
      ...axisTitles(look, [{ scaleId: 'x', position: 'bottom', text: props.axisLabel }]),
    ],
    options: {
      ...shared,
      parsing: false,
      scales: {
        x: { type: 'linear', min: lo - pad, max: hi + pad, ...valueAxis(look, 'bottom') },
        y: {
          type: 'linear', reverse: true, min: -0.6, max: n - 0.4, grid: { display: false }, border: { color: p.axis, width: s },
          ticks: { stepSize: 1, autoSkip: false, color: p.text, font: font(look, PLOT_FONTS.tickPx), callback: (v) => props.rows[Number(v)]?.label ?? '' },
          afterFit: (scale) => {
            scale.ctx.save();
            scale.ctx.font = fontString(look, PLOT_FONTS.tickPx);
            const widest = Math.max(0, ...props.rows.map((r) => scale.ctx.measureText(r.label).width));
            scale.ctx.restore();
            scale.width = Math.max(scale.width, widest + 14 * s);
          },
        },
      },
      layout: { padding: { top: 10 * s, bottom: 10 * s, left: 10 * s, right: valueRoom(props, look) } },
      plugins: { ...shared.plugins, tooltip: { ...shared.plugins?.tooltip, callbacks: { label: (item) => `${props.rows[item.dataIndex].label}: ${formatValue(item.parsed.x ?? NaN)}` } } },
    },
  };
}

/** Room right of the plot for the values written there. */
function valueRoom(props: IntervalChartProps, look: PlotLook): number {
  const s = look.scale, widest = Math.max(...props.rows.map((r) => formatValue(r.value).length)) * PLOT_FONTS.tickPx * 0.62;
  return (widest + INTERVAL_CHART_DEFAULTS.labelGapPx + 10) * s;
}

function intervalBars(props: IntervalChartProps, colour: (i: number) => string, look: PlotLook): Plugin {
  return {
    id: 'setpointIntervalBars',
    beforeDatasetsDraw(chart) {
      const { ctx, chartArea: a } = chart, xs = chart.scales.x, ys = chart.scales.y, s = look.scale, d = INTERVAL_CHART_DEFAULTS;
      ctx.save();
      if (props.reference !== undefined) {
        const x = xs.getPixelForValue(props.reference);
        ctx.strokeStyle = look.palette.reference;
        ctx.lineWidth = 1.6 * s;
        ctx.setLineDash(PRESENT_DASH_PX.map((v) => v * s));
        ctx.beginPath();
        ctx.moveTo(x, a.top);
        ctx.lineTo(x, a.bottom);
        ctx.stroke();
        ctx.setLineDash([]);
      }
      props.rows.forEach((r, i) => {
        const y = ys.getPixelForValue(i);
        ctx.strokeStyle = colour(i);
        ctx.lineWidth = d.lineWidthPx * s;
        if (r.interval) {
          const [x0, x1] = r.interval.map((v) => xs.getPixelForValue(v));
          ctx.beginPath();
          ctx.moveTo(x0, y);
          ctx.lineTo(x1, y);
          for (const x of [x0, x1]) {
            ctx.moveTo(x, y - (d.capPx * s) / 2);
            ctx.lineTo(x, y + (d.capPx * s) / 2);
          }
          ctx.stroke();
        }
        ctx.fillStyle = look.palette.text;
        ctx.font = fontString(look, PLOT_FONTS.tickPx);
        ctx.textAlign = 'left';
        ctx.textBaseline = 'middle';
        ctx.fillText(formatValueInInterval(r.value, precisionOf(props, r.value, r.interval)), a.right + d.labelGapPx * s, y);
      });
      ctx.restore();
    },
  };
}

export function intervalSummary(props: IntervalChartProps): string {
  return `${props.title}: ` + props.rows.map((r) => `${r.label} ${r.interval ? valueInInterval(r.value, r.interval).text : formatValueInInterval(r.value, null)}`).join('; ') + '.';
}
