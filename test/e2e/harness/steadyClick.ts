/**
 * A click that survives headless Chromium's stalled frames. Playwright clicks only once the element
 * has kept one bounding box for two animation frames; under heavy load `--headless=new` can stop
 * producing frames for tens of seconds (no frame is needed to draw nothing on screen), and the
 * click then waits out its whole timeout on an element that is plainly there — the one failure of a
 * clean CI run ("waiting for element to be visible, enabled and stable" on a step tab).
 *
 * So: the ordinary click first, with a shorter wait; if that wait runs out, the element's own click
 * event is dispatched (the same handler runs) and the fallback is counted. The caller still checks
 * the click's effect — a step selected, a section open — so a click that does nothing still fails.
 */
import type { Locator } from 'playwright-core';

/** How often the fallback was needed in this test process (printed by test/e2e/engineer.test.ts). */
export const stalledClicks: string[] = [];

export async function steadyClick(locator: Locator, waitMs = 10_000): Promise<void> {
  await locator.waitFor({ state: 'visible', timeout: 30_000 });
  try {
    await locator.click({ timeout: waitMs });
  } catch (error) {
    if (!(error instanceof Error) || error.name !== 'TimeoutError') throw error;
    if (!(await locator.isEnabled())) throw error;
    stalledClicks.push(String(locator));
    await locator.dispatchEvent('click');
  }
}
