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
