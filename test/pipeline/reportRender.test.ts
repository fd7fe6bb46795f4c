/**
 * The report opens in a browser: headless Chromium renders the tank-levels report, every section
 * is there with its heading, every figure draws, nothing outside the file is requested, no console
 * error appears, and nothing is wider than the page. A screenshot is kept for a person to look at
 * (test-artifacts/screens/report.png). Fails with what to install where no Chromium is found (test/support/chromiumPath.ts).
 *
 * The report carries an invented retune map (test/figures/syntheticRetuneMap.ts, drawing data, not
 * a result): drawn as a figure with its legend and axis titles, the table under it. Printed (CSS
 * print media at the A4 text width, then Chromium's PDF writer): the cautions sit on the first page,
 * figures and tables are never split, nothing is wider than the paper.
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
import type { RetuneMapResult } from '../../src/pipeline/retuneMaps';
import { syntheticRetuneMap } from '../figures/syntheticRetuneMap';

/** The invented map in the pipeline's result shape (labels as the pipeline writes them, "K_c" not "K_{c}"). */
function inventedMap(): RetuneMapResult {
  const m = syntheticRetuneMap();
  return {
    candidate: 'gentle gain', features: 'polynomial degree 2', notes: ['Invented for the rendering test.'], presentController: m.presentController,
    axes: [{ parameter: 'form.loops.0.proportionalGain', label: 'proportional gain K_c (%/°C)', values: [...m.axes[0].values] }, { parameter: 'form.loops.0.integralTimeSeconds', label: 'integral time T_i (s)', values: [...m.axes[1].values] }],
    points: m.points.map((p) => ({ ...p, coordinates: [...p.coordinates], interval: p.interval && [p.interval[0], p.interval[1]], occupancyShift: 1, route: 'closedForm' as never })),
    best: m.best && { ...m.best, coordinates: [...m.points[m.best.index].coordinates] },
  };
}

