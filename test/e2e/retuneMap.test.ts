/**
 * The retune map in the app, on the heating-loop sample (one 10×10 map of proportional gain ×
 * integral time): after a run, Findings offers "Compute the retune map"; Cancel stops it through the
 * shared stop flag and the run survives (the map can be computed again at once, without a rerun);
 * the map is drawn with its headline, notes and table, and exports as PNG, and as SVG at every size
 * the export panel offers with no text overlapping or clipped (the size list itself not clipped);
 * the report written from the app draws the map above its table, saves as PDF, and Ctrl+P prints it;
 * the map is kept with the saved project and shows again on reopening without recomputing, marked
 * out of date once a candidate changes. Screenshots of the panel, its export settings and the kept
 * map in both themes at 1280 × 800 and 1920 × 1080 go to test-artifacts/screens/.
 */
import { readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POLL } from './harness/poll';
import { openAllFindings } from './harness/findingsSections';
import { drawnPixels } from './harness/drawnPixels';
import { openSample } from './harness/openSample';
import { launchApp, type LaunchedApp } from './harness/launch';
import { decodedPngContent, goToStep, pngSize, setTheme as switchTheme } from '../renderer/e2e/appSteps';
import { layoutFaults, selectRoom, svgLayoutIn } from './harness/svgLayout';
import { UNSTICK } from './harness/unstick';
import { shootSection } from './harness/sectionShot';
import { presetPixels, SIZE_PRESETS } from '../../src/renderer/src/screens/findings/exportSizes';
import { steadyClick, steadyFill, steadySelect } from './harness/steadyActions';

const SCREENS = resolve(__dirname, '../../test-artifacts/screens');

