/**
 * The plot modules in real Chromium: a standalone test page (test/e2e/plots-page) built with Vite
 * renders every plot in both themes from fixed synthetic data, and exposes the exporters. Checked
 * here: each canvas is drawn (pixel variance), the colour bar is there with the scale's end colours,
 * keyboard navigation reaches the tooltip, each figure has an accessible name, exported PNGs have
 * exactly the chosen pixel size and the pHYs dpi and are not blank (decoded by the browser), a
 * transparent export is transparent in its margins, and the SVGs parse (DOMParser) and draw.
 * Screenshots go to test-artifacts/screens/plots-*.png for a human to look at.
 */
import { mkdir, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { createServer, type Server } from 'node:http';
import { tmpdir } from 'node:os';
import { dirname, extname, join, normalize, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { build } from 'vite';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POLL } from './harness/poll';
import { layoutFaults, svgLayoutIn } from './harness/svgLayout';
import { CAUTION_SHORT } from '../../src/pipeline/cautions';
import { CONTENT_SECURITY_POLICY } from '../../src/main/rendererProtocol';
import { pngDpi, pngSize } from '../../src/figures/writers/pngChunks';
import { colourTable } from '../../src/figures/parts/colourScale';
import { CHROMIUM_ARGS } from './harness/launch';
import { requireChromium } from '../support/chromiumPath';
import { PLOT_KINDS, type PlotKind } from './plots-page/plotSpecs';
import { presetLabel, presetPixels, SIZE_PRESETS } from '../../src/renderer/src/screens/findings/exportSizes';
import type {} from './plots-page/main';
import { steadyHover } from './harness/steadyActions';

const here = dirname(fileURLToPath(import.meta.url));
const screens = resolve(here, '../../test-artifacts/screens');
const THEMES = ['light', 'dark'] as const;
const MIME: Record<string, string> = { '.html': 'text/html', '.js': 'text/javascript', '.css': 'text/css', '.svg': 'image/svg+xml', '.png': 'image/png' };

let outDir: string, profile: string, server: Server, origin: string, context: BrowserContext, page: Page;
const pageErrors: string[] = [];

async function buildPage(): Promise<void> {
  outDir = await mkdtemp(join(tmpdir(), 'spc-plots-page-'));
  await build({
    root: join(here, 'plots-page'), configFile: false, logLevel: 'warn', base: './', plugins: [react()],
    build: { outDir, emptyOutDir: true, minify: false, chunkSizeWarningLimit: 4000 }, worker: { format: 'es' },
  });
}

/** Static files of the built page under the app's own Content-Security-Policy. */
function serve(): Promise<void> {
  server = createServer(async (request, response) => {
    const path = normalize(decodeURIComponent(new URL(request.url ?? '/', 'http://x').pathname)).replace(/^([/\\])+/, '');
    const file = join(outDir, path || 'index.html');
    if (!file.startsWith(outDir)) return void response.writeHead(400).end();
    try {
      const body = await readFile(file);
      response.writeHead(200, { 'Content-Type': MIME[extname(file)] ?? 'application/octet-stream', 'Content-Security-Policy': CONTENT_SECURITY_POLICY });
      response.end(body);
    } catch {
      response.writeHead(404).end();
    }
  });
  return new Promise((done) => server.listen(0, '127.0.0.1', () => {
    const address = server.address();
    origin = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;
    done();
  }));
}

async function openPage(deviceScaleFactor: number): Promise<{ context: BrowserContext; page: Page }> {
  const ctx = await chromium.launchPersistentContext(await mkdtemp(join(profile, 'p-')), {
    executablePath: requireChromium(), headless: true, args: CHROMIUM_ARGS, viewport: { width: 960, height: 900 }, deviceScaleFactor,
  });
  const p = ctx.pages()[0] ?? (await ctx.newPage());
  p.on('console', (m) => { if (m.type() === 'error') pageErrors.push(m.text()); });
  p.on('pageerror', (e) => pageErrors.push(e.message));
  await p.goto(`${origin}/index.html`);
  await p.waitForFunction(() => window.plotsReady === true);
  return { context: ctx, page: p };
}

const bytesOf = (base64: string) => Uint8Array.from(Buffer.from(base64, 'base64'));

beforeAll(async () => {
  await buildPage();
  await serve();
  profile = await mkdtemp(join(tmpdir(), 'spc-plots-chromium-'));
  ({ context, page } = await openPage(1));
  await mkdir(screens, { recursive: true });
}, 180_000);

afterAll(async () => {
  await context?.close();
  await new Promise((done) => (server ? server.close(done) : done(undefined)));
  await Promise.all([outDir, profile].filter(Boolean).map((d) => rm(d, { recursive: true, force: true })));
});

describe('plots on screen (e2e)', () => {
  it.each(PLOT_KINDS.flatMap((kind) => THEMES.map((theme) => [kind, theme] as const)))('%s (%s): the canvas is drawn, not blank', async (kind, theme) => {
    const stats = await page.evaluate(([k, t]) => window.plotsPage.canvasStats(k, t), [kind, theme] as const);
    expect(stats.width).toBeGreaterThan(600);
    expect(stats.variance, 'luminance variance over the canvas').toBeGreaterThan(50);
    expect(stats.distinctColours).toBeGreaterThan(20);
  });

  it('each figure has an accessible name and a text summary', async () => {
    for (const kind of PLOT_KINDS) {
      const figures = page.locator(`[data-testid="plot-${kind}"]`);
      expect(await figures.count()).toBe(kind === 'slice' ? 3 : 2);
      const first = figures.first();
      expect(await first.getAttribute('role')).toBe('img');
      expect((await first.getAttribute('aria-label'))?.length).toBeGreaterThan(5);
      const summaryId = (await first.getAttribute('aria-describedby'))!;
      expect((await page.locator(`[id="${summaryId}"]`).textContent())?.length).toBeGreaterThan(60);
    }
    await expect.poll(() => page.getByRole('img', { name: 'Value surface: gentle gain' }).count(), POLL).toBe(2);
  });

  it.each(THEMES)('the colour bar stands right of the heat map, its top the maximum colour and its bottom the minimum (%s)', async (theme) => {
    const probe = await page.evaluate((t) => window.plotsPage.colourBarProbe(t), theme);
    expect(probe, 'a colour-bar layout box').not.toBeNull();
    const table = colourTable('viridis');
    probe!.top!.forEach((c, i) => expect(Math.abs(c - table[255][i])).toBeLessThanOrEqual(12));
    probe!.bottom!.forEach((c, i) => expect(Math.abs(c - table[0][i])).toBeLessThanOrEqual(12));
  });

  it('arrow keys move a tooltip over the heat map; Escape hides it', async () => {
    const figure = page.locator('#surface-light figure');
    await figure.focus();
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('ArrowUp');
    // The chart worker draws the tooltip a moment later: retrying reads.
    await expect.poll(() => page.evaluate(() => window.plotsPage.tooltipActive('surface', 'light')), POLL).toBe(1);
    await page.keyboard.press('Escape');
    await expect.poll(() => page.evaluate(() => window.plotsPage.tooltipActive('surface', 'light')), POLL).toBe(0);
  });

  it('screenshots of each plot, light and dark, and at 125 % zoom', async () => {
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    for (const kind of PLOT_KINDS) {
      for (const theme of THEMES) await page.locator(`#${kind}-${theme}`).screenshot({ path: join(screens, `plots-${kind}-${theme}.png`) });
    }
    await page.locator('#slice-bounded-light').screenshot({ path: join(screens, 'plots-slice-bounded-light.png') });
    // A hover tooltip over a never-visited cell, and one on the slice.
    const surface = page.locator('#surface-light canvas'), box = (await surface.boundingBox())!;
    await steadyHover(surface, { x: box.width * 0.8, y: box.height * 0.3 });
    await expect.poll(() => page.evaluate(() => window.plotsPage.tooltipActive('surface', 'light')), POLL).toBe(1);
    await page.locator('#surface-light').screenshot({ path: join(screens, 'plots-surface-light-tooltip.png') });
    const slice = page.locator('#slice-light canvas'), sliceBox = (await slice.boundingBox())!;
    await steadyHover(slice, { x: sliceBox.width * 0.45, y: sliceBox.height * 0.5 });
    await expect.poll(() => page.evaluate(() => window.plotsPage.tooltipActive('slice', 'light')), POLL).toBeGreaterThan(0);
    await page.locator('#slice-light').screenshot({ path: join(screens, 'plots-slice-light-tooltip.png') });
    await page.mouse.move(0, 0);
    const zoomed = await openPage(1.25);
    try {
      for (const kind of ['surface', 'slice'] as const) {
        await zoomed.page.locator(`#${kind}-light`).screenshot({ path: join(screens, `plots-${kind}-light-zoom125.png`) });
      }
    } finally {
      await zoomed.context.close();
    }
  });
});

describe('PNG export (e2e)', () => {
  it('6.5 in × 4 in at 300 dpi: exactly 1950 × 1200 px, pHYs 11811 px/m, drawn, opaque white', async () => {
    const base64 = await page.evaluate(() => window.plotsPage.exportPng('surface', 'light', { widthPx: 1950, heightPx: 1200, dpi: 300, background: 'white' }));
    const png = bytesOf(base64);
    await writeFile(join(screens, 'plots-export-surface.png'), png);
    expect(pngSize(png)).toEqual({ width: 1950, height: 1200 });
    expect(pngDpi(png)!.x).toBeCloseTo(300, 1);
    const decoded = await page.evaluate((b) => window.plotsPage.decodePng(b), base64);
    expect([decoded.width, decoded.height]).toEqual([1950, 1200]);
    expect(decoded.distinctColours, 'colours in the decoded image').toBeGreaterThan(200);
    expect(decoded.cornerAlpha).toEqual([255, 255, 255, 255]);
  });

  it.each(PLOT_KINDS)('%s: the chosen pixel size and dpi, not blank', async (kind: PlotKind) => {
    const options = { widthPx: 1300, heightPx: 820, dpi: 200, background: 'white' as const };
    const base64 = await page.evaluate(([k, o]) => window.plotsPage.exportPng(k, 'dark', o), [kind, options] as const);
    const png = bytesOf(base64);
    if (kind !== 'surface') await writeFile(join(screens, `plots-export-${kind}.png`), png);
    expect(pngSize(png)).toEqual({ width: 1300, height: 820 });
    expect(pngDpi(png)!.x).toBeCloseTo(200, 1);
    const decoded = await page.evaluate((b) => window.plotsPage.decodePng(b), base64);
    expect(decoded.variance).toBeGreaterThan(20);
    expect(decoded.distinctColours).toBeGreaterThan(20);
  });

  it('a transparent background has alpha 0 in the margins', async () => {
    const base64 = await page.evaluate(() => window.plotsPage.exportPng('surface', 'dark', { widthPx: 800, heightPx: 520, dpi: 96, background: 'transparent' }));
    await writeFile(join(screens, 'plots-export-surface-transparent.png'), bytesOf(base64));
    const decoded = await page.evaluate((b) => window.plotsPage.decodePng(b), base64);
    expect(decoded.cornerAlpha).toEqual([0, 0, 0, 0]);
    expect(decoded.distinctColours).toBeGreaterThan(50);
  });
});

// Every size the app's export panel offers (its presets, src/renderer/src/screens/findings/exportSizes.ts),
// the old half-width figure, and a small custom size at screen resolution.
const LAYOUT_SIZES = [
  ...SIZE_PRESETS.map((p) => ({ name: presetLabel(p), ...presetPixels(p) })),
  { name: 'half-width 3.25 × 2.5 in at 300 dpi', widthPx: 975, heightPx: 750, dpi: 300 },
  { name: 'small 560 × 400 px at 96 dpi', widthPx: 560, heightPx: 400, dpi: 96 },
];

/** Text of the kinds the check must see in each export: the title, the axis titles and the caution. */
const MUST_SEE: Record<PlotKind, RegExp[]> = Object.fromEntries(PLOT_KINDS.map((k) => [k, [/Advisory offline estimate/]])) as Record<PlotKind, RegExp[]>;
MUST_SEE.surface.push(/tank level/, /inflow/);
MUST_SEE.retuneMap.push(/proportional gain/, /integral time/, /best supported point/, /supported by the logs/);

describe('no text collides or is clipped in an export, at every export size (e2e, text boxes as Chromium lays out the SVG)', () => {
  it.each(PLOT_KINDS.flatMap((kind) => LAYOUT_SIZES.map((size) => [kind, size.name, size] as const)))('%s at %s', async (kind, _name, size) => {
    for (const theme of THEMES) {
      // A transparent background keeps the plot's theme (a white one is always light): both are laid out.
      const options = { widthPx: size.widthPx, heightPx: size.heightPx, dpi: size.dpi, background: theme === 'light' ? 'white' as const : 'transparent' as const };
      const svg = (await page.evaluate(([k, t, o]) => window.plotsPage.exportSvg(k, t, o), [kind, theme, options] as const))!;
      const laid = await svgLayoutIn(page, svg, size.widthPx, size.heightPx);
      expect(laid.texts.length).toBeGreaterThan(5);
      const all = laid.texts.map((t) => t.text).join(' ');
      for (const words of MUST_SEE[kind]) expect(all, `${kind} ${theme}`).toMatch(words);
      expect(layoutFaults(laid), `${kind} ${theme}`).toEqual([]);
    }
  });
});

describe('SVG export (e2e)', () => {
  it.each(PLOT_KINDS)('%s: DOMParser accepts it, with its title, labels and caption, and it draws', async (kind: PlotKind) => {
    const options = { widthPx: 960, heightPx: 600, dpi: 96, background: 'white' as const };
    const svg = (await page.evaluate(([k, o]) => window.plotsPage.exportSvg(k, 'light', o), [kind, options] as const))!;
    await writeFile(join(screens, `plots-export-${kind}.svg`), svg);
    const parsed = await page.evaluate((s) => window.plotsPage.parseSvg(s), svg);
    expect(parsed.error).toBeNull();
    expect(parsed.root).toBe('svg');
    expect(parsed.title?.length).toBeGreaterThan(5);
    const text = parsed.texts.join('\n');
    expect(text).toContain(CAUTION_SHORT);
    if (kind === 'surface') for (const label of ['tank level (m)', 'inflow (m³/h)', '(s), discounted cost (kWh)']) expect(text).toContain(label);
    const drawn = await page.evaluate(([s, w, h]) => window.plotsPage.renderSvg(s, w, h), [svg, 960, 600] as const);
    expect(drawn.variance).toBeGreaterThan(20);
  });

  it('the page logged no errors', () => {
    expect(pageErrors).toEqual([]);
  });
});
