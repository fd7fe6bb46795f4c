/**
 * The retune map as a Chart.js chart. Two axes: a heat map of J over the grid (one cell per point,
 * at its index, so a logarithmic axis gets equal cells), our colour bar on the right with the
 * present controller's J marked across it, unsupported cells greyed and strongly hatched, thin-log
 * cells lightly hatched, the best supported cell outlined, and a readout of each cell on hover.
 * The tuning axes' units and ticks: tuningAxis.ts (an integral time in minutes, round ticks between
 * cell centres). One axis: see retuneMapLine.ts.
 */
import type { ChartConfiguration, TooltipItem } from 'chart.js';
import type { MapSupport, RetuneMapData } from './figureData';
import { axisTitles, sharedOptions, valueAxis } from '../parts/chartStyle';
import { colourBarPlugin } from '../parts/colourBar';
import { createColourScale, parseColour, rgbText } from '../parts/colourScale';
import { HATCH_DEFAULTS, LIGHT_HATCH } from '../parts/hatching';
import { legendPlugin, type LegendKey } from '../parts/legendBox';
import { mapCellLayout, shadeCount, type MapCellLayout } from '../parts/mapCells';
import { drawOutline, GREY_OUT, mapCellLayerPlugin, mix } from '../parts/mapCellLayer';
import { PRESENT_DASH_PX } from '../parts/plotTheme';
import type { PlotLook } from '../parts/plotLook';
import { plainText } from '../parts/richText';
import { formatValue, tuningValueTexts } from '../parts/tickFormat';
import { cellAxisTicks, tuningAxisView, type TuningAxisView } from '../parts/tuningAxis';
import { retuneMapLineChart } from './retuneMapLine';
import { bestValueText, betterWords, mapSubtitle, pointReadout, presentValueText, shownProps, type RetuneMapPlotProps } from './retuneMapText';

export type { RetuneMapPlotProps } from './retuneMapText';

export const RETUNE_MAP_DEFAULTS = { heatHeightPx: 480, lineHeightPx: 380 } as const;

type CellPoint = { x: number; y: number };

export function retuneMapChart(props: RetuneMapPlotProps, look: PlotLook): ChartConfiguration {
  if (props.map.axes.length === 1) return retuneMapLineChart(props, look) as unknown as ChartConfiguration;
  return retuneMapHeatChart(props, look) as unknown as ChartConfiguration;
}

export function retuneMapHeatChart(given: RetuneMapPlotProps, look: PlotLook): ChartConfiguration<'scatter', CellPoint[]> {
  const props = shownProps(given), { map } = props, layout = mapCellLayout(map), [xAxis, yAxis] = map.axes;
  const scale = createColourScale(layout.domainValues);
  const shared = sharedOptions(look, props.title, mapSubtitle(props, 'Colour'));
  const present = map.presentController;
  const [xView, yView] = [tuningAxisView(xAxis), tuningAxisView(yAxis)];
  const indexAxis = (view: TuningAxisView, position: 'bottom' | 'left') => {
    const base = valueAxis(look, position, false), ticks = cellAxisTicks(view);
    const labelAt = (v: number) => ticks.find((t) => Math.abs(t.position - v) < 1e-9)?.label ?? '';
    return {
      ...base, type: 'linear' as const, min: -0.5, max: view.values.length - 0.5,
      ticks: { ...base.ticks, callback: (v: number | string) => labelAt(Number(v)) },
      // Our ticks (tuningAxis.ts): at cell centres, or round values at their true places between them (Chart.js would start at the axis minimum, a cell edge).
      afterBuildTicks: (axis: { ticks: { value: number }[] }) => { axis.ticks = ticks.map((t) => ({ value: t.position })); },
    };
  };
  return {
    type: 'scatter',
    data: { datasets: look.interactive ? [hoverCells(layout)] : [] },
    plugins: [
      mapCellLayerPlugin({ layout, scale, look }),
      colourBarPlugin({ scale, label: props.valueLabel, look, ...(present === null ? {} : { reference: { value: present, colour: look.palette.text, dash: PRESENT_DASH_PX } }) }),
      legendPlugin(heatKeys(layout, scale.colourAt(0.5), look), look),
      ...axisTitles(look, [{ scaleId: 'x', position: 'bottom', text: xView.title }, { scaleId: 'y', position: 'left', text: yView.title }]),
    ],
    options: {
      ...shared,
      parsing: false,
      normalized: true,
      interaction: { mode: 'nearest', intersect: false },
      scales: { x: indexAxis(xView, 'bottom'), y: indexAxis(yView, 'left') },
      plugins: {
        ...shared.plugins,
        legend: { display: false },
        tooltip: { ...shared.plugins?.tooltip, displayColors: false, callbacks: { title: () => '', label: (item: TooltipItem<'scatter'>) => pointReadout(props, hoverOrder(layout)[item.dataIndex]) } },
      },
    },
  };
}

