/**
 * In-page measurements for the e2e test: pixel statistics of a plot's canvas, the colour bar's
 * ramp read back from the canvas, a PNG decoded by the browser's own decoder (<img>), and an SVG
 * parsed by DOMParser and rasterised through <img>.
 */
import { Chart } from 'chart.js';
import type { Theme } from '../../../src/renderer/src/plots';
import { COLOUR_BAR_DEFAULTS } from '../../../src/figures/parts/colourBar';
import type { PlotKind } from './plotSpecs';

function canvasOf(kind: PlotKind, theme: Theme): HTMLCanvasElement {
  const canvas = document.querySelector<HTMLCanvasElement>(`#${kind}-${theme} canvas`);
  if (!canvas) throw new Error(`no canvas for ${kind} (${theme})`);
  return canvas;
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

export function canvasStats(kind: PlotKind, theme: Theme) {
  const canvas = canvasOf(kind, theme);
  const data = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height).data;
  return { width: canvas.width, height: canvas.height, ...pixelStats(data) };
}

/** The colour bar box (layout box on the right that is not a scale), and the colours at its top and bottom. */
export function colourBarProbe(theme: Theme) {
  const canvas = canvasOf('surface', theme), chart = Chart.getChart(canvas)!;
  const box = chart.boxes.find((b) => b.position === 'right' && !('axis' in b));
  if (!box) return null;
  const ratio = chart.currentDevicePixelRatio, ctx = canvas.getContext('2d')!;
  // The middle of the ramp: the box starts a gap left of the bar (CSS px at scale 1 on screen).
  const x = box.left + COLOUR_BAR_DEFAULTS.gapPx + COLOUR_BAR_DEFAULTS.barWidthPx / 2;
  const read = (y: number) => Array.from(ctx.getImageData(Math.round(x * ratio), Math.round(y * ratio), 1, 1).data.subarray(0, 3));
  return { left: box.left, width: box.width, top: read(box.top + 2), bottom: read(box.bottom - 2) };
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
