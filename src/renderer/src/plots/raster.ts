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
const canvasOf = new WeakMap<Raster, HTMLCanvasElement>();

function rasterCanvas(raster: Raster): HTMLCanvasElement {
  let canvas = canvasOf.get(raster);
  if (!canvas) {
    canvas = document.createElement('canvas');
    canvas.width = raster.width;
    canvas.height = raster.height;
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
  ctx.save();
  ctx.imageSmoothingEnabled = smooth;
  ctx.drawImage(rasterCanvas(raster), rect.x, rect.y, rect.width, rect.height);
  ctx.restore();
}
