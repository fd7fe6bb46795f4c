/**
 * The report opens in a browser: headless Chromium renders the tank-levels report, every section
 * is there with its heading, every figure draws, nothing outside the file is requested, no console
 * error appears, and nothing is wider than the page. A screenshot is kept for a person to look at
 * (test-artifacts/screens/report.png). Fails with what to install where no Chromium is found (test/support/chromiumPath.ts).
 */
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assessProject } from '../../src/pipeline/assessProject';
import { evaluateProject } from '../../src/pipeline/evaluateProject';
import { openProject } from '../../src/pipeline/openProject';
import { requireChromium } from '../support/chromiumPath';
import { REPORT_SECTIONS, renderReport } from '../../src/pipeline/report/reportDocument';

const root = join(__dirname, '..', '..');
const screens = join(root, 'test-artifacts', 'screens');

async function tankReport(): Promise<string> {
  const folder = join(root, 'sample-projects', 'tank-levels');
  const opened = await openProject(await readFile(join(folder, 'tank-levels.spcritic'), 'utf8'), 'tank-levels.spcritic', async (p) => new Uint8Array(await readFile(join(folder, p))));
  if (!opened.ok) throw new Error('open failed');
  const { project, dataset, imported } = opened.value;
  const evaluation = await evaluateProject({ project, dataset, now: () => new Date('2026-01-01T00:00:00Z') });
  const assessment = await assessProject({ project, dataset, settings: { resamples: 200, level: 0.9, seed: 1, sensitivity: true } });
  if (!evaluation.ok || !assessment.ok) throw new Error('pipeline failed');
  return renderReport({
    project, projectFile: 'tank-levels.spcritic', evaluation: evaluation.value, assessment: assessment.value, assessmentProblems: [], retuneMaps: [], retuneMapProblems: [],
    data: { summary: imported.summary, episodeReport: imported.episodeReport }, generatedAt: '2026-01-01T00:00:00.000Z',
  });
}

describe('the report in headless Chromium', () => {
  let browser: Browser;
  const file = join(screens, 'report.html');
  beforeAll(async () => {
    await mkdir(screens, { recursive: true });
    await writeFile(file, await tankReport(), 'utf8');
    browser = await chromium.launch({
      executablePath: requireChromium(),
      args: ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
  });
  afterAll(async () => browser?.close());

  it('renders every section and figure, loads nothing from outside, and keeps a screenshot', async () => {
    const page = await browser.newPage({ viewport: { width: 1040, height: 1400 } });
    const requests: string[] = [], failed: string[] = [], errors: string[] = [];
    page.on('request', (r) => requests.push(r.url()));
    page.on('requestfailed', (r) => failed.push(r.url()));
    page.on('console', (m) => { if (m.type() === 'error') errors.push(m.text()); });
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(`file://${file}`, { waitUntil: 'load' });
    for (const id of REPORT_SECTIONS) {
      expect(await page.locator(`section#${id} > h2`).isVisible(), `section ${id}`).toBe(true);
    }
    const figures = await page.$$eval('figure', (all) => all.map((f) => {
      const svg = f.querySelector('svg')?.getBoundingClientRect();
      return { drawn: Boolean(svg && svg.width > 100 && svg.height > 50), captioned: /^Figure \d+\./.test(f.querySelector('figcaption')?.textContent ?? '') };
    }));
    expect(figures.length).toBeGreaterThanOrEqual(9);
    expect(figures.every((f) => f.drawn && f.captioned)).toBe(true);
    const images = await page.$$eval('figure[id^="fig-surface"] svg image', (all) => all.length);
    expect(images).toBe(4); // per candidate's value surface: the grid and the colour ramp
    expect(requests.filter((u) => !u.startsWith('file://') && !u.startsWith('data:'))).toEqual([]);
    expect(failed).toEqual([]);
    expect(errors).toEqual([]);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(1040);
    await page.screenshot({ path: join(screens, 'report.png'), fullPage: true });
    await page.close();
  });
});
