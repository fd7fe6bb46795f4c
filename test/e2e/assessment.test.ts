/**
 * The assessment in the app: after a run of two candidates on the tank-levels sample the findings
 * show bootstrap intervals that contain J, the paired comparison and ranking, the cross-checks
 * with their verdicts, the coverage diagnostics and a sensitivity plot; "Write report…" saves the
 * same HTML document the CLI writes, with every section. Screenshots go to test-artifacts/screens/.
 */
import { readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POLL } from './harness/poll';
import { openAllFindings } from './harness/findingsSections';
import { drawnPixels } from './harness/drawnPixels';
import { REPORT_SECTIONS } from '../../src/pipeline/report/reportDocument';
import { launchApp, type LaunchedApp } from './harness/launch';
import { UNSTICK } from './harness/unstick';
import {
  addCandidate, chooseData, decodedPngContent, goToStep, mapTankColumns, pngSize, runAndReadValues, TANK_CSV,
} from '../renderer/e2e/appSteps';
import { steadyClick, steadyFill, steadySelect } from './harness/steadyActions';

const SCREENS = resolve(__dirname, '../../test-artifacts/screens');

describe('intervals, cross-checks and the report in the app (e2e)', () => {
  let app: LaunchedApp;
  let values: number[] = [];

  beforeAll(async () => {
    app = await launchApp();
  });
  afterAll(async () => {
    await app?.close();
  });

  it('runs two candidates with 200 resamples and shows intervals containing J', async () => {
    const { page } = app;
    await chooseData(app, TANK_CSV);
    await mapTankColumns(page);
    await steadyFill(page.getByLabel('Project name'), 'Tank levels, assessment');
    await goToStep(page, 'candidates');
    await addCandidate(page, 0, { name: 'Tuned', offset: 189, gain: [-60, -90], std: 1.5 });
    await addCandidate(page, 1, { name: 'Trim error', offset: 190.5, gain: [-60, -90], std: 1.5 });
    await goToStep(page, 'estimator');
    await steadyFill(page.getByLabel('Bootstrap resamples'), '200');
    await page.getByLabel('Bootstrap resamples').blur();
    await app.screenshot('assessment-1-estimator');
    values = await runAndReadValues(page, 2);
    await openAllFindings(page); // the evidence starts folded
    await page.getByTestId('comparison-table').waitFor({ timeout: 90_000 });
    for (const [i, testId] of ['policy-interval-0', 'policy-interval-1', 'behaviour-interval'].entries()) {
      const cell = page.getByTestId(testId);
      const lo = Number(await cell.getAttribute('data-lo')), hi = Number(await cell.getAttribute('data-hi'));
      const j = i < 2 ? values[i] : Number(await page.getByTestId('behaviour-value').getAttribute('data-value'));
      expect(Number.isFinite(lo) && Number.isFinite(hi)).toBe(true);
      // A percentile interval of replicates around the estimate contains it here (the CLI's run of this sample shows it well inside).
      expect(lo).toBeLessThanOrEqual(j);
      expect(hi).toBeGreaterThanOrEqual(j);
    }
    await expect.poll(() => page.getByTestId('policy-interval-0').getAttribute('title'), POLL).toContain('basic interval');
  });

  it('shows the ranking, the cross-checks with verdicts and the coverage in words, the plant-memory line with it', async () => {
    const { page } = app;
    const ranking = await page.getByTestId('ranking').innerText();
    expect(ranking).toContain('Ranking, best first');
    expect(ranking).toMatch(/holds in [\d.]+\s% of the resamples/);
    const lq = page.getByTestId('cross-check-linearQuadraticModel').first();
    await expect.poll(() => lq.innerText(), POLL).toContain('Linear-quadratic');
    await expect.poll(() => lq.getByTestId('verdict').innerText(), POLL).toMatch(/Agrees|Disagrees|Too uncertain|Not applicable/);
    // A value beside its interval carries the interval's decimals, as the values table does (JCGM 100 §7.2.2, common practice): "8.36 [6.58, 10.34]", not "8.358 [6.58, 10.34]".
    const sameDecimals = (text: string) => [...text.matchAll(/(-?\d+(?:\.(\d+))?) \[-?\d+(?:\.(\d+))?, /g)].map((m) => [m[1], (m[2] ?? '').length === (m[3] ?? '').length]);
    const panel = await page.getByTestId('cross-checks').innerText();
    expect(sameDecimals(panel).length).toBeGreaterThan(2);
    expect(sameDecimals(panel).filter(([, same]) => !same)).toEqual([]);
    const rows = await page.getByTestId('cross-checks').locator('tbody tr').evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].slice(0, 2).map((td) => td.textContent ?? '').join(' ')));
    expect(rows.map((row) => row.replace(/\u2212/g, '-')).filter((row) => /\[/.test(row) && sameDecimals(row).some(([, same]) => !same))).toEqual([]);
    // A policy's group without a serious finding starts folded to its count (CoveragePanel.tsx): open each, as a reader would, to read its figures.
    const folded = await page.locator('[data-section="coverage"] details.finding-group:not([open])').evaluateAll((ds) => ds.map((d) => d.getAttribute('data-testid') ?? ''));
    for (const id of folded) await steadyClick(page.locator(`[data-testid="${id}"] > summary`));
    await expect.poll(() => page.locator('[data-section="coverage"] details.finding-group:not([open])').count(), POLL).toBe(0);
    // A candidate's coverage figures sit on one line, their sentences behind it (CoveragePanel.tsx): open them too.
    const figures = page.locator('[data-section="coverage"] details.coverage-figures > summary'); // each starts closed: one click opens it
    for (let k = 0, n = await figures.count(); k < n; k++) await steadyClick(figures.nth(k));
    await expect.poll(() => page.locator('[data-section="coverage"] details.coverage-figures:not([open])').count(), POLL).toBe(0);
    await expect.poll(() => page.getByTestId('coverage').innerText(), POLL).toContain('Occupancy shift');
    await expect.poll(() => page.getByTestId('coverage').innerText(), POLL).toContain('outside the logged range');
    await expect.poll(() => page.getByTestId('coverage').innerText(), POLL).toMatch(/Plant memory: the 8 rows before explain (at most|less than) [\d.]+\s%/); // \s: the share writer holds "%" to its number with a no-break space
  });

  it('draws a sensitivity plot that is not blank', async () => {
    const { page } = app;
    const figure = page.getByTestId('plot-sensitivity');
    await expect.poll(() => figure.getAttribute('data-chart-state'), POLL).toBe('drawn');
    const pixels = await drawnPixels(page, figure);
    expect(pixels.drawnShare).toBeGreaterThan(0.01);
    // PNG export through the same export panel as the other plots.
    const target = join(app.harness.workFolder, 'sensitivity.png');
    app.harness.dialogs.nextExport = target;
    await steadyClick(page.getByTestId('export-sensitivity').locator('summary'));
    await steadyClick(page.getByTestId('export-png-sensitivity'));
    await page.getByTestId('export-status-sensitivity').getByText('Saved').waitFor({ timeout: 30_000 });
    const bytes = new Uint8Array(await readFile(target));
    expect(pngSize(bytes)).toEqual({ width: 1950, height: 1200 }); // the default preset, 6.5 × 4 in at 300 dpi
    expect((await decodedPngContent(page, bytes)).colours).toBeGreaterThan(20);
    await steadyClick(page.getByTestId('export-sensitivity').locator('summary'));
    await app.screenshot('assessment-2-findings');
    for (const [name, testId] of [['values', 'value-table'], ['comparison', 'comparison-table'], ['cross-checks', 'cross-checks'], ['coverage', 'coverage'], ['sensitivity', 'sensitivity']]) {
      await page.getByTestId(testId).screenshot({ path: join(SCREENS, `assessment-3-${name}.png`), style: UNSTICK });
    }
  });

  it('writes the report with every section through the export dialog', async () => {
    const { page, harness } = app;
    const target = join(harness.workFolder, 'tank-report.html');
    harness.dialogs.nextExport = target;
    await steadyClick(page.getByTestId('write-report'));
    await page.getByTestId('report-status').getByText('Saved').waitFor({ timeout: 30_000 });
    expect(harness.dialogs.asked.at(-1)).toMatchObject({ dialog: 'export', kind: 'html' });
    const html = await readFile(target, 'utf8');
    // Every section opens with its heading (reportDocument.ts: stable section ids).
    for (const section of REPORT_SECTIONS) expect(html).toMatch(new RegExp(`<section id="${section}"><h2>[^<]+</h2>`));
    expect(html).toContain('Tank levels, assessment');
    // The report Chromium renders: open it from disk and look at it.
    const view = await page.context().newPage();
    await view.setContent(html);
    await view.screenshot({ path: join(SCREENS, 'assessment-4-report.png'), fullPage: true });
    await view.close();
  });

  it('cancels a long assessment as it cancels a run, and offers to compute it again', async () => {
    const { page } = app;
    await goToStep(page, 'estimator');
    await steadyFill(page.getByLabel('Bootstrap resamples'), '100000');
    await page.getByLabel('Bootstrap resamples').blur();
    await goToStep(page, 'run');
    await steadyClick(page.getByTestId('run-evaluation'));
    await page.getByTestId('run-finished').waitFor({ timeout: 90_000 });
    await goToStep(page, 'findings');
    await page.getByTestId('assessment-progress').waitFor({ timeout: 30_000 });
    // A linear project is assessed in a worker of its own: the surface draws while the resampling runs.
    await page.getByTestId('plot-surface').waitFor({ timeout: 30_000 });
    await expect.poll(() => page.getByTestId('assessment-progress').isVisible(), POLL).toBe(true);
    await app.screenshot('assessment-5-running');
    await steadyClick(page.getByTestId('cancel-assessment'));
    await page.getByTestId('assessment-cancelled').waitFor({ timeout: 10_000 });
    await expect.poll(() => page.getByTestId('compute-assessment').isEnabled(), POLL).toBe(true);
    // The evaluation itself stays: its values are still shown, without intervals.
    await expect.poll(() => page.getByTestId('policy-value-0').getAttribute('data-value'), POLL).toBe(String(values[0]));
    await expect.poll(() => page.getByTestId('policy-interval-0').count(), POLL).toBe(0);
    // The evaluation worker kept its fits: the slice is still redrawn from them.
    await steadySelect(page.getByTestId('slice-candidate'), '1');
    await page.getByRole('img', { name: 'Action values of Trim error' }).waitFor({ timeout: 30_000 });
    await expect.poll(() => page.getByText('The slice could not be drawn').count(), POLL).toBe(0);
  });

  it('logged no console errors and made no request beyond its origin', () => {
    expect(app.consoleErrors).toEqual([]);
    expect(app.blockedRequests).toEqual([]);
  });
});
