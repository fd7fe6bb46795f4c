/**
 * The action-value slice Q(s, ·) along one action at a chosen state, with the candidate policy's
 * action density π(a | s) filled underneath on its own axis, the quadrature nodes on the Q curve
 * (marker area ∝ weight, since V^π(s) = Σ w_j Q(s, a_j)), and — for clipped bounds — the point
 * masses at the limits as bars whose height is their probability.
 */
import type { SliceData as ActionSliceReply } from './figureData';
import type { ChartConfiguration, ChartDataset, Plugin } from 'chart.js';
import { axisTitles, sharedOptions, valueAxis } from '../parts/chartStyle';
import { legendPlugin, type LegendKey } from '../parts/legendBox';
import { densityOutline } from '../parts/densityOutline';
import { drawBackedText } from '../parts/backedText';
import { limitLabelBoxes, limitLabelFont } from '../parts/limitLabels';
import type { PlotLook } from '../parts/plotLook';
import type { Theme } from '../parts/plotTheme';
import { pointMassesAtBounds, type PointMass, type SliceBounds } from '../parts/pointMasses';
import { interpolateOnGrid } from '../parts/sliceInterpolation';
import { formatValue } from '../parts/tickFormat';
import { sharesText } from '../../core/shareText';

export const ACTION_SLICE_DEFAULTS = {
  heightPx: 380,
  lineWidthPx: 2.2,
  /** Marker radius of the heaviest node; others scale by √(w / w_max) so area ∝ weight. */
  nodeRadiusPx: 8,
  nodeMinRadiusPx: 2.5,
  massBarPx: 10,
  /** Share of the action span added beyond a slice end that carries a point mass. */
  massPadding: 0.03,
  /** The density axis runs to this multiple of the peak density, keeping the density under the Q curve. */
  densityHeadroom: 2.2,
} as const;

/** The worker's slice of Q(s, ·), plus what the plot needs to mark clipped or truncated limits. */
export interface ActionSliceData extends ActionSliceReply {
  /** Actuator bounds of this action, when the policy has them (clip: point masses are marked). */
  bounds?: SliceBounds;
}

export interface ActionSlicePlotProps {
  slice: ActionSliceData;
  actionLabel: string;
  valueLabel: string;
  title: string;
  theme: Theme;
  /** Actions logged near this state: shaded, so a reader sees where Q is extrapolated. */
  loggedRange?: readonly [number, number];
  /** The candidate's mean action at this state: a dotted line. */
  meanAction?: number;
  /** The line(s) under the title; default "<policy> at state (…)". */
  subtitle?: string | readonly string[];
}

export class ActionSliceShapeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ActionSliceShapeError';
  }
}

type XY = { x: number; y: number };

export function actionSliceChart(props: ActionSlicePlotProps, look: PlotLook): ChartConfiguration<'line', XY[]> {
  const { slice } = props, d = ACTION_SLICE_DEFAULTS;
  checkSlice(slice);
  const masses = pointMassesAtBounds(slice.nodes, slice.bounds);
  const shared = sharedOptions(look, props.title, props.subtitle ?? `${slice.policyName} at state (${slice.state.map(formatValue).join(', ')})`);
  const datasets = sliceDatasets(props, masses, look);
  const densityPeak = Math.max(...Array.from(slice.density).filter(Number.isFinite), 0);
  return {
    type: 'line',
    data: { datasets: datasets as ChartDataset<'line', XY[]>[] },
    plugins: [
      bandPlugin(props, look), boundsPlugin(slice.bounds, masses, look), legendPlugin(sliceKeys(props, masses, look), look),
      ...axisTitles(look, [
        { scaleId: 'x', position: 'bottom', text: props.actionLabel }, { scaleId: 'y', position: 'left', text: props.valueLabel },
        ...(slice.density.some((v) => v > 0) ? [{ scaleId: 'yDensity', position: 'right' as const, text: 'policy density' }] : []),
      ]),
    ],
    options: {
      ...shared,
      parsing: false,
      interaction: { mode: 'nearest', intersect: false, axis: 'x' },
      scales: {
        // offset: false — the point-mass bars must not pad the action axis as a bar chart's would.
        x: {
          type: 'linear', ...actionRange(slice.actions, masses), offset: false, ...valueAxis(look, 'bottom'),
          // Only round ticks: a padded end would read "-1.063"; the bounds carry their values in their labels.
          ticks: { ...valueAxis(look, 'bottom').ticks, includeBounds: false },
        },
        y: { type: 'linear', ...valueAxis(look, 'left') },
        yDensity: {
          type: 'linear', min: 0, suggestedMax: densityPeak > 0 ? densityPeak * d.densityHeadroom : 1,
          ...valueAxis(look, 'right', false), display: densityPeak > 0,
        },
        yMass: { type: 'linear', min: 0, max: 1, display: false },
      },
      plugins: {
        ...shared.plugins,
        tooltip: { ...shared.plugins?.tooltip, callbacks: { label: (item) => `${item.dataset.label}: ${formatValue(item.parsed.y ?? NaN)} at ${formatValue(item.parsed.x ?? NaN)}` } },
      },
    },
  };
}