// A4 is 210 × 297 mm (ISO 216); the report's @page margins are 16 mm top/bottom and 14 mm left/right
// (reportStyles.ts), leaving 182 × 265 mm; at 96 CSS px per inch (CSS Values §6.2) that is 687.9 × 1001.6 px.
const A4_TEXT_PX = { width: Math.floor((182 / 25.4) * 96), height: Math.floor((265 / 25.4) * 96) };

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
    project, projectFile: 'tank-levels.spcritic', evaluation: evaluation.value, assessment: assessment.value, assessmentProblems: [], retuneMaps: [inventedMap()], retuneMapProblems: [],
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

  // A value read beside its interval carries the interval's precision ("8.36 [6.58, 10.34]", not
  // "8.3582 [6.581, 10.34]"), and its standard error goes to the same place, so a row reads at one precision
  // and the report writes the s.e. as the app and the terminal do (JCGM 100, the GUM, §7.2.2: a value and its
  // uncertainty at one decimal place — common practice). The statistics of the columns show four digits, as the app's table.
  it('writes each J and difference at the precision of its interval, the column statistics to four digits, the baseline by its glossary name', async () => {
    const page = await browser.newPage({ viewport: { width: 1040, height: 1400 } });
    await page.goto(`file://${file}`, { waitUntil: 'load' });
    const decimals = (text: string) => (text.match(/\.(\d+)/)?.[1].length ?? 0);
    const rows = await page.$$eval('#comparison > table:first-of-type tbody tr', (all) => all.map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent?.trim() ?? '')));
    expect(rows.length).toBe(4); // two candidates, the baseline, the logged return once (its runs' ends weigh too little for a completed row)
    for (const [name, j, se, percentile, basic, vsToday, difference] of rows) {
      const ends = percentile.slice(1, -1).split(', ');
      expect(decimals(j), `${name}: J ${j} beside ${percentile}`).toBe(decimals(ends[0]));
      expect(decimals(ends[1]), `${name}: ${percentile}`).toBe(decimals(ends[0]));
      expect(basic).toMatch(/^\[−?\d/);
      expect(decimals(se), `${name}: s.e. ${se} beside J ${j}`).toBe(decimals(j));
      if (vsToday) expect(decimals(vsToday), `${name}: ${vsToday} beside ${difference}`).toBe(decimals(difference.slice(1).split(', ')[0]));
    }
    const statistics = await page.$$eval('#data table td.num', (all) => all.map((td) => td.textContent?.trim() ?? ''));
    expect(statistics.length).toBeGreaterThan(8);
    for (const v of statistics) expect(v.replace(/e.*$/, '').replace(/[−.]/g, '').replace(/^0+/, '').length, v).toBeLessThanOrEqual(4);
    // The baseline's column is named as the app's glossary names it (renderer help/glossary.ts), not "logged controller".
    expect(await page.locator('#diagnostics > table').first().locator('thead th').last().innerText()).toBe('present controller'); // the first table; the findings table follows under Warnings
    // The range to report, the number a design review carries forward where the classes are not settled, one per candidate.
    const range = await page.$$eval('#diagnostics table tbody tr', (all) => all.map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent?.trim() ?? '')).find((r) => r[0].startsWith('Range to report')));
    expect(range?.slice(1, 3)).toEqual([expect.stringMatching(/^\[\d+\.\d+, \d+\.\d+\]$/), expect.stringMatching(/^\[\d+\.\d+, \d+\.\d+\]$/)]);
    await page.close();
  });

  it('draws the retune map as a figure with legend and axis titles, the table under it', async () => {
    const page = await browser.newPage({ viewport: { width: 1040, height: 1400 } });
    await page.goto(`file://${file}`, { waitUntil: 'load' });
    const figure = page.locator('#fig-retune-map-0');
    const text = await figure.locator('svg').evaluate((svg) => [...svg.querySelectorAll('text')].map((t) => t.textContent ?? '').join('|'));
    for (const words of ['proportional gain K', '(%/°C)', 'integral time T', '(s)', 'best supported point', 'beyond the logs: not supported', 'thin logs (caution)', 'discounted cost']) expect(text).toContain(words);
    expect(await figure.locator('figcaption').innerText()).toMatch(/^Figure \d+\. Retune map of gentle gain: .*hatched: not supported by the logs.*Advisory offline estimate/s);
    // The accessible fallback: the same numbers as a table right after the figure.
    expect(await figure.evaluate((f) => f.nextElementSibling?.nextElementSibling?.tagName)).toBe('TABLE');
    expect(await figure.locator('svg').getAttribute('aria-label')).toMatch(/^Heat map of J, discounted cost/);
    await figure.screenshot({ path: join(screens, 'report-retune-map.png') });
    await page.close();
  });

  // From the last look at the screens: a slice figure's right axis title ("policy density") at the figure's edge,
  // the summary and caution boxes wrapping at 78ch inside a wider box, the Job table's row heads on a heavier rule
  // than their values. Measured in the page at both window widths the review uses and at the A4 text width.
  it.each([1280, 1920, A4_TEXT_PX.width])('at %i px every figure\'s text lies inside its figure, boxed text fills its box, and the Job table\'s rules line up', async (width) => {
    const page = await browser.newPage({ viewport: { width, height: 1400 } });
    await page.goto(`file://${file}`, { waitUntil: 'load' });
    const outside = await page.$$eval('figure svg', (svgs) => svgs.flatMap((svg) => {
      const box = svg.getBoundingClientRect();
      return [...svg.querySelectorAll('text')].filter((t) => (t.textContent ?? '').trim() !== '').map((t) => ({ text: t.textContent, r: t.getBoundingClientRect() }))
        .filter(({ r }) => r.left < box.left - 0.5 || r.right > box.right + 0.5 || r.top < box.top - 0.5 || r.bottom > box.bottom + 0.5)
        .map(({ text, r }) => `${svg.id}: "${text}" [${r.left.toFixed(1)}, ${r.right.toFixed(1)}] in [${box.left.toFixed(1)}, ${box.right.toFixed(1)}]`);
    }));
    expect(outside).toEqual([]);
    const slack = await page.$$eval('.summary p, .cautions li, .cautions-first p, .cautions-first li', (all) => all.map((el) => {
      const box = el.closest('.summary, .cautions, .cautions-first')!, style = getComputedStyle(box), b = box.getBoundingClientRect();
      const inner = b.right - parseFloat(style.borderRightWidth) - parseFloat(style.paddingRight);
      return inner - el.getBoundingClientRect().right;
    }));
    expect(slack.length).toBeGreaterThan(3);
    for (const gap of slack) expect(gap).toBeLessThan(1); // each paragraph reaches its box's inner edge
    const rules = await page.$$eval('#job table tbody tr', (rows) => rows.map((tr) => [...tr.children].map((cell) => {
      const r = cell.getBoundingClientRect(), style = getComputedStyle(cell);
      return `${r.bottom.toFixed(2)} ${style.borderBottomWidth} ${style.borderBottomColor}`; // a collapsed border: its place, width and colour
    })));
    expect(rules.length).toBeGreaterThan(4);
    for (const row of rules) expect(new Set(row).size, row.join(' ')).toBe(1); // one rule, at one height, across the row
    await page.close();
  });

  it('prints on A4 with the cautions on the first page and no figure or table split', async () => {
    const page = await browser.newPage({ viewport: A4_TEXT_PX });
    await page.goto(`file://${file}`, { waitUntil: 'load' });
    await page.emulateMedia({ media: 'print' });
    const cautions = (await page.locator('#read-first').boundingBox())!;
    expect(cautions.y + cautions.height).toBeLessThan(A4_TEXT_PX.height);
    expect(await page.locator('#read-first').innerText()).toMatch(/advisory estimates.*design review and commissioning.*local codes and licensed practice/s);
    const breaks = await page.$$eval('figure, table', (all) => [...new Set(all.map((e) => getComputedStyle(e).breakInside))]);
    expect(breaks).toEqual(['avoid']);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(A4_TEXT_PX.width);
    const pdf = await page.pdf({ printBackground: true, preferCSSPageSize: true });
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const pages = pdf.toString('latin1').match(/\/Type\s*\/Page(?!s)/g) ?? [];
    expect(pages.length).toBeGreaterThan(3);
    await writeFile(join(screens, 'report.pdf'), pdf);
    await page.close();
  });
});
