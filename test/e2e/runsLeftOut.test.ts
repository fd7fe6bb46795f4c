/**
 * Runs left out by label on the Plant log step (data.csv.excludedRuns), in the built renderer with the
 * real main-process modules behind it, on the tank-levels sample (invented data: 40 runs labelled "1" to
 * "40", 500 rows each). Leaving out runs "1" to "15" takes 15 runs and 7,500 rows (15 × 500) and
 * leaves 25 runs; a label the log does not hold is said at the range with the closest label; the run
 * gives each candidate the J the pipeline gives the same project outside the app (to the last bit: the
 * same code on the same rows). Screenshots of the editor in both themes at 1280×800 and 1920×1080 go to
 * test-artifacts/screens/, and no text on the step is cut (harness/cutText.ts).
 */
import { readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cutTextFindings, cutTextLine } from './harness/cutText';
import { openSample } from './harness/openSample';
import { POLL } from './harness/poll';
import { launchApp, type LaunchedApp } from './harness/launch';
import { UNSTICK } from './harness/unstick';
import { addRunRange, goToStep, runAndReadValues, setTheme } from '../renderer/e2e/appSteps';
import { steadyClick, steadyFill, steadyPress } from './harness/steadyActions';
import { evaluateProject } from '../../src/pipeline/evaluateProject';
import { importProjectData } from '../../src/pipeline/openProject';
import { projectSchema } from '../../src/project/schema';

const SAMPLE = resolve(__dirname, '../../sample-projects/tank-levels');

/** J of each candidate for the sample with runs "1" to "15" left out, by the pipeline outside the app. */
async function pipelineValues(): Promise<number[]> {
  const raw = JSON.parse(await readFile(resolve(SAMPLE, 'tank-levels.spcritic'), 'utf8'));
  raw.data.csv = { ...raw.data.csv, excludedRuns: [{ from: '1', to: '15', reason: 'before the retune' }] };
  const project = projectSchema.parse(raw);
  const opened = importProjectData(project, new Uint8Array(await readFile(resolve(SAMPLE, 'tank-levels.csv'))));
  if (!opened.ok) throw new Error(opened.problems[0].message);
  const evaluation = await evaluateProject({ project, dataset: opened.value.dataset });
  if (!evaluation.ok) throw new Error(evaluation.problems[0].message);
  return evaluation.value.policies.map((p) => p.policyValue);
}

