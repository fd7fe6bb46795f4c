/**
 * What a person sees of an element, as numbers: a screenshot of it (the compositor's pixels, so a
 * chart drawn by a worker counts the same as one drawn on the page), decoded by the page's own
 * image decoder, with the luminance variance, the number of distinct colours and the share of
 * pixels that differ from the top-left one (the background).
 */
import type { Locator, Page } from 'playwright-core';

export interface PixelStats {
  width: number;
  height: number;
  variance: number;
  distinctColours: number;
  /** Share of pixels whose colour differs from the top-left pixel's. */
  drawnShare: number;
}

export async function drawnPixels(page: Page, element: Locator): Promise<PixelStats> {
  const base64 = (await element.screenshot()).toString('base64');
  return page.evaluate(async (b64) => {
    const bytes = Uint8Array.from(atob(b64), (c) => c.charCodeAt(0));
    const bitmap = await createImageBitmap(new Blob([bytes], { type: 'image/png' }));
    const canvas = new OffscreenCanvas(bitmap.width, bitmap.height), ctx = canvas.getContext('2d')!;
    ctx.drawImage(bitmap, 0, 0);
    const data = ctx.getImageData(0, 0, bitmap.width, bitmap.height).data, n = data.length / 4;
    let sum = 0, squares = 0, differing = 0;
    const colours = new Set<number>();
    for (let i = 0; i < data.length; i += 4) {
      const y = 0.2126 * data[i] + 0.7152 * data[i + 1] + 0.0722 * data[i + 2];
      sum += y;
      squares += y * y;
      colours.add((data[i] << 16) | (data[i + 1] << 8) | data[i + 2]);
      if (data[i] !== data[0] || data[i + 1] !== data[1] || data[i + 2] !== data[2]) differing++;
    }
    return { width: bitmap.width, height: bitmap.height, variance: squares / n - (sum / n) ** 2, distinctColours: colours.size, drawnShare: differing / n };
  }, base64);
}
