/**
 * A screenshot of one element (a Findings card) with its charts in it. In an element shot a chart the
 * chart worker draws on its OffscreenCanvas came out blank now and then although it was drawn and shows
 * on screen: every chart of the heating-loop sample's first pass at 1280 × 800 (values, retune map,
 * surface, slice, convergence), the two-valve values card; the same card shot again a moment later, or
 * the window's own picture, shows it, and the worker had no drawing pending (a capture ahead of the
 * compositor, not a drawing the app missed). So the card is scrolled into view and shot after two
 * frames, each drawn chart's part of the picture is checked for ink, the card is shot again where one
 * is blank, and one still blank is returned as a fault, not left for the eye to miss.
 */
import type { Locator, Page } from 'playwright-core';

/** Pixels of the chart's box in the shot that differ from its top-left pixel, as a share (0 = blank). */
async function inkShares(app: Page, png: Buffer, boxes: { x: number; y: number; width: number; height: number }[]): Promise<number[]> {
  if (boxes.length === 0) return [];
  // A blank page of its own: the app's page does not load data: images (its Content-Security-Policy).
  const page = await app.context().newPage();
  try {
    return await measure(page, png, boxes);
  } finally {
    await page.close();
  }
}

function measure(page: Page, png: Buffer, boxes: { x: number; y: number; width: number; height: number }[]): Promise<number[]> {
  return page.evaluate(async ({ data, boxes }) => {
    const image = new Image();
    image.src = `data:image/png;base64,${data}`;
    await image.decode();
    const canvas = new OffscreenCanvas(image.width, image.height), ctx = canvas.getContext('2d')!;
    ctx.drawImage(image, 0, 0);
    return boxes.map((b) => {
      const w = Math.max(1, Math.floor(b.width)), h = Math.max(1, Math.floor(b.height));
      const px = ctx.getImageData(Math.floor(b.x), Math.floor(b.y), w, h).data;
      let inked = 0;
      for (let k = 0; k < px.length; k += 4) if (Math.abs(px[k] - px[0]) + Math.abs(px[k + 1] - px[1]) + Math.abs(px[k + 2] - px[2]) > 30) inked++;
      return inked / (w * h);
    });
  }, { data: png.toString('base64'), boxes });
}

const nextFrames = (page: Page) => page.evaluate(() => new Promise<void>((done) => requestAnimationFrame(() => requestAnimationFrame(() => done()))));

/** The boxes of the element's drawn charts, relative to the element. */
async function chartBoxes(element: Locator): Promise<{ x: number; y: number; width: number; height: number }[]> {
  const at = (await element.boundingBox())!;
  const boxes = await Promise.all((await element.locator('figure[data-chart-state="drawn"]').all()).map((f) => f.boundingBox()));
  return boxes.filter((b) => b !== null && b.width > 0 && b.height > 0).map((b) => ({ x: b!.x - at.x, y: b!.y - at.y, width: b!.width, height: b!.height }));
}

/**
 * Shoot `element` to `path` whole (the sticky bars that `unstick` names, a rule "selectors { … }",
 * unstuck; the window grown to hold a tall card). A chart blank in
 * the picture is shot again (up to twice, a moment apart): a capture that ran ahead of the compositor
 * shows it the next time, a chart the page failed to draw stays blank and is returned as a fault.
 */
export async function shootSection(page: Page, element: Locator, path: string, unstick: string): Promise<string[]> {
  // The sticky bars are unstuck before the card is measured: given as the shot's style, they moved the
  // card down after Playwright had measured it, and its last rows were cut off the picture.
  const selectors = unstick.replace(/\{[^}]*\}/, '').trim();
  await page.evaluate((s) => document.querySelectorAll<HTMLElement>(s).forEach((e) => e.style.setProperty('position', 'static', 'important')), selectors);
  // A card taller than the window is shot "beyond the viewport", where its charts stayed blank in three
  // shots in a row (heating-loop, 1280 × 800, dark): the window is grown to hold it for the shot.
  const viewport = page.viewportSize()!, box = await element.boundingBox();
  const grow = box !== null && box.height + 40 > viewport.height;
  if (grow) await page.setViewportSize({ width: viewport.width, height: Math.ceil(box!.height) + 40 });
  try {
    await element.scrollIntoViewIfNeeded();
    // Grown by the card's height, the window can still end above the card's foot: scrolled only "if needed",
    // the card sat below the sticky bars' old place and its last 80 px went unpainted (the comparison card,
    // heating-loop, 1280 × 800, both themes: the ranking's last line cut, review31). Its top is brought to
    // the window's, and the window grown again where the page cannot scroll that far.
    if (grow) await fitInWindow(page, element);
    await page.waitForFunction((e) => [...e!.querySelectorAll('figure[data-chart-state]')].every((f) => f.getAttribute('data-chart-state') !== 'waiting'),
      await element.elementHandle(), { timeout: 30_000 }).catch(() => undefined);
    let blank: number[] = [];
    for (let attempt = 0; attempt < 3; attempt++) {
      if (attempt > 0) await page.waitForTimeout(500);
      await nextFrames(page);
      const png = await element.screenshot({ path });
      blank = (await inkShares(page, png, await chartBoxes(element))).flatMap((s, i) => (s < 0.005 ? [i + 1] : []));
      if (blank.length === 0) {
        if (attempt > 0) console.log(`${path}: a chart blank in shot 1 was drawn in shot ${attempt + 1} (a capture ahead of the compositor)`);
        break;
      }
    }
    return blank.map((i) => `${path}: chart ${i} of the card is blank in the shot, three times`);
  } finally {
    if (grow) await page.setViewportSize(viewport);
    await page.evaluate((s) => document.querySelectorAll<HTMLElement>(s).forEach((e) => e.style.removeProperty('position')), selectors);
  }
}

/** Scroll the card's top to the window's top, and grow the window until the card's foot is inside it. */
async function fitInWindow(page: Page, element: Locator): Promise<void> {
  for (let k = 0; k < 3; k++) {
    const bottom = await element.evaluate((e) => {
      e.scrollIntoView({ block: 'start' });
      return e.getBoundingClientRect().bottom;
    });
    const viewport = page.viewportSize()!;
    if (bottom <= viewport.height) return;
    await page.setViewportSize({ width: viewport.width, height: Math.ceil(bottom) + 8 });
  }
}
