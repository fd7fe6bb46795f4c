/**
 * A one-axis retune map: J against the parameter with its interval as a band, the stretches the
 * logs do not support shaded and hatched (thin-log stretches shaded only) from midway
 * to the neighbouring points, the best supported point ringed, and the present controller's J as a
 * dashed line. A geometrically spaced axis is drawn on a logarithmic scale; the parameter axis's unit
 * and round ticks are tuningAxis.ts's (an integral time in minutes from 10 min). The value axis spans
 * the supported and thin-log points (with their intervals) when there are any, so a far larger
 * unsupported value cannot flatten the part that can be read; the rest is clipped under the shading.
 */
import type { ChartConfiguration, ChartDataset, Plugin } from 'chart.js';
import { axisTitles, sharedOptions, valueAxis } from '../parts/chartStyle';
import { drawHatching, LIGHT_HATCH } from '../parts/hatching';
import { legendPlugin, type LegendKey } from '../parts/legendBox';
import { shadeOf } from '../parts/mapCells';
import { PRESENT_CONTROLLER, PRESENT_DASH_PX } from '../parts/plotTheme';
import type { PlotLook } from '../parts/plotLook';
import type { Rect } from '../parts/raster';
import { roundTicks, tuningAxisView, type AxisTick, type TuningAxisView } from '../parts/tuningAxis';
import { mapSubtitle, pointReadout, presentValueText, shownProps, type RetuneMapPlotProps } from './retuneMapText';

type XY = { x: number; y: number | null };

export const RETUNE_LINE_DEFAULTS = { lineWidthPx: 2, pointRadiusPx: 3, bestRadiusPx: 7 } as const;

/** Value-axis range over the trusted points and intervals (and the present controller), padded 6 %; null lets Chart.js choose. */
export function lineRange(props: RetuneMapPlotProps): [number, number] | null {
  const ends: number[] = [];
  for (const p of props.map.points) {
    const shade = shadeOf(p.value, p.support);
    if (shade === 'supported' || shade === 'caution') ends.push(p.value as number, ...(p.interval ?? []));
  }
  if (ends.length === 0) return null;
  if (props.map.presentController !== null) ends.push(props.map.presentController);
  const lo = Math.min(...ends), hi = Math.max(...ends), pad = (hi - lo) * 0.06 || Math.abs(hi) * 0.05 || 1;
  return [lo - pad, hi + pad];
}

export function retuneMapLineChart(given: RetuneMapPlotProps, look: PlotLook): ChartConfiguration<'line', XY[]> {
  const props = shownProps(given), { map } = props, p = look.palette, s = look.scale, d = RETUNE_LINE_DEFAULTS, axis = map.axes[0], colour = p.series[0];
  const view = tuningAxisView(axis), xs = map.points.map((q) => q.coordinates[0]);
  const at = (f: (i: number) => number | null) => xs.map((x, i) => ({ x, y: f(i) }));
  const datasets: ChartDataset<'line', XY[]>[] = [
    { label: 'interval low', data: at((i) => map.points[i].interval?.[0] ?? null), borderWidth: 0, pointRadius: 0, pointHitRadius: 0, spanGaps: false },
    { label: 'interval', data: at((i) => map.points[i].interval?.[1] ?? null), borderWidth: 0, pointRadius: 0, pointHitRadius: 0, backgroundColor: p.densityFill, fill: '-1', spanGaps: false },
    {
      label: 'J', data: at((i) => map.points[i].value), borderColor: colour, backgroundColor: colour, borderWidth: d.lineWidthPx * s, spanGaps: false,
      pointRadius: xs.map((_, i) => (map.best?.index === i ? d.bestRadiusPx : d.pointRadiusPx) * s),
      pointBackgroundColor: xs.map((_, i) => (map.best?.index === i ? p.background : colour)), pointBorderWidth: xs.map((_, i) => (map.best?.index === i ? 3 : 1) * s),
    },
  ];
  if (map.presentController !== null) {
    datasets.push({ label: PRESENT_CONTROLLER, data: [{ x: xs[0], y: map.presentController }, { x: xs[xs.length - 1], y: map.presentController }], borderColor: p.reference, borderWidth: 1.6 * s, borderDash: PRESENT_DASH_PX.map((v) => v * s), pointRadius: 0, pointHitRadius: 0 });
  }
  const shared = sharedOptions(look, props.title, mapSubtitle(props, 'Line'));
  const range = lineRange(props), logarithmic = view.logarithmic;
  const base = valueAxis(look, 'bottom'), ticks = view.roundTicks ? lineTicks(view) : null;
  const ours = ticks && {
    ticks: { ...base.ticks, callback: (v: number | string) => ticks.find((t) => Math.abs(t.value - Number(v)) <= 1e-9 * Math.abs(t.value))?.label ?? '' },
    afterBuildTicks: (scale: { ticks: { value: number }[] }) => { scale.ticks = ticks.map((t) => ({ value: t.value })); },
  };
  return {
    type: 'line',
    data: { datasets },
    plugins: [
      stretchPlugin(props, look), legendPlugin(lineKeys(props, look), look),
      ...axisTitles(look, [{ scaleId: 'x', position: 'bottom', text: view.title }, { scaleId: 'y', position: 'left', text: props.valueLabel }]),
    ],
    options: {
      ...shared,
      parsing: false,
      interaction: { mode: 'index', intersect: false },
      scales: {
        x: { ...base, type: logarithmic ? 'logarithmic' : 'linear', min: Math.min(xs[0], xs[xs.length - 1]), max: Math.max(xs[0], xs[xs.length - 1]), ...ours },
        y: { ...valueAxis(look, 'left'), type: 'linear', ...(range ? { min: range[0], max: range[1] } : {}) },
      },
      plugins: {
        ...shared.plugins,
        tooltip: {
          ...shared.plugins?.tooltip, displayColors: false,
          filter: (item) => item.datasetIndex === 2,
          callbacks: { title: () => '', label: (item) => pointReadout(props, item.dataIndex) },
        },
      },
    },
  };
}

