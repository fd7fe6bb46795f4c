/**
 * The Findings screen's layout after a run with the assessment and a retune map (heating-loop
 * sample: three candidates, one 10 × 10 map), measured in Chromium at 1280 × 800 and 1920 × 1080 in
 * both themes. The rules (layout measurements, not timings):
 * - default state (evidence folded): document.scrollHeight ≤ 3 window heights at 1920 × 1080 and
 *   ≤ 4,800 px (6 window heights) at 1280 × 800 — it was 6,585 and 9,239 px with one long column of
 *   open panels;
 * - no two panels of the grid overlap, and no figure sticks out of its panel, both folded and with
 *   every section open;
 * - the answer (which candidate to trial, J with its interval against the baseline) comes first;
 * - every section stays reachable: the section index opens a folded one and brings its heading into
 *   view below the sticky toolbar and index; Save, Undo and the step list stay in view when scrolled;
 * - a fold is remembered for the project when the reader leaves Findings and comes back.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { POLL } from './harness/poll';
import { openSample } from './harness/openSample';
import { runToFindingsWithMap } from './harness/findingsSections';
import { launchApp, type LaunchedApp } from './harness/launch';
import { goToStep, setTheme } from '../renderer/e2e/appSteps';
import { steadyClick } from './harness/steadyActions';

const SIZES = [{ width: 1280, height: 800, maxHeight: 4800 }, { width: 1920, height: 1080, maxHeight: 3 * 1080 }];

interface Box { name: string; x: number; y: number; width: number; height: number }

/** The grid's panels and every figure, in page coordinates. */
function boxes(page: Page): Promise<{ panels: Box[]; figures: (Box & { panel: string })[] }> {
  return page.evaluate(() => {
    const box = (e: Element, name: string) => {
      const r = e.getBoundingClientRect();
      return { name, x: r.left + scrollX, y: r.top + scrollY, width: r.width, height: r.height };
    };
    const grid = document.querySelector('[data-testid="findings-grid"]');
    const panels = [...(grid?.children ?? [])].map((p, i) => box(p, (p as HTMLElement).dataset.section ?? `panel ${i}`));
    const figures = [...document.querySelectorAll('[data-chart-state]')].map((f) => {
      const panel = f.closest('[data-section]') as HTMLElement | null;
      return { ...box(f, f.getAttribute('data-testid') ?? 'figure'), panel: panel?.dataset.section ?? '' };
    });
    return { panels, figures };
  });
}

const overlap = (a: Box, b: Box) => Math.min(a.x + a.width, b.x + b.width) - Math.max(a.x, b.x) > 0.5 && Math.min(a.y + a.height, b.y + b.height) - Math.max(a.y, b.y) > 0.5;
const inside = (inner: Box, outer: Box) => inner.x >= outer.x - 0.5 && inner.y >= outer.y - 0.5 && inner.x + inner.width <= outer.x + outer.width + 0.5 && inner.y + inner.height <= outer.y + outer.height + 0.5;

/** Overlapping panel pairs and figures outside their panel, as readable lines (empty when the layout is clean). */
async function layoutFaults(page: Page): Promise<string[]> {
  const { panels, figures } = await boxes(page), faults: string[] = [];
  for (let i = 0; i < panels.length; i++) for (let j = i + 1; j < panels.length; j++) if (overlap(panels[i], panels[j])) faults.push(`${panels[i].name} overlaps ${panels[j].name}`);
  for (const f of figures) {
    const panel = panels.find((p) => p.name === f.panel);
    if (!panel || !inside(f, panel)) faults.push(`${f.name} outside its panel ${f.panel}`);
  }
  return faults;
}

/** Whether an element is drawn inside the window (not scrolled away). */
const inWindow = (page: Page, selector: string) => page.evaluate((sel) => {
  const r = document.querySelector(sel)?.getBoundingClientRect();
  return Boolean(r && r.height > 0 && r.top >= 0 && r.bottom <= innerHeight);
}, selector);

const scrollHeight = (page: Page) => page.evaluate(() => document.documentElement.scrollHeight);

