/**
 * The retune map in the app, on the heating-loop sample (one 10×10 map of proportional gain ×
 * integral time): after a run, Findings offers "Compute the retune map"; Cancel stops it through the
 * shared stop flag and the run survives (the map can be computed again at once, without a rerun);
 * the map is drawn with its headline, notes and table, and exports as PNG. Screenshots of the panel
 * in both themes at 1280 × 800 and 1920 × 1080 go to test-artifacts/screens/.
 */
import { readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POLL } from './harness/poll';
import { drawnPixels } from './harness/drawnPixels';
import { openSample } from './harness/openSample';
import { launchApp, type LaunchedApp } from './harness/launch';
import { decodedPngContent, goToStep, pngSize } from '../renderer/e2e/appSteps';

const SCREENS = resolve(__dirname, '../../test-artifacts/screens');

describe('the retune map in the app (e2e)', () => {
  let app: LaunchedApp;
  beforeAll(async () => {
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('computes the map after a run, with progress and a cancel that keeps the run', async () => {
    const { page } = app;
    await openSample(app, 'heating-loop');
    await goToStep(page, 'run');
    await page.getByTestId('run-evaluation').click();
    await page.getByTestId('run-finished').waitFor({ timeout: 180_000 });
    await goToStep(page, 'findings');
    const panel = page.getByTestId('retune-map');
    await panel.waitFor({ timeout: 30_000 });
    await page.getByTestId('compute-retune-map').click();
    await page.getByTestId('retune-map-progress').waitFor({ timeout: 30_000 });
    await expect.poll(() => page.getByTestId('retune-map-progress').innerText(), { ...POLL, timeout: 120_000 }).toMatch(/Point \d+ of 100/);
    await page.getByTestId('cancel-retune-map').click();
    await page.getByTestId('retune-map-cancelled').waitFor({ timeout: 60_000 });
    // The run was kept: the map computes again without a new run.
    await page.getByTestId('compute-retune-map').click();
    await page.getByTestId('retune-map-headline').waitFor({ timeout: 240_000 });
    const headline = await page.getByTestId('retune-map-headline').innerText();
    expect(headline).toMatch(/^Best supported point: proportional gain .+ = [\d.,]+, integral time .+ = [\d.,]+, J [\d.]+ \[[\d.−]+, [\d.]+\]\. Present controller: J [\d.]+\.$/);
    expect(await panel.innerText()).not.toMatch(/form\.loops|proportionalGain|integralTimeSeconds/);
    const figure = page.getByTestId('plot-retuneMap');
    await expect.poll(() => figure.getAttribute('data-chart-state'), POLL).toBe('drawn');
    expect((await drawnPixels(page, figure)).drawnShare).toBeGreaterThan(0.3);
    await expect.poll(() => page.getByTestId('retune-map-table').locator('tbody tr').count(), POLL).toBe(10);
  });

  it('exports the map as PNG with the caption', async () => {
    const { page, harness } = app;
    const target = join(harness.workFolder, 'retune-map.png');
    harness.dialogs.nextExport = target;
    await page.getByTestId('export-retuneMap').locator('summary').click();
    await page.getByTestId('export-png-retuneMap').click();
    await page.getByTestId('export-status-retuneMap').getByText('Saved').waitFor({ timeout: 30_000 });
    const bytes = new Uint8Array(await readFile(target));
    expect(pngSize(bytes)).toEqual({ width: 1950, height: 1200 });
    expect((await decodedPngContent(page, bytes)).colours).toBeGreaterThan(20);
    await page.getByTestId('export-retuneMap').locator('summary').click();
  });

  it('screens of the panel in both themes at 1280 × 800 and 1920 × 1080', async () => {
    const { page } = app;
    const panel = page.getByTestId('retune-map'), figure = page.getByTestId('plot-retuneMap');
    for (const size of [{ width: 1280, height: 800 }, { width: 1920, height: 1080 }]) {
      await page.setViewportSize(size);
      for (const theme of ['light', 'dark']) {
        if ((await page.evaluate(() => document.documentElement.dataset.theme)) !== theme) await page.getByTestId('toggle-theme').click();
        await expect.poll(() => figure.getAttribute('data-chart-state'), POLL).toBe('drawn');
        await panel.scrollIntoViewIfNeeded();
        await panel.screenshot({ path: join(SCREENS, `retune-map-${size.width}-${theme}.png`) });
        if (size.width === 1280 && theme === 'light') {
          await page.getByTestId('retune-map-table-details').locator('summary').click();
          await page.getByTestId('retune-map-table-details').screenshot({ path: join(SCREENS, 'retune-map-table.png') });
          await page.getByTestId('retune-map-table-details').locator('summary').click();
        }
        await page.screenshot({ path: join(SCREENS, `retune-map-${size.width}-${theme}-window.png`) });
      }
    }
    await page.setViewportSize({ width: 1280, height: 800 });
  });

  it('logged no console errors', () => {
    expect(app.consoleErrors).toEqual([]);
  });
});