/** Legend keys drawn as the series are: the Q line, node markers, density area, masses, band, mean. */
function sliceKeys(props: ActionSlicePlotProps, masses: PointMass[], look: PlotLook): LegendKey[] {
  const p = look.palette, d = ACTION_SLICE_DEFAULTS, slice = props.slice;
  const keys: LegendKey[] = [{ label: 'Q^{π}(s, a) along the action', kind: 'line', colour: p.series[0], lineWidthPx: d.lineWidthPx }];
  if (slice.nodes.points.length) keys.push({ label: 'quadrature nodes (area ∝ weight)', kind: 'marker', colour: p.series[1], markerRadiusPx: 4 });
  if (slice.density.some((v) => v > 0)) keys.push({ label: 'policy density π(a | s)', kind: 'area', colour: p.densityFill, border: p.reference });
  if (masses.length) keys.push({ label: 'probability at a limit (bar height)', kind: 'area', colour: p.series[2] });
  if (props.loggedRange) keys.push({ label: 'actions logged near this state', kind: 'area', colour: p.bandFill });
  if (props.meanAction !== undefined) keys.push({ label: 'candidate’s mean action', kind: 'line', colour: p.text, dash: [2, 3], lineWidthPx: 1.2 });
  return keys;
}

/** The logged-action band (under the curves) and the candidate's mean action (a dotted line). */
function bandPlugin(props: ActionSlicePlotProps, look: PlotLook): Plugin {
  return {
    id: 'setpointLoggedBand',
    beforeDatasetsDraw(chart) {
      const { ctx, chartArea: a } = chart, xs = chart.scales.x, s = look.scale;
      ctx.save();
      if (props.loggedRange) {
        const x0 = Math.max(a.left, xs.getPixelForValue(props.loggedRange[0])), x1 = Math.min(a.right, xs.getPixelForValue(props.loggedRange[1]));
        ctx.fillStyle = look.palette.bandFill;
        if (x1 > x0) ctx.fillRect(x0, a.top, x1 - x0, a.bottom - a.top);
      }
      if (props.meanAction !== undefined && props.meanAction >= xs.min && props.meanAction <= xs.max) {
        const x = xs.getPixelForValue(props.meanAction);
        ctx.strokeStyle = look.palette.text;
        ctx.lineWidth = 1.2 * s;
        ctx.setLineDash([2 * s, 3 * s]);
        ctx.beginPath();
        ctx.moveTo(x, a.top);
        ctx.lineTo(x, a.bottom);
        ctx.stroke();
      }
      ctx.restore();
    },
  };
}

/**
 * The action axis spans the slice; where a point mass sits on an end of it (a slice cut at the
 * bounds) the axis reaches a little past, so the bar is not cut in half by the plot edge.
 */
