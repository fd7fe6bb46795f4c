/**
 * Open every section of the Findings screen (they start partly folded), as a reader would with the
 * section index's "Open all": sections that appear later (the assessment's) open too.
 */
import type { Page } from 'playwright-core';
import { goToStep } from '../../renderer/e2e/appSteps';
import { steadyClick } from './steadyActions';

export async function openAllFindings(page: Page): Promise<void> {
  const button = page.getByTestId('open-all-sections');
  await button.waitFor({ timeout: 60_000 });
  await steadyClick(button);
}

/** Open one Findings section from the section index (waiting for it: the assessment's sections appear when it is done). */
export async function openFindingsSection(page: Page, id: string, timeout = 90_000): Promise<void> {
  const entry = page.getByTestId(`index-${id}`);
  await entry.waitFor({ timeout });
  await steadyClick(entry);
  await page.locator(`[data-section="${id}"][data-open="true"]`).waitFor({ timeout: 15_000 });
}

/** Run the open project with its assessment from the Run step, then open every Findings section once the answer is in. */
export async function runToAssessedFindings(page: Page): Promise<void> {
  await goToStep(page, 'run');
  await steadyClick(page.getByTestId('run-evaluation'));
  await page.getByTestId('run-finished').waitFor({ timeout: 240_000 });
  await goToStep(page, 'findings');
  await page.getByTestId('answer-rule').waitFor({ timeout: 300_000 });
  await openAllFindings(page);
}

/** Run the open project with its assessment, compute its retune map on Findings and wait for the answer (the state the layout check and the screen review measure). */
export async function runToFindingsWithMap(page: Page): Promise<void> {
  await goToStep(page, 'run');
  await steadyClick(page.getByTestId('run-evaluation'));
  await page.getByTestId('run-finished').waitFor({ timeout: 240_000 });
  await goToStep(page, 'findings');
  await steadyClick(page.getByTestId('compute-retune-map'));
  await page.getByTestId('retune-map-headline').waitFor({ timeout: 300_000 });
  await page.getByTestId('answer-rule').waitFor({ timeout: 300_000 });
}
