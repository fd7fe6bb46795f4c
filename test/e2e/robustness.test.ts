/**
 * The app under trouble: a CSV with a bad cell shows the importer's error (file, line, column) on
 * screen; a long run can be cancelled and the next run still works; the page answers clicks while a
 * fit runs (the longest main-thread task is measured and printed, never asserted); a project whose
 * data file moved or changed says so; a project from a newer version is refused and left unchanged.
 */
import { copyFile, readFile, rename, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POLL } from './harness/poll';
import { startMainThreadProbe, stopMainThreadProbe } from './harness/mainThreadProbe';
import { launchApp, type LaunchedApp } from './harness/launch';
import { chooseData, goToStep, TANK_CSV } from '../renderer/e2e/appSteps';
import { writeTankProject } from '../renderer/e2e/projectFiles';
import { steadyClick, steadySelect } from './harness/steadyActions';

const BAD_CSV = resolve(__dirname, '../fixtures/bad/not-a-number.csv');

/** New project; answers "Don’t save" when the app asks about unsaved changes. */
async function startNewProject(app: LaunchedApp): Promise<void> {
  const { page } = app;
  await steadyClick(page.getByTestId('new-project'));
  const dontSave = page.getByRole('button', { name: 'Don’t save' });
  await page.getByTestId('welcome').or(dontSave).waitFor();
  if (await dontSave.isVisible()) await steadyClick(dontSave);
  await page.getByTestId('welcome').waitFor();
}

async function openProject(app: LaunchedApp, path: string): Promise<void> {
  app.harness.dialogs.nextOpenProject = path;
  await steadyClick(app.page.getByTestId('open-project'));
}