describe('the Findings layout (e2e)', () => {
  let app: LaunchedApp;
  beforeAll(async () => {
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('after a run with the assessment and a map, answers first', async () => {
    const { page } = app;
    await openSample(app, 'heating-loop');
    await runToFindingsWithMap(page);
    const first = await page.evaluate(() => (document.querySelector('[data-testid="findings-grid"]')?.firstElementChild as HTMLElement | null)?.dataset.section);
    expect(first).toBe('answer');
    expect(await page.getByTestId('answer-lead').innerText()).toMatch(/^(Trial first: .+\. J [\d.]+ \[[\d.−]+, [\d.]+\]|No candidate is named for a trial\.)/);
    await expect.poll(() => page.getByTestId('answer-table').locator('tbody tr').count(), POLL).toBe(4); // three candidates and the baseline
  });

  it('fits the rule on height in its default state, with no overlaps, at both sizes in both themes', async () => {
    const { page } = app;
    for (const size of SIZES) {
      await page.setViewportSize(size);
      for (const theme of ['light', 'dark']) {
        await setTheme(page, theme);
        await expect.poll(() => page.getByTestId('plot-retuneMap').getAttribute('data-chart-state'), POLL).toBe('drawn');
        const height = await scrollHeight(page);
        console.log(`Findings, default state, ${size.width} × ${size.height} ${theme}: scrollHeight ${height} px (${(height / size.height).toFixed(2)} windows)`);
        expect(height, `${size.width} px ${theme}`).toBeLessThanOrEqual(size.maxHeight);
        expect(await layoutFaults(page), `${size.width} px ${theme}`).toEqual([]);
      }
    }
  });

  it('with every section open: no overlaps, figures inside their panels', async () => {
    const { page } = app;
    await steadyClick(page.getByTestId('open-all-sections'));
    await expect.poll(() => page.locator('[data-section][data-open="false"]').count(), POLL).toBe(0);
    for (const size of SIZES) {
      await page.setViewportSize(size);
      await expect.poll(() => page.locator('[data-chart-state="drawn"]').count(), { ...POLL, timeout: 60_000 }).toBeGreaterThanOrEqual(6);
      await expect.poll(() => layoutFaults(page), POLL).toEqual([]);
      console.log(`Findings, every section open, ${size.width} × ${size.height}: scrollHeight ${await scrollHeight(page)} px`);
    }
    await steadyClick(page.getByTestId('fold-all-sections'));
    await expect.poll(() => page.locator('[data-section][data-open="true"]').count(), POLL).toBe(0);
  });

  it('reaches every section from the index, below the sticky bars, with Save, Undo and the steps in view', async () => {
    const { page } = app;
    await page.setViewportSize(SIZES[0]);
    const ids = await page.getByTestId('section-index').locator('li button').evaluateAll((bs) => bs.map((b) => b.getAttribute('data-testid')!.slice('index-'.length)));
    expect(ids).toEqual(['answer', 'values', 'retuneMap', 'comparison', 'crossChecks', 'coverage', 'sensitivity', 'surface', 'slice', 'convergence', 'report']);
    for (const id of ids) {
      await steadyClick(page.getByTestId(`index-${id}`));
      const panel = page.locator(`[data-section="${id}"]`);
      await expect.poll(() => panel.getAttribute('data-open'), POLL).toBe('true');
      const heading = panel.locator('.fold-toggle');
      await expect.poll(() => heading.evaluate((h) => document.activeElement === h), POLL).toBe(true);
      // The heading is in the window and not under the index (whose bottom is the sticky area's bottom).
      const { top, indexBottom } = await heading.evaluate((h) => ({ top: h.getBoundingClientRect().top, indexBottom: document.querySelector('[data-testid="section-index"]')!.getBoundingClientRect().bottom }));
      const lastScroll = await page.evaluate(() => scrollY + innerHeight >= document.documentElement.scrollHeight - 1);
      if (!lastScroll) expect(top, id).toBeGreaterThanOrEqual(indexBottom);
      expect(top, id).toBeLessThan(SIZES[0].height);
      for (const kept of ['save-project', 'undo', 'step-findings']) expect(await inWindow(page, `[data-testid="${kept}"]`), `${kept} after ${id}`).toBe(true);
    }
  });

  it('remembers a fold for the project when the reader leaves Findings and comes back', async () => {
    const { page } = app;
    await steadyClick(page.getByTestId('fold-retuneMap'));
    await expect.poll(() => page.locator('[data-section="retuneMap"]').getAttribute('data-open'), POLL).toBe('false');
    await goToStep(page, 'candidates');
    await goToStep(page, 'findings');
    await expect.poll(() => page.locator('[data-section="retuneMap"]').getAttribute('data-open'), POLL).toBe('false');
    await expect.poll(() => page.locator('[data-section="coverage"]').getAttribute('data-open'), POLL).toBe('true'); // opened from the index above
    await steadyClick(page.getByTestId('fold-retuneMap'));
    await expect.poll(() => page.locator('[data-section="retuneMap"]').getAttribute('data-open'), POLL).toBe('true');
  });

  it('logged no console errors', () => {
    expect(app.consoleErrors).toEqual([]);
  });
});
