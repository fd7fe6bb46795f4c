/**
 * What a reward's definition guarantees, on the Plant log step (e2e, the built renderer with the real
 * main-process modules behind it). The heating-loop sample declares its cost never below 0 (a square
 * plus a share of delivered heat, 0 … 1: sample-projects/heating-loop/README.md); the field shows it,
 * and raising the floor to 1 makes the rows that cost less than 1 rows that cannot be used, named by
 * line and column. The historian sample's cost is a formula, (T − 21)² + 0.1·(20^(u/100) − 1)/19,
 * whose floor −0.1/19 = −0.0052631… is shown beside it, rounded outward to −0.005264 (20^x > 0: elementary algebra). On the invented
 * two-valve log (test/fixtures/screens/twoValveBlend.ts, its cost declared never below 0) the findings
 * carry the range to report, cut at 0 with its sentence, into the answer table where a candidate is not
 * settled. Screenshots in both themes at 1280×800 and 1920×1080 go to test-artifacts/screens/.
 */
import { resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openProjectFile, openSample } from './harness/openSample';
import { POLL } from './harness/poll';
import { launchApp, type LaunchedApp } from './harness/launch';
import { runToAssessedFindings } from './harness/findingsSections';
import { writeTwoValveBlendProject } from '../fixtures/screens/twoValveBlend';
import { setTheme } from '../renderer/e2e/appSteps';
import { steadyFill, steadyPress } from './harness/steadyActions';

describe('the reward\'s guaranteed bounds on the Plant log step (e2e)', () => {
  let app: LaunchedApp;
  beforeAll(async () => {
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('shows the heating loop\'s declared floor of 0, in both themes and sizes', async () => {
    const { page } = app;
    await openSample(app, 'heating-loop');
    const floor = page.getByLabel('Never below (by its definition)');
    await expect.poll(() => floor.inputValue(), POLL).toBe('0');
    await expect.poll(() => page.getByLabel('Never above (by its definition)').inputValue(), POLL).toBe('');
    for (const [width, height] of [[1280, 800], [1920, 1080]]) {
      await page.setViewportSize({ width, height });
      for (const theme of ['light', 'dark']) {
        await setTheme(page, theme);
        await floor.scrollIntoViewIfNeeded();
        await app.screenshot(`reward-bounds-${width}-${theme}`);
      }
    }
    await page.setViewportSize({ width: 1280, height: 800 });
  });

  it('names the rows past a floor raised to 1 as rows that cannot be used', async () => {
    const { page } = app;
    const floor = page.getByLabel('Never below (by its definition)');
    await steadyFill(floor, '1');
    await steadyPress(floor, 'Tab');
    await expect.poll(() => page.locator('body').innerText(), { ...POLL, timeout: 60_000 }).toMatch(/line \d+, column cost[^\n]*the cost is [\d.]+ here, below 1, which the project declares it never is \(columns\.reward\.atLeast\)/);
  });

  it('shows the historian formula\'s floor beside it', async () => {
    await app.close(); // the heating loop holds an unsaved edit: a new window, as a person would open a second project
    app = await launchApp({ viewport: { width: 1280, height: 800 }, colorScheme: 'dark' });
    const { page } = app;
    await openSample(app, 'heating-historian');
    await expect.poll(() => page.getByTestId('formula-bounds').innerText(), POLL).toContain('This cost is never below −0.005264 on any row');
    await page.getByTestId('formula-bounds').scrollIntoViewIfNeeded();
    await app.screenshot('reward-bounds-formula-1280-dark');
  });

  it('carries a cut range to report into the answer table where a candidate is not settled (two-valve log)', async () => {
    await app.close();
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
    const { page } = app;
    await openProjectFile(app, await writeTwoValveBlendProject(app.harness.workFolder));
    await runToAssessedFindings(page);
    // Every range to report shown in the answer table starts at 0 or above: the cost is declared never below 0.
    const ranges = await page.getByTestId('answer-range-to-report').allInnerTexts();
    expect(ranges.length).toBeGreaterThan(0);
    for (const r of ranges) expect(r).toMatch(/^range to report \[\d/);
    const cuts = await page.locator('[data-testid^="range-cut-"]').allInnerTexts();
    expect(cuts.some((t) => t.startsWith('The range to report is cut below at 0'))).toBe(true);
    await page.getByTestId('answer-table').scrollIntoViewIfNeeded();
    await app.screenshot('reward-bounds-two-valve-answer-1280');
    await page.getByTestId('answer-table').screenshot({ path: resolve(__dirname, '../../test-artifacts/screens/reward-bounds-two-valve-answer-table.png') });
  }, 600_000);
});