describe('the app under trouble (e2e)', () => {
  let app: LaunchedApp;
  beforeAll(async () => {
    app = await launchApp();
  });
  afterAll(async () => {
    await app?.close();
  });

  it('shows a bad cell with its file, line and column, and lists the row when bad rows are left out', async () => {
    const { page, harness } = app;
    const csv = join(harness.workFolder, 'not-a-number.csv');
    await copyFile(BAD_CSV, csv);
    await chooseData(app, csv);
    await steadySelect(page.getByTestId('role-level_m'), 'state');
    await steadySelect(page.getByTestId('role-valve_pct'), 'action');
    await steadySelect(page.getByTestId('role-cost'), 'cost');
    const errors = page.getByTestId('import-errors');
    await errors.waitFor({ timeout: 30_000 });
    // The importer's own wording (test/data/badFiles.test.ts): line 17 holds "1,2.3" in column level_m.
    await expect.poll(() => errors.innerText(), POLL).toContain('not-a-number.csv, line 17, column level_m');
    await expect.poll(() => errors.innerText(), POLL).toContain('"1,2.3" is not a number');
    await app.screenshot('robustness-bad-csv');
    await steadySelect(page.getByTestId('bad-rows'), 'exclude');
    const excluded = page.getByTestId('excluded-rows');
    await excluded.waitFor({ timeout: 30_000 });
    await expect.poll(() => excluded.innerText(), POLL).toContain('17');
  });

  it('reads a dropped CSV, and asks for it through the picker before the project can be saved', async () => {
    const { page } = app;
    await startNewProject(app);
    const text = await readFile(BAD_CSV, 'utf8');
    const transfer = await page.evaluateHandle((csv) => {
      const data = new DataTransfer();
      data.items.add(new File([csv], 'dropped-levels.csv', { type: 'text/csv' }));
      return data;
    }, text);
    await page.getByTestId('dropzone').dispatchEvent('drop', { dataTransfer: transfer });
    await page.getByTestId('role-table').waitFor();
    await expect.poll(() => page.getByTestId('data-file').innerText(), POLL).toBe('dropped-levels.csv');
    await steadyClick(page.getByTestId('save-project'));
    await expect.poll(() => page.getByTestId('notice').innerText(), POLL).toContain('dropped onto the window');
  });

  it('cancels a long run, keeps the page responsive meanwhile, and runs again afterwards', async () => {
    const { page, harness } = app;
    const projectPath = join(harness.workFolder, 'long-run.spcritic');
    // The largest radial-basis grid the schema takes (12 centres in each of 3 inputs, 1,732 features): its pass
    // over the data forms 3·1,732² products per transition, which takes minutes.
    await writeTankProject({ projectPath, dataPath: TANK_CSV, approximator: { features: { kind: 'radialBasis', centresPerInput: 12 } } });
    await startNewProject(app);
    await openProject(app, projectPath);
    await page.getByTestId('import-summary').waitFor({ timeout: 30_000 });
    await goToStep(page, 'run');
    // For comparison: the same step switch with no run going.
    await page.evaluate(startMainThreadProbe);
    await goToStep(page, 'candidates');
    await page.getByTestId('candidate-chart').waitFor();
    await goToStep(page, 'run');
    report('switching to Candidates and back, no run', await page.evaluate(stopMainThreadProbe));
    await steadyClick(page.getByTestId('run-evaluation'));
    await page.getByTestId('progress-iteration').getByText(/reading the data \(\d+\s%\)/).waitFor({ timeout: 30_000 });
    // The main thread while the worker fits: one second left alone, then while the user switches steps.
    await page.evaluate(startMainThreadProbe);
    await page.waitForTimeout(1000);
    report('a run left alone for 1 s', await page.evaluate(stopMainThreadProbe));
    await page.evaluate(startMainThreadProbe);
    await goToStep(page, 'candidates');
    await expect.poll(() => page.getByTestId('step-candidates').getAttribute('aria-selected'), POLL).toBe('true');
    await page.getByTestId('candidate-chart').waitFor();
    await goToStep(page, 'run');
    report('switching to Candidates and back during a run', await page.evaluate(stopMainThreadProbe));
    await expect.poll(() => page.getByTestId('progress-iteration').innerText(), POLL).toMatch(/reading the data/); // still running
    await app.screenshot('robustness-run-progress');
    await steadyClick(page.getByTestId('cancel-evaluation'));
    await page.getByTestId('run-cancelled').waitFor({ timeout: 10_000 });
    await expect.poll(() => page.getByTestId('run-progress').count(), POLL).toBe(0);

    // The fresh worker has the data again: a short run finishes.
    await goToStep(page, 'estimator');
    await steadySelect(page.getByLabel('Features', { exact: true }), 'polynomial');
    await goToStep(page, 'run');
    await steadyClick(page.getByTestId('run-evaluation'));
    await page.getByTestId('run-finished').waitFor({ timeout: 90_000 });
  });

  it('says when the data file has moved, and reads it from where the user points', async () => {
    const { page, harness } = app;
    const data = join(harness.workFolder, 'levels.csv');
    const moved = join(harness.workFolder, 'levels-moved.csv');
    const projectPath = join(harness.workFolder, 'moved.spcritic');
    await copyFile(TANK_CSV, data);
    await writeTankProject({ projectPath, dataPath: data, fingerprint: true });
    await rename(data, moved);
    await startNewProject(app);
    await openProject(app, projectPath);
    const problems = page.getByTestId('data-problems');
    await problems.waitFor({ timeout: 30_000 });
    await expect.poll(() => problems.innerText(), POLL).toContain('cannot read the data file "levels.csv"');
    await expect.poll(() => page.getByTestId('step-plant-log').innerText(), POLL).toContain('could not be read');
    await app.screenshot('robustness-data-moved');
    harness.dialogs.nextOpenData = moved;
    await steadyClick(page.getByTestId('relocate-data'));
    await page.getByTestId('import-summary').waitFor({ timeout: 30_000 });
    await expect.poll(() => page.getByTestId('import-warnings').count(), POLL).toBe(0); // the same bytes: no "changed" warning
  });

  it('says when the data file has changed since the project was saved, with the old and new row counts', async () => {
    const { page, harness } = app;
    const data = join(harness.workFolder, 'changing.csv');
    const projectPath = join(harness.workFolder, 'changing.spcritic');
    await copyFile(TANK_CSV, data);
    await writeTankProject({ projectPath, dataPath: data, fingerprint: true });
    const lines = (await readFile(data, 'utf8')).trimEnd().split('\n');
    await writeFile(data, `${lines.slice(0, 1 + 19_000).join('\n')}\n`); // the first 38 runs only
    await startNewProject(app);
    await openProject(app, projectPath);
    const warnings = page.getByTestId('import-warnings');
    await warnings.waitFor({ timeout: 30_000 });
    await expect.poll(() => warnings.innerText(), POLL).toContain('rows then: 20,000, now: 19,000');
  });

  it('refuses a project from a newer format version and leaves the file unchanged', async () => {
    const { page, harness } = app;
    const projectPath = join(harness.workFolder, 'future.spcritic');
    const text = await writeTankProject({ projectPath, dataPath: TANK_CSV, version: 99 });
    await openProject(app, projectPath);
    const notice = page.getByTestId('notice');
    await notice.getByText('could not be opened').waitFor({ timeout: 30_000 });
    await expect.poll(() => notice.innerText(), POLL).toContain('newer Setpoint Critic');
    await app.screenshot('robustness-newer-version');
    // The open project is still the previous one: Save writes that one, and nothing touches future.spcritic.
    const discards = () => harness.apiCalls.filter((c) => c.method === 'discardRecovery').length;
    const before = discards();
    await steadyClick(page.getByTestId('save-project'));
    await expect.poll(discards, POLL).toBeGreaterThan(before); // the save has finished
    await expect(readFile(projectPath, 'utf8')).resolves.toBe(text);
  });

  it('offers unsaved work back after a crash, and restores it as unsaved', async () => {
    // The recovery copy the autosave would write (every minute while there are unsaved changes).
    const sample = JSON.parse(await readFile(resolve(__dirname, '../../sample-projects/tank-levels/tank-levels.spcritic'), 'utf8'));
    const text = JSON.stringify({ ...sample, name: 'Recovered work', data: { ...sample.data, path: TANK_CSV } });
    await app.page.evaluate((t) => window.setpointCritic!.writeRecovery(t, null), text);
    // The app "crashes": a new run starts on the same state folder while the old copy is still there.
    const next = await launchApp({ stateFolder: app.harness.stateFolder });
    try {
      await next.page.getByRole('alertdialog').getByText('did not close cleanly').waitFor({ timeout: 30_000 });
      await next.screenshot('robustness-recovery-offer');
      await steadyClick(next.page.getByRole('button', { name: 'Restore it' }));
      await next.harness.waitForDocumentState((st) => st.name === 'Recovered work' && st.dirty);
      await expect.poll(() => next.page.getByTestId('notice').innerText(), POLL).toContain('Choose the data file again');
      expect(next.consoleErrors).toEqual([]);
    } finally {
      await next.close();
    }
  });

  it('logged no console errors and made no request beyond its origin', () => {
    expect(app.consoleErrors).toEqual([]);
    expect(app.blockedRequests).toEqual([]);
  });
});

function report(what: string, probe: { longestTaskMs: number; longTasks: number; longestFrameGapMs: number }): void {
  console.log(`main thread, ${what}: longest task ${probe.longestTaskMs} ms (${probe.longTasks} over 50 ms), longest gap between frames ${probe.longestFrameGapMs.toFixed(1)} ms`);
}

/** Runs in the page: record long tasks and the gaps between animation frames until stopped. */
