/**
 * Measure the Findings screen after a run with the assessment and a retune map (heating-loop
 * sample): document.scrollHeight at 1280×800 and 1920×1080 in both themes.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POLL } from './harness/poll';
import { openSample } from './harness/openSample';
import { launchApp, type LaunchedApp } from './harness/launch';
import { goToStep } from '../renderer/e2e/appSteps';

describe('Findings layout (e2e)', () => {
  let app: LaunchedApp;
  beforeAll(async () => {
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('measures', async () => {
    const { page } = app;
    await openSample(app, 'heating-loop');
    await goToStep(page, 'run');
    await page.getByTestId('run-evaluation').click();
    await page.getByTestId('run-finished').waitFor({ timeout: 180_000 });
    await goToStep(page, 'findings');
    await page.getByTestId('compute-retune-map').click();
    await page.getByTestId('retune-map-headline').waitFor({ timeout: 240_000 });
    await page.getByTestId('answer-rule').waitFor({ timeout: 240_000 });
    await expect.poll(() => page.getByTestId('write-report').isEnabled(), { ...POLL, timeout: 240_000 }).toBe(true);
    for (const size of [{ width: 1280, height: 800 }, { width: 1920, height: 1080 }]) {
      await page.setViewportSize(size);
      for (const theme of ['light', 'dark']) {
        if ((await page.evaluate(() => document.documentElement.dataset.theme)) !== theme) await page.getByTestId('toggle-theme').click();
        await page.waitForTimeout(500);
        const h = await page.evaluate(() => document.documentElement.scrollHeight);
        console.log(`MEASURE ${size.width}x${size.height} ${theme}: scrollHeight ${h} px = ${(h / size.height).toFixed(2)} screens`);
        await page.screenshot({ path: `test-artifacts/screens/findings-before-${size.width}-${theme}.png`, fullPage: true });
      }
    }
  });
});