export function actionRange(actions: Float64Array, masses: readonly PointMass[]): { min: number; max: number } {
  const lo = actions[0], hi = actions[actions.length - 1], pad = (hi - lo) * ACTION_SLICE_DEFAULTS.massPadding;
  return {
    min: masses.some((m) => m.action <= lo) ? lo - pad : lo,
    max: masses.some((m) => m.action >= hi) ? hi + pad : hi,
  };
}

/** Q(s, ·), the nodes on it, the density underneath, and the point masses (if clipped). */
function sliceDatasets(props: ActionSlicePlotProps, masses: PointMass[], look: PlotLook): ChartDataset<'line' | 'scatter' | 'bar', XY[]>[] {
  const { slice } = props, p = look.palette, s = look.scale, d = ACTION_SLICE_DEFAULTS, n = slice.actions.length;
  const datasets: ChartDataset<'line' | 'scatter' | 'bar', XY[]>[] = [
    {
      type: 'line', label: 'Q(s, a)', yAxisID: 'y', order: 1,
      data: Array.from({ length: n }, (_, i) => ({ x: slice.actions[i], y: slice.actionValues[i] })),
      borderColor: p.series[0], backgroundColor: p.series[0], borderWidth: d.lineWidthPx * s, pointRadius: 0, pointHoverRadius: 0, tension: 0,
    },
    nodeDataset(slice, look),
    {
      type: 'line', label: 'policy density π(a | s)', yAxisID: 'yDensity', order: 3,
      data: densityOutline(slice.actions, slice.density, slice.bounds),
      borderColor: p.reference, backgroundColor: p.densityFill, borderWidth: 1.2 * s, fill: 'origin', pointRadius: 0, pointHoverRadius: 0,
    },
  ];
  if (masses.length) {
    datasets.push({
      type: 'bar', label: 'point mass at a bound (bar height = probability)', yAxisID: 'yMass', order: 2,
      data: masses.map((m) => ({ x: m.action, y: m.probability })), backgroundColor: p.series[2], borderColor: p.series[2],
      barThickness: d.massBarPx * s, grouped: false,
    });
  }
  return datasets;
}

function nodeDataset(slice: ActionSliceData, look: PlotLook): ChartDataset<'scatter', XY[]> {
  const d = ACTION_SLICE_DEFAULTS, s = look.scale, { points, weights } = slice.nodes;
  const data: XY[] = [], radii: number[] = [];
  const heaviest = Math.max(...Array.from(weights), 0);
  for (let j = 0; j < points.length; j++) {
    const q = interpolateOnGrid(slice.actions, slice.actionValues, points[j]);
    if (q === null || !(weights[j] > 0)) continue;
    data.push({ x: points[j], y: q });
    radii.push(Math.max(d.nodeMinRadiusPx, d.nodeRadiusPx * Math.sqrt(weights[j] / heaviest)) * s);
  }
  return {
    type: 'scatter', label: 'quadrature nodes (marker area ∝ weight)', yAxisID: 'y', order: 0, data,
    pointRadius: radii, pointHoverRadius: radii.map((r) => r + 2 * s),
    backgroundColor: look.palette.series[1], borderColor: look.palette.background, borderWidth: s,
  };
}

/** Dashed lines at the actuator bounds, each labelled with its value and point mass beyond the line (parts/limitLabels.ts). */
function boundsPlugin(bounds: SliceBounds | undefined, masses: PointMass[], look: PlotLook): Plugin {
  return {
    id: 'setpointActionBounds',
    afterDatasetsDraw(chart) {
      if (!bounds) return;
      const ctx = chart.ctx, area = chart.chartArea, xs = chart.scales.x, s = look.scale;
      const shown = ([[bounds.lo, 'lower'], [bounds.hi, 'upper']] as const).filter(([edge]) => edge >= xs.min && edge <= xs.max);
      ctx.save();
      ctx.strokeStyle = look.palette.mutedText;
      ctx.lineWidth = s;
      ctx.setLineDash([5 * s, 4 * s]);
      for (const [edge] of shown) {
        const x = xs.getPixelForValue(edge);
        ctx.beginPath();
        ctx.moveTo(x, area.top);
        ctx.lineTo(x, area.bottom);
        ctx.stroke();
      }
      ctx.setLineDash([]);
      const { font, heightPx } = limitLabelFont(look);
      ctx.font = font;
      const texts = limitLabelTexts(shown.map(([edge, side]) => ({ side, edge, probability: masses.find((m) => m.action === edge)?.probability ?? null })));
      const boxes = limitLabelBoxes(shown.map(([edge, side], i) => ({ x: xs.getPixelForValue(edge), side, widthPx: ctx.measureText(texts[i]).width })), area, heightPx, s);
      boxes.forEach((box, i) => drawBackedText(ctx, texts[i], box, look.palette.text, look));
      ctx.restore();
    },
  };
}

