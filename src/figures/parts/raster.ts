/**
 * A small RGBA bitmap (the heat-map grid, the colour-bar ramp) and how it reaches a drawing context.
 * A canvas gets it through drawImage of a canvas holding the pixels; the SVG exporter's context
 * takes the bitmap itself (it embeds it as a PNG), which it announces with drawRaster.
 *
 * Layout: rgba is height×width×4 row-major, row 0 at the top.
 */
export interface Raster {
  readonly width: number;
  readonly height: number;
  readonly rgba: Uint8ClampedArray;
}

/** A context that can place a bitmap without a canvas (the SVG exporter's). */
export interface RasterDrawingContext {
  drawRaster(raster: Raster, x: number, y: number, width: number, height: number, smooth: boolean): void;
}

export interface Rect {
  readonly x: number;
  readonly y: number;
  readonly width: number;
  readonly height: number;
}

function isRasterContext(ctx: unknown): ctx is RasterDrawingContext {
  return typeof (ctx as Partial<RasterDrawingContext>).drawRaster === 'function';
}

// Canvases made from a bitmap, kept while the bitmap lives (redraws on hover reuse them).
const canvasOf = new WeakMap<Raster, OffscreenCanvas>();

/** The bitmap on an OffscreenCanvas (browsers and workers have one; Node does not: null). */
function rasterCanvas(raster: Raster): OffscreenCanvas | null {
  if (typeof OffscreenCanvas === 'undefined') return null;
  let canvas = canvasOf.get(raster);
  if (!canvas) {
    canvas = new OffscreenCanvas(raster.width, raster.height);
    const image = new ImageData(new Uint8ClampedArray(raster.rgba), raster.width, raster.height);
    canvas.getContext('2d')!.putImageData(image, 0, 0);
    canvasOf.set(raster, canvas);
  }
  return canvas;
}

/** Stretch the bitmap over rect; smooth=false keeps grid cells crisp (nearest neighbour). */
export function paintRaster(ctx: CanvasRenderingContext2D, raster: Raster, rect: Rect, smooth: boolean): void {
  if (isRasterContext(ctx)) {
    ctx.drawRaster(raster, rect.x, rect.y, rect.width, rect.height, smooth);
    return;
  }
  const canvas = rasterCanvas(raster);
  ctx.save();
  ctx.imageSmoothingEnabled = smooth;
  if (canvas) ctx.drawImage(canvas, rect.x, rect.y, rect.width, rect.height);
  else fillCells(ctx, raster, rect);
  ctx.restore();
}

/** Without an OffscreenCanvas: one rectangle per pixel (small grids only reach here). */
function fillCells(ctx: CanvasRenderingContext2D, raster: Raster, rect: Rect): void {
  const w = rect.width / raster.width, h = rect.height / raster.height;
  for (let row = 0; row < raster.height; row++) {
    for (let col = 0; col < raster.width; col++) {
      const o = (row * raster.width + col) * 4, a = raster.rgba;
      ctx.fillStyle = `rgba(${a[o]}, ${a[o + 1]}, ${a[o + 2]}, ${a[o + 3] / 255})`;
      ctx.fillRect(rect.x + col * w, rect.y + row * h, w, h);
    }
  }
}
