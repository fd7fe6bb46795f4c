/**
 * The Coverage panel as an engineer scans it, on the three samples (e2e): each sample run with its
 * assessment (no retune map), every Findings section opened, then the Findings page in both themes at
 * 1280 × 800 and 1920 × 1080. Per view: the page's and the panel's heights, how many lines each matrix
 * column title takes, and whether every serious finding is in view without a click. Pictures and
 * coverage-review.json go to test-artifacts/screen-review/ (or SCREEN_REVIEW_DIR). The checks: at 1280
 * every column title sits on one line, in the app and in the report, and so does each candidate's
 * line of coverage figures; every serious sentence is visible without a click.
 */
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { runToAssessedFindings } from './harness/findingsSections';
import { openSample } from './harness/openSample';
import { launchApp, type LaunchedApp } from './harness/launch';
import { UNSTICK } from './harness/unstick';
import { steadyClick } from './harness/steadyActions';
import { setTheme } from '../renderer/e2e/appSteps';

const SHOTS = process.env.SCREEN_REVIEW_DIR ?? resolve(__dirname, '../../test-artifacts/screen-review');
const SIZES = [{ width: 1280, height: 800 }, { width: 1920, height: 1080 }];
const SAMPLES = ['heating-loop', 'tank-levels', 'heating-historian'];

interface View { page: number; coverage: number; titleLines: Record<string, number>; figureLines: number[]; seriousHidden: number }

/** Lines each column title of the matrix under `root` takes (distinct line tops of its text). */
function titleLines(page: Page, root: string): Promise<Record<string, number>> {
  return page.evaluate((rootSelector) => {
    const out: Record<string, number> = {};
    for (const th of document.querySelectorAll(`${rootSelector} table.finding-table thead th[scope="col"]`)) {
      const range = document.createRange();
      range.selectNodeContents(th);
      const tops = new Set([...range.getClientRects()].filter((r) => r.width > 0).map((r) => Math.round(r.top)));
      out[th.textContent ?? ''] = tops.size;
    }
    return out;
  }, root);
}

/** Lines each candidate's coverage figures take (the one line their sentences fold behind). */
function figureLines(page: Page): Promise<number[]> {
  return page.locator('[data-section="coverage"] details.coverage-figures > summary').evaluateAll((summaries) => summaries.map((summary) => {
    const range = document.createRange();
    range.selectNodeContents(summary);
    return new Set([...range.getClientRects()].filter((r) => r.width > 0).map((r) => Math.round(r.top))).size;
  }));
}

/** Serious findings in the panel (a line starting "Serious") that a reader cannot see without a click: not rendered, or inside a closed disclosure. */
function seriousHidden(page: Page): Promise<number> {
  return page.locator('[data-section="coverage"] li, [data-section="coverage"] summary').evaluateAll((items) => items
    .filter((item) => /^\s*Serious/.test(item.textContent ?? ''))
    .filter((item) => item.getClientRects().length === 0).length);
}

async function measureView(page: Page): Promise<View> {
  return {
    page: await page.evaluate(() => document.documentElement.scrollHeight),
    coverage: await page.locator('[data-section="coverage"]').evaluate((e) => Math.round(e.getBoundingClientRect().height)),
    titleLines: await titleLines(page, '[data-section="coverage"]'),
    figureLines: await figureLines(page),
    seriousHidden: await seriousHidden(page),
  };
}

async function reviewSample(app: LaunchedApp, sample: string, views: Record<string, View | Record<string, number>>): Promise<void> {
  const { page, harness } = app;
  await openSample(app, sample);
  await runToAssessedFindings(page);
  await page.locator('[data-section="coverage"][data-open="true"]').waitFor({ timeout: 60_000 });
  for (const size of SIZES) {
    await page.setViewportSize(size);
    for (const theme of ['light', 'dark']) {
      await setTheme(page, theme);
      const name = `${sample}-${size.width}-${theme}`;
      await page.locator('[data-section="coverage"]').screenshot({ path: join(SHOTS, `${name}-coverage.png`), style: UNSTICK });
      views[name] = await measureView(page);
    }
  }
  await page.setViewportSize(SIZES[0]);
  await setTheme(page, 'light');
  const report = join(harness.workFolder, `${sample}-report.html`);
  harness.dialogs.nextExport = report;
  await steadyClick(page.getByTestId('write-report'));
  await page.getByTestId('report-status').getByText('Saved').waitFor({ timeout: 60_000 });
  const view = await page.context().newPage();
  await view.setContent(await readFile(report, 'utf8'));
  for (const size of SIZES) {
    await view.setViewportSize(size);
    await view.locator('#diagnostics').screenshot({ path: join(SHOTS, `${sample}-report-${size.width}-diagnostics.png`) });
    views[`${sample}-report-${size.width}`] = await titleLines(view, '#diagnostics');
  }
  await view.close();
}

describe('the Coverage panel on the three samples (e2e)', () => {
  let app: LaunchedApp | undefined;
  afterAll(async () => {
    await app?.close();
  });

  it('column titles on one line at 1280, serious findings in view, in pictures with the page heights', async () => {
    await mkdir(SHOTS, { recursive: true });
    const views: Record<string, View | Record<string, number>> = {};
    for (const sample of SAMPLES) {
      app = await launchApp({ viewport: SIZES[0] });
      await reviewSample(app, sample, views);
      await app.close();
      app = undefined;
    }
    await writeFile(join(SHOTS, 'coverage-review.json'), `${JSON.stringify(views, null, 2)}\n`);
    const wrapped = Object.entries(views).filter(([name]) => name.includes('-1280')).flatMap(([name, v]) => {
      const lines = 'titleLines' in v ? (v as View).titleLines : v as Record<string, number>;
      return Object.entries(lines).filter(([, n]) => n > 1).map(([title, n]) => `${name}: "${title}" on ${n} lines`);
    });
    expect(wrapped).toEqual([]);
    const figures = Object.entries(views).filter(([name, v]) => name.includes('-1280') && 'figureLines' in v && (v as View).figureLines.some((n) => n > 1));
    expect(figures.map(([name, v]) => `${name}: ${(v as View).figureLines.join(', ')}`)).toEqual([]);
    const hidden = Object.entries(views).filter(([, v]) => 'seriousHidden' in v && (v as View).seriousHidden > 0).map(([name]) => name);
    expect(hidden).toEqual([]);
  }, 1_800_000);
});
