/**
 * A small line chart as SVG: several series over a shared x, with gaps where a value is missing,
 * optional shaded x-bands and vertical markers (e.g. a candidate's mean action and the logged
 * action range), and a legend under the plot.
 */
import { escapeHtml } from './htmlText';
import { bottomAxis, extent, leftAxis, linearScale } from './svgAxes';
import { seriesColour } from './svgPalette';

export interface LineSeries {
  name: string;
  x: number[];
  y: (number | null)[];
  dashed?: boolean;
  /** Draw points as well as the line (for a handful of settings). */
  points?: boolean;
}

export interface LineChartInput {
  series: LineSeries[];
  xLabel: string;
  yLabel: string;
  bands?: { x0: number; x1: number; label: string }[];
  markers?: { x: number; label: string }[];
  width?: number;
  /** Whole-number settings (e.g. a polynomial degree): ticks only at integers. */
  integerX?: boolean;
  /** A line of text above the plot (e.g. the state a slice is taken at). */
  title?: string;
}

const HEIGHT = 250, LEFT = 72, BOTTOM_PAD = 44, LEGEND_ROW = 16;

export function svgLineChart(input: LineChartInput): string {
  const width = input.width ?? 520, right = width - 14, TOP = input.title ? 26 : 12;
  const plotBottom = HEIGHT - BOTTOM_PAD;
  const xs = linearScale(...extent(input.series.flatMap((s) => s.x)), LEFT, right);
  const ys = linearScale(...padded(extent(input.series.flatMap((s) => s.y))), plotBottom, TOP);
  const bands = (input.bands ?? []).map((b) => {
    const x0 = Math.max(LEFT, xs(b.x0)), x1 = Math.min(right, xs(b.x1));
    return `<rect x="${x0.toFixed(1)}" y="${TOP}" width="${Math.max(0, x1 - x0).toFixed(1)}" height="${plotBottom - TOP}" fill="#999" fill-opacity="0.18"><title>${escapeHtml(b.label)}</title></rect>`;
  });
  const markers = (input.markers ?? []).map((m) => `<line x1="${xs(m.x).toFixed(1)}" x2="${xs(m.x).toFixed(1)}" y1="${TOP}" y2="${plotBottom}" stroke="#555" stroke-dasharray="2 3"><title>${escapeHtml(m.label)}</title></line>`);
  const lines = input.series.map((s, k) => seriesPath(s, k, xs, ys));
  const legendRows = Math.ceil(input.series.length / 2) + (input.bands?.length ? 1 : 0);
  const height = HEIGHT + 8 + legendRows * LEGEND_ROW;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${escapeHtml(input.yLabel)}">` +
    (input.title ? `<text x="10" y="14" class="axis-label">${escapeHtml(input.title)}</text>` : '') + bands.join('') + markers.join('') + `<rect x="${LEFT}" y="${TOP}" width="${right - LEFT}" height="${plotBottom - TOP}" fill="none" stroke="#333"/>` +
    lines.join('') + bottomAxis(xs, plotBottom, input.xLabel, input.integerX) + leftAxis(ys, LEFT, input.yLabel) + legend(input, HEIGHT + 8, width) + '</svg>';
}

function seriesPath(s: LineSeries, k: number, xs: (v: number) => number, ys: (v: number) => number): string {
  let d = '', open = false;
  const dots: string[] = [];
  s.x.forEach((x, i) => {
    const y = s.y[i];
    if (y === null || !Number.isFinite(y)) {
      open = false;
      return;
    }
    d += `${open ? 'L' : 'M'}${xs(x).toFixed(1)} ${ys(y).toFixed(1)}`;
    open = true;
    if (s.points) dots.push(`<circle cx="${xs(x).toFixed(1)}" cy="${ys(y).toFixed(1)}" r="3" fill="${seriesColour(k)}"/>`);
  });
  return `<path d="${d}" fill="none" stroke="${seriesColour(k)}" stroke-width="1.8"${s.dashed ? ' stroke-dasharray="6 4"' : ''}/>${dots.join('')}`;
}

function legend(input: LineChartInput, top: number, width: number): string {
  const items = input.series.map((s, k) => {
    const x = LEFT + (k % 2) * ((width - LEFT) / 2), y = top + Math.floor(k / 2) * LEGEND_ROW;
    return `<line x1="${x}" x2="${x + 20}" y1="${y - 4}" y2="${y - 4}" stroke="${seriesColour(k)}" stroke-width="2"${s.dashed ? ' stroke-dasharray="6 4"' : ''}/>` +
      `<text x="${x + 26}" y="${y}">${escapeHtml(s.name)}</text>`;
  });
  if (input.bands?.length) {
    const y = top + Math.ceil(input.series.length / 2) * LEGEND_ROW;
    items.push(`<rect x="${LEFT}" y="${y - 10}" width="20" height="10" fill="#999" fill-opacity="0.3"/><text x="${LEFT + 26}" y="${y}">${escapeHtml(input.bands[0].label)}</text>`);
  }
  return `<g class="legend">${items.join('')}</g>`;
}

function padded([lo, hi]: [number, number]): [number, number] {
  const pad = (hi - lo) * 0.06;
  return [lo - pad, hi + pad];
}
