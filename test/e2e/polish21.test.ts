/**
 * The findings the last screen review flagged (issues 9 and 11), shot as a reader sees them: the
 * answer table's warnings column, the value table, the coverage and cross-check notes and the
 * surface's colour bar of the heating-loop sample, written to test-artifacts/polish21/ to be looked
 * at (POLISH21_SHOTS=before|after names the set). Besides the pictures: the answer table never says
 * "none" for a candidate while a caution about it sits in the whole-log list, and a converged fit's
 * tolerance line sits in the value table's details, not in its row.
 */
import { copyFile, mkdir, readFile, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runToAssessedFindings } from './harness/findingsSections';
import { openSample } from './harness/openSample';
import { launchApp, type LaunchedApp } from './harness/launch';
import { UNSTICK } from './harness/unstick';
import { goToStep } from '../renderer/e2e/appSteps';

const SHOTS = resolve(__dirname, '../../test-artifacts/polish21');
const SET = process.env.POLISH21_SHOTS ?? 'after';
const SECTIONS = ['answer', 'values', 'coverage', 'crossChecks', 'surface'];

describe('the flagged findings of the heating-loop sample (e2e)', () => {
  let app: LaunchedApp;
  beforeAll(async () => {
    await mkdir(SHOTS, { recursive: true });
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('shows them, and the answer table names cautions where they sit', async () => {
    const { page } = app;
    await openSample(app, 'heating-loop');
    await runToAssessedFindings(page);
    await page.waitForFunction(() => document.querySelectorAll('.plot-placeholder').length === 0
      && [...document.querySelectorAll('figure[data-chart-state]')].every((f) => f.getAttribute('data-chart-state') !== 'waiting'), null, { timeout: 60_000 }).catch(() => undefined);
    for (const id of SECTIONS) {
      const section = page.locator(`[data-section="${id}"]`);
      if (await section.count()) await section.screenshot({ path: join(SHOTS, `${SET}-${id}.png`), style: UNSTICK });
    }
    // A converged fit's account (its last change against the tolerance) is a detail: the Fit column already says "converged".
    const accounts = await page.locator('[data-testid^="policy-account-"]').evaluateAll((cells) => cells.map((c) => {
      const copy = c.cloneNode(true) as HTMLElement;
      copy.querySelectorAll('details').forEach((d) => d.remove());
      return { row: copy.textContent ?? '', details: c.querySelector('details')?.textContent ?? '' };
    }));
    expect(accounts.length).toBeGreaterThan(0);
    for (const a of accounts) {
      expect(a.row).not.toMatch(/tolerance/);
      expect(a.details).toMatch(/tolerance/);
    }
    const logWarnings = await page.getByTestId('assessment-warnings').allInnerTexts();
    const rows = await page.locator('[data-testid="answer-table"] tbody tr[data-testid^="answer-row-"]:not([data-testid="answer-row-baseline"])').all();
    for (const row of rows) {
      const name = (await row.locator('th').innerText()).trim();
      const cell = (await row.locator('td').last().innerText()).trim();
      const aboutIt = logWarnings.join('\n').split('\n').some((line) => line.includes(`${name}:`));
      if (aboutIt) expect(cell, `${name}'s warnings cell`).not.toBe('none');
    }
  }, 600_000);
});

describe('a script-written number in a candidate field (e2e)', () => {
  let app: LaunchedApp;
  beforeAll(async () => {
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('shows a script-written 0.1 + 0.2 in a candidate field as 0.3, and leaves the file as written', async () => {
    const { page, harness } = app, folder = resolve(__dirname, '../../sample-projects/tank-levels');
    const doc = JSON.parse(await readFile(join(folder, 'tank-levels.spcritic'), 'utf8'));
    doc.candidates[0].std = [0.1 + 0.2]; // 0.30000000000000004, as a script writes it
    const projectPath = join(harness.workFolder, 'noisy-tank.spcritic');
    await copyFile(join(folder, 'tank-levels.csv'), join(harness.workFolder, 'tank-levels.csv'));
    await writeFile(projectPath, JSON.stringify(doc, null, 2));
    harness.dialogs.nextOpenProject = projectPath;
    await page.getByTestId('open-project').click();
    await page.getByTestId('import-summary').waitFor({ timeout: 60_000 });
    await goToStep(page, 'candidates');
    const values = await page.locator('input').evaluateAll((inputs) => inputs.map((i) => (i as HTMLInputElement).value));
    expect(values).toContain('0.3');
    expect(values.filter((v) => /0000000\d|9999999\d/.test(v))).toEqual([]);
    await page.locator('main').screenshot({ path: join(SHOTS, `${SET}-noisy-field.png`), style: UNSTICK }).catch(() => page.screenshot({ path: join(SHOTS, `${SET}-noisy-field.png`), style: UNSTICK }));
    expect(JSON.parse(await readFile(projectPath, 'utf8')).candidates[0].std[0]).toBe(0.1 + 0.2); // showing it wrote nothing back
  }, 300_000);
});
