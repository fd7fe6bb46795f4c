/**
 * The heat map and colour-bar bitmaps. The surface's row j is y[j] with y increasing upward, while
 * a bitmap's row 0 is at the top, so bitmap row r shows surface row ny−1−r.
 */
import type { ColourScale, Rgb } from './colourScale';
import { COLOUR_TABLE_SIZE } from './colourScale';
import type { Raster } from './raster';

/** values: ny×nx row-major; non-finite cells get noValue. */
export function surfaceRaster(values: Float64Array, nx: number, ny: number, scale: ColourScale, noValue: Rgb): Raster {
  const rgba = new Uint8ClampedArray(nx * ny * 4);
  for (let iy = 0; iy < ny; iy++) {
    const row = ny - 1 - iy;
    for (let ix = 0; ix < nx; ix++) {
      const [r, g, b] = scale.colour(values[iy * nx + ix]) ?? noValue;
      const o = (row * nx + ix) * 4;
      rgba[o] = r;
      rgba[o + 1] = g;
      rgba[o + 2] = b;
      rgba[o + 3] = 255;
    }
  }
  return { width: nx, height: ny, rgba };
}

/** 1×256 ramp, the top pixel the colour of the domain's maximum. */
export function colourBarRaster(scale: ColourScale): Raster {
  const n = COLOUR_TABLE_SIZE, rgba = new Uint8ClampedArray(n * 4);
  for (let row = 0; row < n; row++) {
    const [r, g, b] = scale.colourAt(1 - row / (n - 1));
    rgba.set([r, g, b, 255], row * 4);
  }
  return { width: 1, height: n, rgba };
}