/** The curve's round ticks: between its first and last grid values, in the shown unit (tuningAxis.ts). */
function lineTicks(view: TuningAxisView): AxisTick[] {
  const lo = Math.min(view.values[0], view.values[view.values.length - 1]), hi = Math.max(view.values[0], view.values[view.values.length - 1]);
  return roundTicks(lo, hi, view.logarithmic);
}

/** The shaded stretches: each unsupported or thin-log point from midway to its neighbours, the full height of the plot. */
function stretchPlugin(props: RetuneMapPlotProps, look: PlotLook): Plugin {
  return {
    id: 'setpointMapStretches',
    beforeDatasetsDraw(chart) {
      const xs = chart.scales.x, area = chart.chartArea, ctx = chart.ctx, pts = props.map.points;
      const px = pts.map((q) => xs.getPixelForValue(q.coordinates[0]));
      const rect = (i: number): Rect => {
        const left = i === 0 ? area.left : (px[i - 1] + px[i]) / 2, right = i === pts.length - 1 ? area.right : (px[i] + px[i + 1]) / 2;
        return { x: left, y: area.top, width: right - left, height: area.bottom - area.top };
      };
      const shaded = (which: string) => pts.flatMap((q, i) => (shadeOf(q.value, q.support) === which ? [rect(i)] : []));
      ctx.save();
      ctx.beginPath();
      ctx.rect(area.left, area.top, area.right - area.left, area.bottom - area.top);
      ctx.clip();
      ctx.fillStyle = look.palette.bandFill;
      for (const r of [...shaded('unsupported'), ...shaded('noValue'), ...shaded('caution')]) ctx.fillRect(r.x, r.y, r.width, r.height);
      drawHatching(ctx, shaded('unsupported'), look, LIGHT_HATCH);
      ctx.restore();
    },
  };
}

function lineKeys(props: RetuneMapPlotProps, look: PlotLook): LegendKey[] {
  const p = look.palette, d = RETUNE_LINE_DEFAULTS, pts = props.map.points, keys: LegendKey[] = [];
  keys.push({ label: 'J', kind: 'line', colour: p.series[0], lineWidthPx: d.lineWidthPx, markerRadiusPx: d.pointRadiusPx });
  if (pts.some((q) => q.interval)) keys.push({ label: 'interval', kind: 'area', colour: p.densityFill });
  if (props.map.best) keys.push({ label: 'best supported point (ringed)', kind: 'marker', colour: p.series[0], markerRadiusPx: d.bestRadiusPx - 2 });
  if (props.map.presentController !== null) keys.push({ label: `${PRESENT_CONTROLLER}: ${presentValueText(props.map)}`, kind: 'line', colour: p.reference, dash: PRESENT_DASH_PX, lineWidthPx: 1.6 });
  if (pts.some((q) => shadeOf(q.value, q.support) === 'caution')) keys.push({ label: 'thin logs (caution)', kind: 'area', colour: p.bandFill });
  if (pts.some((q) => shadeOf(q.value, q.support) === 'unsupported')) keys.push({ label: 'beyond the logs: not supported', kind: 'hatch', colour: p.bandFill, hatch: LIGHT_HATCH });
  return keys;
}
