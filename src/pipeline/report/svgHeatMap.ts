/**
 * A value surface as an SVG heat map: the grid as an embedded PNG, one pixel per grid point
 * coloured by value (viridis) and scaled up without smoothing, a colour bar, and the grid points
 * with no logged state nearby hatched over, so a reader sees at once where V is extrapolated.
 */
import { escapeHtml, formatNumber } from './htmlText';
import { bottomAxis, extent, leftAxis, linearScale, niceTicks } from './svgAxes';
import { pngDataUrl, encodePng } from './pngImage';
import { sequentialColour } from './svgPalette';

export interface HeatMapInput {
  /** Unique within the document: ids of the pattern and gradient derive from it. */
  id: string;
  x: ArrayLike<number>; // nx
  y: ArrayLike<number>; // ny
  values: ArrayLike<number>; // ny×nx row-major, row j at y[j]
  /** 1 where no logged state is near the grid point (ny×nx; unvisitedRegion.ts), hatched over. */
  uncovered?: ArrayLike<number>;
  xLabel: string;
  yLabel: string;
  valueLabel: string;
}

const WIDTH = 520, HEIGHT = 384, LEFT = 70, RIGHT = 410, TOP = 16, BOTTOM = 316, BAR_X = 438;

export function svgHeatMap(input: HeatMapInput): string {
  const nx = input.x.length, ny = input.y.length;
  const [vLo, vHi] = extent(Array.from(input.values));
  const xs = linearScale(input.x[0], input.x[nx - 1], LEFT, RIGHT), ys = linearScale(input.y[0], input.y[ny - 1], BOTTOM, TOP);
  const colour = linearScale(vLo, vHi, 0, 1);
  // Grid point (i, j) is the centre of its cell, so the image spans half a cell beyond the axis ends.
  const cellW = (RIGHT - LEFT) / (nx - 1), cellH = (BOTTOM - TOP) / (ny - 1);
  const pixels = new Uint8Array(nx * ny * 3);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const v = input.values[j * nx + i], o = ((ny - 1 - j) * nx + i) * 3; // image rows run top-down
      pixels.set(Number.isFinite(v) ? rgbOf(sequentialColour(colour(v))) : [255, 255, 255], o);
    }
  }
  const image = pngDataUrl(encodePng(nx, ny, pixels));
  const pattern = `${input.id}-unvisited`;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${WIDTH} ${HEIGHT}" width="${WIDTH}" height="${HEIGHT}" role="img" aria-label="${escapeHtml(input.valueLabel)}">` +
    `<defs><pattern id="${pattern}" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">` +
    `<rect width="6" height="6" fill="#ffffff" fill-opacity="0.45"/><line x1="0" y1="0" x2="0" y2="6" stroke="#444" stroke-width="1.2"/></pattern>` +
    `<clipPath id="${input.id}-plot"><rect x="${LEFT}" y="${TOP}" width="${RIGHT - LEFT}" height="${BOTTOM - TOP}"/></clipPath></defs>` +
    `<g clip-path="url(#${input.id}-plot)"><image href="${image}" x="${(LEFT - cellW / 2).toFixed(2)}" y="${(TOP - cellH / 2).toFixed(2)}" ` +
    `width="${(RIGHT - LEFT + cellW).toFixed(2)}" height="${(BOTTOM - TOP + cellH).toFixed(2)}" preserveAspectRatio="none" style="image-rendering: pixelated"/>` +
    `<g fill="url(#${pattern})" shape-rendering="crispEdges">${input.uncovered ? unvisitedRuns(input, xs, ys, cellW, cellH) : ''}</g></g>` +
    `<rect x="${LEFT}" y="${TOP}" width="${RIGHT - LEFT}" height="${BOTTOM - TOP}" fill="none" stroke="#333"/>` +
    bottomAxis(xs, BOTTOM, input.xLabel) + leftAxis(ys, LEFT, input.yLabel) + colourBar(input.id, vLo, vHi, input.valueLabel, pattern, Boolean(input.uncovered)) + '</svg>';
}

/** One rectangle per horizontal run of uncovered grid points. */
function unvisitedRuns(input: HeatMapInput, xs: (v: number) => number, ys: (v: number) => number, cellW: number, cellH: number): string {
  const nx = input.x.length, ny = input.y.length, uncovered = input.uncovered!, out: string[] = [];
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      if (!uncovered[j * nx + i]) continue;
      const start = i;
      while (i + 1 < nx && uncovered[j * nx + i + 1]) i++;
      const x = xs(input.x[start]) - cellW / 2, y = ys(input.y[j]) - cellH / 2;
      out.push(`<rect x="${x.toFixed(2)}" y="${y.toFixed(2)}" width="${((i - start + 1) * cellW).toFixed(2)}" height="${cellH.toFixed(2)}"/>`);
    }
  }
  return out.join('');
}

function rgbOf(hex: string): [number, number, number] {
  return [parseInt(hex.slice(1, 3), 16), parseInt(hex.slice(3, 5), 16), parseInt(hex.slice(5, 7), 16)];
}

function colourBar(id: string, lo: number, hi: number, label: string, pattern: string, withUnvisited: boolean): string {
  const stops = Array.from({ length: 11 }, (_, k) => `<stop offset="${k * 10}%" stop-color="${sequentialColour(1 - k / 10)}"/>`).join('');
  const scale = linearScale(lo, hi, BOTTOM - 40, TOP);
  const ticks = niceTicks(scale.domain[0], scale.domain[1], 5).map((t) => {
    const y = scale(t).toFixed(1);
    return `<line x1="${BAR_X + 14}" x2="${BAR_X + 18}" y1="${y}" y2="${y}" class="tick"/><text x="${BAR_X + 21}" y="${y}" dy="0.32em">${escapeHtml(formatNumber(t, 4))}</text>`;
  });
  const unvisited = withUnvisited
    ? `<rect x="${LEFT}" y="${HEIGHT - 16}" width="14" height="14" fill="url(#${pattern})" stroke="#333"/><text x="${LEFT + 19}" y="${HEIGHT - 5}">no logged state within one grid step (V extrapolated)</text>`
    : '';
  return `<defs><linearGradient id="${id}-bar" x1="0" x2="0" y1="0" y2="1">${stops}</linearGradient></defs>` +
    `<g class="axis"><rect x="${BAR_X}" y="${TOP}" width="14" height="${BOTTOM - 40 - TOP}" fill="url(#${id}-bar)" stroke="#333"/>${ticks.join('')}` +
    `<text transform="translate(${BAR_X + 66} ${(TOP + BOTTOM - 40) / 2}) rotate(90)" text-anchor="middle" class="axis-label">${escapeHtml(label)}</text></g>${unvisited}`;
}