function checkSlice(slice: ActionSliceData): void {
  const n = slice.actions.length;
  if (n < 2) throw new ActionSliceShapeError(`slice.actions: expected at least 2 actions, got ${n}`);
  if (slice.actionValues.length !== n) throw new ActionSliceShapeError(`slice.actionValues: expected ${n} values (one per action), got ${slice.actionValues.length}`);
  if (slice.density.length !== n) throw new ActionSliceShapeError(`slice.density: expected ${n} values (one per action), got ${slice.density.length}`);
  if (slice.nodes.points.length !== slice.nodes.weights.length) {
    throw new ActionSliceShapeError(`slice.nodes: ${slice.nodes.points.length} points but ${slice.nodes.weights.length} weights`);
  }
  for (let i = 1; i < n; i++) {
    if (!(slice.actions[i] > slice.actions[i - 1])) throw new ActionSliceShapeError(`slice.actions: expected increasing values, but entry ${i + 1} (${slice.actions[i]}) does not exceed entry ${i} (${slice.actions[i - 1]})`);
  }
}

/**
 * A limit's label on the slice: "lower limit 0: 2.58 % probability", the chance the clipped action
 * sits there written by the one share writer (core/shareText.ts), as every share the engineer reads.
 */
export function limitLabelText(side: 'lower' | 'upper', edge: number, probability: number | null): string {
  return limitLabelTexts([{ side, edge, probability }])[0];
}

/** The labels of both limits, read side by side on one chart: their shares at one precision (sharesText), "2.80 %" beside "0.31 %", never "2.8 %". */
export function limitLabelTexts(limits: readonly { side: 'lower' | 'upper'; edge: number; probability: number | null }[]): string[] {
  const shares = sharesText(limits.map((l) => l.probability));
  return limits.map((l, i) => `${l.side} limit ${formatValue(l.edge)}${l.probability === null ? '' : `: ${shares[i]} probability`}`);
}

/** "Below 0.01 %" at the start of a sentence; a number stays as it is. */
function sentenceStart(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

export function actionSliceSummary(props: ActionSlicePlotProps): string {
  const { slice } = props, n = slice.actions.length;
  let best = 0, peak = 0;
  for (let i = 1; i < n; i++) {
    if (slice.actionValues[i] > slice.actionValues[best]) best = i;
    if (slice.density[i] > slice.density[peak]) peak = i;
  }
  const atBounds = pointMassesAtBounds(slice.nodes, slice.bounds), shares = sharesText(atBounds.map((m) => m.probability));
  const masses = atBounds.map((m, i) => ` ${sentenceStart(shares[i])} of the action’s probability sits on the ${m.side} bound ${formatValue(m.action)}.`).join('');
  return `Q(s, a) of ${props.valueLabel} along ${props.actionLabel} from ${formatValue(slice.actions[0])} to ${formatValue(slice.actions[n - 1])} `
    + `for ${slice.policyName}; highest ${formatValue(slice.actionValues[best])} at ${formatValue(slice.actions[best])}. `
    + `The policy density peaks at ${formatValue(slice.actions[peak])}; ${slice.nodes.points.length} quadrature nodes are marked.${masses}`;
}
