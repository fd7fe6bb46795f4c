/**
 * In-page measurements for the e2e test: pixel statistics of a plot's canvas, the colour bar's
 * ramp read back from the canvas, a PNG decoded by the browser's own decoder (<img>), and an SVG
 * parsed by DOMParser and rasterised through <img>.
 */
import { inspectFigure } from '../../../src/renderer/src/plots/ChartFigure';
import type { FigureInspection } from '../../../src/renderer/src/plots/chartMessages';
import type { Theme } from '../../../src/renderer/src/plots';
import { COLOUR_BAR_DEFAULTS } from '../../../src/figures/parts/colourBar';
import type { PlotKind } from './plotSpecs';

/** What the chart worker drew in a plot's figure (see inspectFigure). */
async function drawnOf(kind: PlotKind, theme: Theme): Promise<FigureInspection> {
  const figure = document.querySelector(`#${kind}-${theme} figure`);
  const drawn = figure ? await inspectFigure(figure) : null;
  if (!drawn) throw new Error(`no chart drawn for ${kind} (${theme})`);
  return drawn;
}

function pixelStats(data: Uint8ClampedArray): { variance: number; distinctColours: number } {
  let sum = 0, squares = 0;
  const colours = new Set<number>();
  const n = data.length / 4;
  for (let i = 0; i < data.length; i += 4) {
    const y = 0.2126 * data[i] + 0.7152 * data[i + 1] + 0.0722 * data[i + 2];
    sum += y;
    squares += y * y;
    colours.add((data[i] << 24) | (data[i + 1] << 16) | (data[i + 2] << 8) | data[i + 3]);
  }
  return { variance: squares / n - (sum / n) ** 2, distinctColours: colours.size };
}

export async function canvasStats(kind: PlotKind, theme: Theme) {
  const drawn = await drawnOf(kind, theme);
  return { width: drawn.width, height: drawn.height, ...pixelStats(drawn.rgba) };
}

/** The colour bar box (layout box on the right that is not a scale), and the colours at its top and bottom. */
export async function colourBarProbe(theme: Theme) {
  const drawn = await drawnOf('surface', theme);
  const box = drawn.boxes.find((b) => b.position === 'right' && !b.isScale);
  if (!box) return null;
  const ratio = drawn.pixelRatio;
  // The middle of the ramp: the box starts a gap left of the bar (CSS px at scale 1 on screen).
  const x = box.left + COLOUR_BAR_DEFAULTS.gapPx + COLOUR_BAR_DEFAULTS.barWidthPx / 2;
  const read = (y: number) => {
    const o = (Math.round(y * ratio) * drawn.width + Math.round(x * ratio)) * 4;
    return Array.from(drawn.rgba.subarray(o, o + 3));
  };
  return { left: box.left, width: box.right - box.left, top: read(box.top + 2), bottom: read(box.bottom - 2) };
}

/** Data points with an active tooltip in a plot. */
export async function tooltipActive(kind: PlotKind, theme: Theme): Promise<number> {
  return (await drawnOf(kind, theme)).activeCount;
}

/** True once every figure on the page reports its chart drawn. */
export function allDrawn(): boolean {
  const figures = [...document.querySelectorAll('figure')];
  return figures.length > 0 && figures.every((f) => f.getAttribute('data-chart-state') === 'drawn');
}

async function imageOf(url: string): Promise<HTMLImageElement> {
  const image = new Image();
  image.src = url;
  await image.decode();
  return image;
}

function imageData(image: HTMLImageElement, width: number, height: number): Uint8ClampedArray {
  const canvas = document.createElement('canvas');
  canvas.width = width;
  canvas.height = height;
  const ctx = canvas.getContext('2d')!;
  ctx.drawImage(image, 0, 0, width, height);
  return ctx.getImageData(0, 0, width, height).data;
}

export async function decodePng(base64: string) {
  const bytes = Uint8Array.from(atob(base64), (c) => c.charCodeAt(0));
  const url = URL.createObjectURL(new Blob([bytes], { type: 'image/png' }));
  try {
    const image = await imageOf(url);
    const { naturalWidth: w, naturalHeight: h } = image, data = imageData(image, w, h);
    const alphaAt = (x: number, y: number) => data[(y * w + x) * 4 + 3];
    return {
      width: w, height: h, ...pixelStats(data),
      cornerAlpha: [alphaAt(0, 0), alphaAt(w - 1, 0), alphaAt(0, h - 1), alphaAt(w - 1, h - 1)],
    };
  } finally {
    URL.revokeObjectURL(url);
  }
}

export function parseSvg(svg: string) {
  const doc = new DOMParser().parseFromString(svg, 'image/svg+xml');
  const error = doc.querySelector('parsererror');
  return {
    error: error ? error.textContent : null,
    root: doc.documentElement.nodeName,
    title: doc.querySelector('title')?.textContent ?? null,
    texts: Array.from(doc.querySelectorAll('text'), (t) => t.textContent ?? ''),
  };
}

/** The SVG drawn by the browser at its viewBox size: is anything on it? */
export async function renderSvg(svg: string, width: number, height: number) {
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
  try {
    return pixelStats(imageData(await imageOf(url), width, height));
  } finally {
    URL.revokeObjectURL(url);
  }
}