describe('the Plant log step: runs left out by label (e2e)', () => {
  let app: LaunchedApp;

  beforeAll(async () => {
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
    await openSample(app, 'tank-levels');
  });
  afterAll(async () => {
    await app?.close();
  });

  it('adds runs "1" to "15": 15 runs and 7,500 rows counted, 25 runs left, said in the import report', async () => {
    const { page } = app;
    await expect.poll(() => page.getByTestId('episode-count').innerText(), POLL).toBe('40');
    await addRunRange(page, '1', '15', 'before the retune');
    await expect.poll(() => page.getByTestId('runs-rows-0').innerText(), POLL).toBe('7,500');
    await expect.poll(() => page.getByTestId('runs-count-0').innerText(), POLL).toBe('15');
    await expect.poll(() => page.getByTestId('episode-count').innerText(), POLL).toBe('25');
    await expect.poll(() => page.getByTestId('row-counts').innerText(), POLL).toContain('12,500 used; left out: 7,500 in runs left out');
    await expect.poll(() => page.getByTestId('import-summary').innerText(), POLL)
      .toContain('Runs left out by label (column run): 15 runs and 7,500 rows in all; 15 runs, "1" to "15", 7,500 rows: before the retune.');
    // The labels the log holds are offered while typing.
    await expect.poll(() => page.getByTestId('add-run-range').locator('datalist option').count(), POLL).toBe(40);
  });

  it('says at the range when a label is not in the log, with the closest label; removing it imports again', async () => {
    const { page } = app;
    const form = page.getByTestId('add-run-range');
    await steadyFill(form.getByLabel('From run'), '30');
    await steadyFill(form.getByLabel('To run'), '400');
    await steadyClick(page.getByTestId('add-run-range-button'));
    await expect.poll(() => page.getByTestId('run-range-problems').innerText(), POLL).toContain('Runs left out 2, To run: no run of column run is labelled "400"; did you mean "40"?');
    await steadyClick(page.getByTestId('run-ranges').getByRole('button', { name: 'Remove' }).nth(1));
    await expect.poll(() => page.getByTestId('run-range-problems').count(), POLL).toBe(0);
    await expect.poll(() => page.getByTestId('runs-rows-0').innerText(), POLL).toBe('7,500');
  });

  it('a reason typed in the list is one undo step', async () => {
    const { page } = app;
    await steadyFill(page.getByTestId('runs-reason-0'), 'before the retune of 3 March');
    await steadyPress(page.getByTestId('runs-reason-0'), 'Tab');
    await expect.poll(() => page.getByTestId('import-summary').innerText(), POLL).toContain('7,500 rows: before the retune of 3 March.');
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.getByTestId('runs-reason-0').inputValue(), POLL).toBe('before the retune');
  });

  it('looks right in both themes at 1280×800 and 1920×1080, no text cut', async () => {
    const { page } = app;
    const faults: string[] = [];
    for (const size of [{ width: 1280, height: 800 }, { width: 1920, height: 1080 }]) {
      await page.setViewportSize(size);
      for (const theme of ['light', 'dark']) {
        await setTheme(page, theme);
        await expect.poll(() => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth), POLL).toBe(true);
        await page.getByTestId('runs-left-out').scrollIntoViewIfNeeded();
        await page.getByTestId('runs-left-out').screenshot({ path: `test-artifacts/screens/plant-log-runs-left-out-${theme}-${size.width}.png`, style: UNSTICK });
        await page.getByTestId('trend-panel').screenshot({ path: `test-artifacts/screens/plant-log-runs-left-out-panel-${theme}-${size.width}.png`, style: UNSTICK });
        for (const f of await cutTextFindings(page)) faults.push(cutTextLine(`runs left out ${size.width} ${theme}`, f));
      }
    }
    await page.setViewportSize({ width: 1280, height: 800 });
    await setTheme(page, 'light');
    expect(faults).toEqual([]);
  });

  it('evaluates the runs kept: each candidate’s J is the pipeline’s for the same project', async () => {
    const { page } = app;
    const [shown, expected] = await Promise.all([runAndReadValues(page, 2), pipelineValues()]);
    expect(shown).toEqual(expected);
    await goToStep(page, 'plant-log');
    await expect.poll(() => page.getByTestId('runs-rows-0').innerText(), POLL).toBe('7,500');
    expect(app.consoleErrors).toEqual([]);
  }, 180_000);

  // A reason is a note (shared/runKey.ts): no row or number changes with it, so the run stays current
  // and the report written now says the reason typed last (data/leftOutReasons.ts).
  it('a reason edited after the run: the results stay current, and the import report and the written report say the new reason', async () => {
    const { page, harness } = app;
    await goToStep(page, 'plant-log');
    await steadyFill(page.getByTestId('runs-reason-0'), 'a valve trim under test');
    await steadyPress(page.getByTestId('runs-reason-0'), 'Tab');
    await expect.poll(() => page.getByTestId('import-summary').innerText(), POLL).toContain('7,500 rows: a valve trim under test.');
    // The trend says it too (its summary for screen readers; the band's own text is drawn on the canvas).
    await expect.poll(() => page.getByTestId('plot-trend').locator('p').last().textContent(), POLL).toContain('runs "1" to "15": a valve trim under test');
    await expect.poll(() => page.getByTestId('step-run').innerText(), POLL).toContain('Finished');
    await goToStep(page, 'findings');
    await expect.poll(() => page.getByTestId('write-report').isEnabled(), { ...POLL, timeout: 240_000 }).toBe(true);
    expect(await page.getByTestId('stale-results').count()).toBe(0);
    expect(await page.getByTestId('step-findings').innerText()).toContain('Results ready');
    const target = join(harness.workFolder, 'runs-left-out-report.html');
    harness.dialogs.nextExport = target;
    await steadyClick(page.getByTestId('write-report'));
    await expect.poll(() => page.getByTestId('report-status').innerText(), { ...POLL, timeout: 60_000 }).toContain(target);
    const html = await readFile(target, 'utf8');
    expect(html).toContain('7,500 rows: a valve trim under test.');
    expect(html).not.toContain('before the retune of 3 March');
    expect(app.consoleErrors).toEqual([]);
  }, 300_000);
});