describe('the retune map in the app (e2e)', () => {
  let app: LaunchedApp, projectPath = '';
  const SIZES = [{ width: 1280, height: 800 }, { width: 1920, height: 1080 }];
  /** Switch the theme and wait until the map is redrawn in it: its figure's background changes first, then the worker reports the drawing. */
  const setTheme = async (theme: string) => {
    const { page } = app, figure = page.getByTestId('plot-retuneMap');
    const background = () => figure.evaluate((f) => (f as HTMLElement).style.background);
    const before = await background();
    if ((await page.evaluate(() => document.documentElement.dataset.theme)) === theme) return;
    await switchTheme(page, theme);
    await expect.poll(background, POLL).not.toBe(before);
  };
  beforeAll(async () => {
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('computes the map after a run, with progress and a cancel that keeps the run', async () => {
    const { page } = app;
    projectPath = await openSample(app, 'heating-loop');
    await goToStep(page, 'run');
    await steadyClick(page.getByTestId('run-evaluation'));
    await page.getByTestId('run-finished').waitFor({ timeout: 180_000 });
    await goToStep(page, 'findings');
    await openAllFindings(page); // the convergence panel's export is used below; the evidence starts folded
    const panel = page.getByTestId('retune-map');
    await panel.waitFor({ timeout: 30_000 });
    await steadyClick(page.getByTestId('compute-retune-map'));
    await page.getByTestId('retune-map-progress').waitFor({ timeout: 30_000 });
    await expect.poll(() => page.getByTestId('retune-map-progress').innerText(), { ...POLL, timeout: 120_000 }).toMatch(/Point \d+ of 100/);
    await steadyClick(page.getByTestId('cancel-retune-map'));
    await page.getByTestId('retune-map-cancelled').waitFor({ timeout: 60_000 });
    // The run was kept: the map computes again without a new run.
    await steadyClick(page.getByTestId('compute-retune-map'));
    await page.getByTestId('retune-map-headline').waitFor({ timeout: 240_000 });
    const headline = await page.getByTestId('retune-map-headline').innerText();
    expect(headline).toMatch(/^Best supported point: proportional gain .+ = [\d.,]+, integral time .+ = [\d.,]+, J [\d.]+, [\d.]+\s% interval \[[\d.−]+, [\d.]+\]\. Present controller: J [\d.]+\.$/);
    expect(await panel.innerText()).not.toMatch(/form\.loops|proportionalGain|integralTimeSeconds/);
    const figure = page.getByTestId('plot-retuneMap');
    await expect.poll(() => figure.getAttribute('data-chart-state'), POLL).toBe('drawn');
    expect((await drawnPixels(page, figure)).drawnShare).toBeGreaterThan(0.3);
    await expect.poll(() => page.getByTestId('retune-map-table').locator('tbody tr').count(), POLL).toBe(10);
    // One precision on the screen: the best point's J in the table reads as in the headline (its interval's decimals; JCGM 100 §7.2.2, common practice).
    const bestCell = (await page.getByTestId('retune-map-table').locator('td.map-best').textContent() ?? '').replace(/ [*†]$/, '');
    expect(bestCell).toBe(/, J ([\d.]+), [\d.]+\s% interval \[/.exec(headline)![1]);
  });

  it('exports the map as PNG with the caption', async () => {
    const { page, harness } = app;
    const target = join(harness.workFolder, 'retune-map.png');
    harness.dialogs.nextExport = target;
    await steadyClick(page.getByTestId('export-retuneMap').locator('summary'));
    await steadyClick(page.getByTestId('export-png-retuneMap'));
    await page.getByTestId('export-status-retuneMap').getByText('Saved').waitFor({ timeout: 30_000 });
    const bytes = new Uint8Array(await readFile(target));
    expect(pngSize(bytes)).toEqual({ width: 1950, height: 1200 });
    expect((await decodedPngContent(page, bytes)).colours).toBeGreaterThan(20);
    await steadyClick(page.getByTestId('export-retuneMap').locator('summary'));
  });

  it('exports the map as SVG at every size offered, no text overlapping or clipped; the size list is not clipped', async () => {
    const { page, harness } = app;
    const details = page.getByTestId('export-retuneMap'), select = page.getByTestId('export-size-retuneMap');
    await steadyClick(details.locator('summary'));
    // The size list in the full-width map panel and in a half-width one (the convergence panel's) at both window sizes.
    const narrow = page.getByTestId('export-convergence');
    await steadyClick(narrow.locator('summary'));
    for (const size of SIZES) {
      await page.setViewportSize(size);
      for (const list of [select, page.getByTestId('export-size-convergence')]) {
        const room = await selectRoom(list);
        expect(room.longest, `${room.longestText} at ${size.width} px`).toBeLessThanOrEqual(room.room);
      }
    }
    await steadyClick(narrow.locator('summary'));
    await page.setViewportSize(SIZES[0]);
    for (const preset of SIZE_PRESETS) {
      const px = presetPixels(preset), target = join(harness.workFolder, `retune-map-${preset.id}.svg`);
      await steadySelect(select, preset.id);
      await expect.poll(() => page.getByTestId('export-size-text-retuneMap').innerText(), POLL).toContain(`${px.widthPx} × ${px.heightPx} px at ${px.dpi} dpi: prints at`);
      harness.dialogs.nextExport = target;
      await steadyClick(page.getByTestId('export-svg-retuneMap'));
      await expect.poll(() => page.getByTestId('export-status-retuneMap').innerText(), { ...POLL, timeout: 30_000 }).toContain(target);
      const laid = await svgLayoutIn(page, await readFile(target, 'utf8'), px.widthPx, px.heightPx);
      const words = laid.texts.map((t) => t.text).join(' ');
      for (const expected of ['proportional gain', 'integral time', 'supported by the logs', 'Advisory offline estimate']) expect(words, preset.id).toContain(expected);
      // The integral time (300 … 6,000 s, 10 points, log) in minutes at round ticks, by hand (figures/parts/tuningAxis.ts; /work/notes/axis38-rule.md).
      const texts = laid.texts.map((t) => t.text);
      expect(texts, preset.id).toContain(' (min)');
      expect(texts, preset.id).toEqual(expect.arrayContaining(['5', '10', '20', '50', '100'])); // '5' only a time: the gains run 10 … 100
      for (const centre of ['300', '1,136', '4,301', '6,000']) expect(texts, preset.id).not.toContain(centre); // the cell centres in seconds, as before
      expect(layoutFaults(laid), preset.id).toEqual([]);
    }
    await steadySelect(select, 'report');
    await steadyClick(details.locator('summary'));
  });

  it('writes the report with the map drawn above its table, as HTML and as PDF; Ctrl+P prints it', async () => {
    const { page, harness } = app;
    await expect.poll(() => page.getByTestId('write-report').isEnabled(), { ...POLL, timeout: 240_000 }).toBe(true);
    const htmlPath = join(harness.workFolder, 'heating-report.html'), pdfPath = join(harness.workFolder, 'heating-report.pdf');
    harness.dialogs.nextExport = htmlPath;
    await steadyClick(page.getByTestId('write-report'));
    await expect.poll(() => page.getByTestId('report-status').innerText(), { ...POLL, timeout: 60_000 }).toContain(htmlPath);
    const html = await readFile(htmlPath, 'utf8');
    expect(html).toMatch(/<figure id="fig-retune-map-0"[^>]*><svg[^>]*aria-label="Heat map of J/);
    expect(html.indexOf('id="fig-retune-map-0"')).toBeLessThan(html.indexOf('class="retune-grid"'));
    expect(html.indexOf('id="read-first"')).toBeLessThan(html.indexOf('id="job"'));
    expect(html).toContain('local codes and licensed practice');
    // The report as a reader sees it (one look: a document for print, light in both app themes), at both window sizes.
    const reader = await app.context.newPage();
    await reader.setContent(html, { waitUntil: 'load' }); // no request: the harness blocks every URL but the app's
    for (const size of SIZES) {
      await reader.setViewportSize(size);
      await reader.screenshot({ path: join(SCREENS, `app-report-${size.width}.png`) });
      await reader.locator('#retune-maps').screenshot({ path: join(SCREENS, `app-report-retune-map-${size.width}.png`) });
    }
    await reader.close();
    harness.dialogs.nextExport = pdfPath;
    await steadyClick(page.getByTestId('report-pdf'));
    await expect.poll(() => page.getByTestId('report-status').innerText(), { ...POLL, timeout: 120_000 }).toContain(pdfPath);
    expect((await readFile(pdfPath)).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    await page.keyboard.press('Control+p');
    await expect.poll(() => harness.printer.printed.length, { ...POLL, timeout: 60_000 }).toBe(1);
    expect(harness.printer.printed[0]).toContain('id="fig-retune-map-0"');
    await expect.poll(() => page.getByTestId('notice').innerText(), POLL).toContain('Sent the report to the printer');
    await page.getByTestId('report-status').scrollIntoViewIfNeeded();
    await app.screenshot('report-panel-1280');
  });

  it('screens of the panel in both themes at 1280 × 800 and 1920 × 1080', async () => {
    const { page } = app;
    const panel = page.getByTestId('retune-map'), figure = page.getByTestId('plot-retuneMap');
    for (const size of [{ width: 1280, height: 800 }, { width: 1920, height: 1080 }]) {
      await page.setViewportSize(size);
      for (const theme of ['light', 'dark']) {
        await switchTheme(page, theme);
        await expect.poll(() => figure.getAttribute('data-chart-state'), POLL).toBe('drawn');
        await panel.scrollIntoViewIfNeeded();
        // Drawn in this theme, not the last one's "drawn" read before the redraw began: what a person sees.
        await expect.poll(() => drawnPixels(page, figure).then((p) => p.drawnShare), POLL).toBeGreaterThan(0.3);
        // Shot with its chart checked for ink (an element shot can run ahead of the compositor: the 1280 light shot came out blank once).
        expect(await shootSection(page, panel, join(SCREENS, `retune-map-${size.width}-${theme}.png`), UNSTICK)).toEqual([]);
        const exportPanel = page.getByTestId('export-retuneMap');
        await steadyClick(exportPanel.locator('summary'));
        await exportPanel.screenshot({ path: join(SCREENS, `export-panel-${size.width}-${theme}.png`), style: UNSTICK });
        await steadyClick(exportPanel.locator('summary'));
        if (size.width === 1280 && theme === 'light') {
          await steadyClick(page.getByTestId('retune-map-table-details').locator('summary'));
          await page.getByTestId('retune-map-table-details').screenshot({ path: join(SCREENS, 'retune-map-table.png'), style: UNSTICK });
          await steadyClick(page.getByTestId('retune-map-table-details').locator('summary'));
        }
        await page.screenshot({ path: join(SCREENS, `retune-map-${size.width}-${theme}-window.png`) });
      }
    }
    await page.setViewportSize({ width: 1280, height: 800 });
  });

  it('keeps the map with the saved project: reopened it shows without recomputing; a changed candidate marks it out of date', async () => {
    const { page, harness } = app;
    const headline = await page.getByTestId('retune-map-headline').innerText();
    await harness.sendMenuCommand(page, 'save-project');
    await harness.waitForDocumentState((s) => !s.dirty);
    const saved = JSON.parse(await readFile(projectPath, 'utf8'));
    expect(saved.results.retuneMaps).toHaveLength(1);
    expect(saved.results.retuneMaps[0].points).toHaveLength(100);
    await steadyClick(page.getByTestId('new-project'));
    harness.dialogs.nextOpenProject = projectPath;
    await steadyClick(page.getByTestId('open-project'));
    await page.getByTestId('import-summary').waitFor({ timeout: 60_000 });
    await goToStep(page, 'findings');
    await expect.poll(() => page.getByTestId('kept-retune-map').innerText(), POLL).toContain('needs no recomputing');
    await expect.poll(() => page.getByTestId('retune-map-headline').innerText(), POLL).toBe(headline);
    const figure = page.getByTestId('plot-retuneMap');
    await expect.poll(() => figure.getAttribute('data-chart-state'), POLL).toBe('drawn');
    await expect.poll(() => page.getByTestId('retune-map-table').locator('tbody tr').count(), POLL).toBe(10);
    await goToStep(page, 'candidates');
    const dither = page.getByLabel(/^Dither, standard deviation/).first();
    await steadyFill(dither, String(Number(await dither.inputValue()) * 2));
    await dither.blur();
    await goToStep(page, 'findings');
    await expect.poll(() => page.getByTestId('kept-retune-map').innerText(), POLL).toContain('Out of date');
    const panel = page.getByTestId('retune-map');
    for (const size of SIZES) {
      await page.setViewportSize(size);
      for (const theme of ['light', 'dark']) {
        await setTheme(theme);
        await expect.poll(() => figure.getAttribute('data-chart-state'), POLL).toBe('drawn');
        await panel.scrollIntoViewIfNeeded();
        await expect.poll(async () => (await drawnPixels(page, figure)).drawnShare, POLL).toBeGreaterThan(0.3);
        await page.screenshot({ path: join(SCREENS, `retune-map-kept-out-of-date-${size.width}-${theme}.png`) });
      }
    }
    await setTheme('light');
    await page.setViewportSize(SIZES[0]);
  });

  it('logged no console errors', () => {
    expect(app.consoleErrors).toEqual([]);
  });
});
