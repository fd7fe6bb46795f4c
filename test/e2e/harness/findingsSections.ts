/**
 * Open every section of the Findings screen (they start partly folded), as a reader would with the
 * section index's "Open all": sections that appear later (the assessment's) open too.
 */
import type { Page } from 'playwright-core';

export async function openAllFindings(page: Page): Promise<void> {
  const button = page.getByTestId('open-all-sections');
  await button.waitFor({ timeout: 60_000 });
  await button.click();
}

/** Open one Findings section from the section index (waiting for it: the assessment's sections appear when it is done). */
export async function openFindingsSection(page: Page, id: string, timeout = 90_000): Promise<void> {
  const entry = page.getByTestId(`index-${id}`);
  await entry.waitFor({ timeout });
  await entry.click();
  await page.locator(`[data-section="${id}"][data-open="true"]`).waitFor({ timeout: 15_000 });
}
