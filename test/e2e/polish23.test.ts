/**
 * The leftovers of the last screen review (issue 11), shot as a reader sees them: the values panel and
 * its export's title, the retune map's headline beside its axis, the coverage section, the action
 * slice's limit labels, the surface's colour bar, and the report's settings, diagnostics and caption,
 * for the heating-loop sample and the invented two-valve log (test/fixtures/screens/twoValveBlend.ts).
 * Written to test-artifacts/polish23/ to be looked at (POLISH23_SHOTS=before|after names the set;
 * the checks run on "after"): one title for the values chart, a tuning value as its axis labels it,
 * the unvisited share said once, no "P = " for a limit's chance, one precision for the horizon.
 */
import { mkdir, readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { POLL } from './harness/poll';
import { openAllFindings } from './harness/findingsSections';
import { openSample } from './harness/openSample';
import { launchApp, type LaunchedApp } from './harness/launch';
import { UNSTICK } from './harness/unstick';
import { goToStep } from '../renderer/e2e/appSteps';
import { writeTwoValveBlendProject } from '../fixtures/screens/twoValveBlend';

const SHOTS = process.env.POLISH23_DIR ?? resolve(__dirname, '../../test-artifacts/polish23');
const SET = process.env.POLISH23_SHOTS ?? 'after';
const CHECK = SET === 'after';
const TITLE = 'Value of each candidate, J'; // figures/parts/plotTheme.ts VALUES_CHART_TITLE
const SECTIONS = ['values', 'retuneMap', 'coverage', 'slice', 'surface'];

async function drawn(page: Page): Promise<void> {
  await page.waitForFunction(() => document.querySelectorAll('.plot-placeholder').length === 0
    && [...document.querySelectorAll('figure[data-chart-state]')].every((f) => f.getAttribute('data-chart-state') !== 'waiting'), null, { timeout: 60_000 }).catch(() => undefined);
}

/** Saves one figure through its export panel; the path, or null where the panel is not shown. */
async function exportFigure(app: LaunchedApp, kind: string, format: 'png' | 'svg', target: string): Promise<string | null> {
  const { page, harness } = app, panel = page.getByTestId(`export-${kind}`).first();
  if ((await page.getByTestId(`export-${kind}`).count()) === 0) return null;
  await panel.locator('summary').click();
  harness.dialogs.nextExport = target;
  await page.getByTestId(`export-${format}-${kind}`).first().click();
  await expect.poll(() => panel.getByTestId(`export-status-${kind}`).innerText().catch(() => 'Exporting'), { ...POLL, timeout: 60_000 }).not.toMatch(/^Exporting/);
  await panel.locator('summary').click();
  return target;
}

interface Case { id: string; open: (app: LaunchedApp) => Promise<unknown>; retuneMap: boolean }
const CASES: Case[] = [
  { id: 'heating-loop', open: (app) => openSample(app, 'heating-loop'), retuneMap: true },
  {
    id: 'two-valve', retuneMap: false,
    async open(app) {
      app.harness.dialogs.nextOpenProject = await writeTwoValveBlendProject(app.harness.workFolder);
      await app.page.getByTestId('open-project').click();
      await app.page.getByTestId('import-summary').waitFor({ timeout: 60_000 });
    },
  },
];

describe.each(CASES)('issue 11 leftovers on $id (e2e)', (c) => {
  let app: LaunchedApp;
  beforeAll(async () => {
    await mkdir(SHOTS, { recursive: true });
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('shows them, and says each once, by one writer', async () => {
    const { page, harness } = app;
    await c.open(app);
    await goToStep(page, 'run');
    await page.getByTestId('run-evaluation').click();
    await page.getByTestId('run-finished').waitFor({ timeout: 240_000 });
    await goToStep(page, 'findings');
    if (c.retuneMap) {
      await page.getByTestId('compute-retune-map').click();
      await page.getByTestId('retune-map-headline').waitFor({ timeout: 300_000 });
    }
    await page.getByTestId('answer-rule').waitFor({ timeout: 300_000 });
    await openAllFindings(page);
    await drawn(page);
    for (const id of SECTIONS) {
      const section = page.locator(`[data-section="${id}"]`);
      if (!(await section.count())) continue;
      // A chart redrawn when the intervals arrive is blank for a moment: wait for this section's own figures.
      await section.scrollIntoViewIfNeeded();
      await page.waitForFunction((s) => [...document.querySelectorAll(`[data-section="${s}"] figure[data-chart-state]`)].every((f) => f.getAttribute('data-chart-state') === 'drawn'), id, { timeout: 30_000 }).catch(() => undefined);
      await page.waitForTimeout(500);
      await section.screenshot({ path: join(SHOTS, `${SET}-${c.id}-${id}.png`), style: UNSTICK });
    }
    const svgs: string[] = [];
    for (const [kind, format] of [['comparison', 'png'], ['comparison', 'svg'], ['surface', 'png'], ['slice', 'svg']] as const) {
      const written = await exportFigure(app, kind, format, join(SHOTS, `${SET}-${c.id}-export-${kind}.${format}`));
      if (written && format === 'svg') svgs.push(written);
    }
    const view = await page.context().newPage();
    for (const svg of svgs) {
      await view.setContent(`<body style="margin:0;background:#fff">${await readFile(svg, 'utf8')}</body>`);
      await view.screenshot({ path: svg.replace(/\.svg$/, '-svg.png'), fullPage: true });
    }
    const reportPath = join(SHOTS, `${SET}-${c.id}-report.html`);
    harness.dialogs.nextExport = reportPath;
    await page.getByTestId('write-report').click();
    await page.getByTestId('report-status').getByText('Saved').waitFor({ timeout: 60_000 });
    const report = await readFile(reportPath, 'utf8');
    await view.setViewportSize({ width: 1280, height: 800 });
    await view.setContent(report);
    for (const id of ['settings', 'diagnostics', 'comparison']) {
      const section = view.locator(`section#${id}`);
      if (await section.count()) await section.screenshot({ path: join(SHOTS, `${SET}-${c.id}-report-${id}.png`) });
    }
    await view.close();
    if (!CHECK) return;

    // 3. One title: the panel's heading, the export's default title, the exported SVG and the report's caption.
    expect(await page.locator('[data-section="values"] .fold-heading').first().innerText()).toContain(TITLE);
    const comparisonSvg = await readFile(join(SHOTS, `${SET}-${c.id}-export-comparison.svg`), 'utf8');
    expect(comparisonSvg).toContain(`<title id="plot-title">${TITLE}</title>`);
    expect(report).toContain(`${TITLE}, beside the baseline`);
    // 4. The horizon at one precision in the report (three significant digits, core/horizonText.ts).
    expect(report).toMatch(/effective horizon \d+(\.\d)? steps|effective horizon \d[\d,]* steps/);
    expect(report).not.toMatch(/effective horizon \d+\.\d\d/);
    // 5. The unvisited share said once in the app's Coverage section.
    const coverage = await page.locator('[data-section="coverage"]').innerText();
    expect(coverage.split('of the value-surface grid has no logged state').length).toBeLessThanOrEqual(2);
    // 6. No "P = " on a limit's label.
    for (const svg of svgs) expect(await readFile(svg, 'utf8')).not.toMatch(/P = \d/);
    // 2. The retune map's headline writes a tuning value as the axis labels it (thousands separated).
    if (c.retuneMap) {
      const headline = await page.getByTestId('retune-map-headline').innerText();
      expect(headline).not.toMatch(/= \d{4,}\b/);
    }
    expect(app.consoleErrors).toEqual([]);
  }, 900_000);
});