/** Point indices in the order of the hover points: rows of the heat map (index row·columns + column), as the grid keys expect. */
export function hoverOrder(layout: MapCellLayout): number[] {
  const order: number[] = [];
  for (let row = 0; row < layout.rows; row++) for (let column = 0; column < layout.columns; column++) order.push(column * layout.rows + row);
  return order;
}

function hoverCells(layout: MapCellLayout) {
  const data = hoverOrder(layout).map((p) => ({ x: layout.cells[p].column, y: layout.cells[p].row }));
  return { label: 'cells', data, pointRadius: 0, pointHoverRadius: 0, pointHitRadius: 0 };
}

function heatKeys(layout: MapCellLayout, mid: readonly [number, number, number], look: PlotLook): LegendKey[] {
  const p = look.palette, keys: LegendKey[] = [];
  if (shadeCount(layout, 'supported') > 0) keys.push({ label: 'supported by the logs', kind: 'area', colour: rgbText(mid) });
  if (layout.best !== null) keys.push({ label: 'best supported point', kind: 'area', colour: rgbText(mid), overlay: (ctx, rect) => drawOutline(ctx, rect, look) });
  if (shadeCount(layout, 'caution') > 0) keys.push({ label: 'thin logs (caution)', kind: 'hatch', colour: rgbText(mid), hatch: LIGHT_HATCH });
  if (shadeCount(layout, 'unsupported') > 0) {
    keys.push({ label: 'beyond the logs: not supported', kind: 'hatch', colour: rgbText(mix(mid, parseColour(p.noValue), GREY_OUT)), hatch: HATCH_DEFAULTS });
  }
  if (shadeCount(layout, 'noValue') > 0) keys.push({ label: 'no solution', kind: 'area', colour: p.noValue });
  return keys;
}

/** The best point's coordinates as the axes label them (tuningValueTexts), never formatValue's "2400" beside the axis's "2,400". */
function bestPointTexts(map: RetuneMapData): string[] {
  const texts = tuningValueTexts(map.axes, map.points[map.best!.index].coordinates);
  return map.axes.map((a, i) => `${plainText(a.label)} ${texts[i]}`);
}

export function retuneMapHeight(map: RetuneMapData): number {
  return map.axes.length === 1 ? RETUNE_MAP_DEFAULTS.lineHeightPx : RETUNE_MAP_DEFAULTS.heatHeightPx;
}

/** Text alternative for screen readers and the figure's description. */
export function retuneMapSummary(given: RetuneMapPlotProps): string {
  const props = shownProps(given), { map } = props, n = map.points.length;
  const count = (s: MapSupport) => map.points.filter((p) => p.value !== null && p.support === s).length;
  const over = map.axes.map((a) => `${plainText(a.label)} (${formatValue(a.values[0])} to ${formatValue(a.values[a.values.length - 1])})`).join(' and ');
  const best = map.best ? `Best supported point: ${bestPointTexts(map).join(', ')}, J ${bestValueText(map)}.` : 'No point is both converged and supported by the logs.';
  const present = map.presentController === null ? '' : ` Present controller: J ${presentValueText(map)}.`;
  return `${map.axes.length === 2 ? 'Heat map' : 'Curve'} of ${plainText(props.valueLabel)} (${betterWords(props.sense)}) over ${over}, ${n} points: `
    + `${count(null)} supported by the logs, ${count('caution')} on thin logs, ${count('serious') + count('unknown')} beyond them (shaded). ${best}${present}`;
}
