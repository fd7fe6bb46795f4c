/**
 * The Coverage panel's findings matrix on the heating-loop sample (e2e): a real table with a caption
 * and headers, every mark in words, each linked to a sentence that exists (or to a candidate's name in a
 * sentence said of several candidates); a policy's group open
 * exactly when it holds a serious finding; a link into a folded group opens it and puts the focus on
 * the sentence; the report's Diagnostics carries the same matrix. The pictures are taken first, so
 * they show the groups as the app first opens them. Pictures of the panel, the whole
 * Findings page and the report's section in both themes at 1280 × 800 and 1920 × 1080 go to
 * test-artifacts/screen-review/ (or SCREEN_REVIEW_DIR), with the page heights in coverage-heights.json.
 */
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POLL } from './harness/poll';
import { openAllFindings, runToFindingsWithMap } from './harness/findingsSections';
import { openSample } from './harness/openSample';
import { launchApp, type LaunchedApp } from './harness/launch';
import { UNSTICK } from './harness/unstick';
import { shootSection } from './harness/sectionShot';
import { cutTextFindings, cutTextLine } from './harness/cutText';
import { steadyClick } from './harness/steadyActions';
import { setTheme } from '../renderer/e2e/appSteps';

const SHOTS = process.env.SCREEN_REVIEW_DIR ?? resolve(__dirname, '../../test-artifacts/screen-review');
const SIZES = [{ width: 1280, height: 800 }, { width: 1920, height: 1080 }];
const MARK = /^(serious|caution)( \(\d+\))?$|^—$/;

describe('the findings matrix on the Coverage panel (e2e)', () => {
  let app: LaunchedApp;
  beforeAll(async () => {
    await mkdir(SHOTS, { recursive: true });
    app = await launchApp({ viewport: SIZES[0] });
    const { page } = app;
    await openSample(app, 'heating-loop');
    await runToFindingsWithMap(page); // with the retune map, as the screen review computes it, so the page's height compares with its pictures
    await openAllFindings(page);
    await page.getByTestId('finding-table').waitFor({ timeout: 60_000 });
  }, 900_000);
  afterAll(async () => {
    await app?.close();
  });

  it('is a table with a caption and headers, its marks in words, each linked to a sentence on the page', async () => {
    const table = app.page.getByTestId('finding-table');
    expect(await table.locator('caption').innerText()).toMatch(/serious, caution or — for none/);
    expect(await table.locator('thead th[scope="col"]').count()).toBeGreaterThan(2);
    expect((await table.locator('tbody th[scope="row"]').allInnerTexts())[0]).toBe('Whole log');
    const marks = await table.locator('tbody td').allInnerTexts();
    expect(marks.filter((m) => !MARK.test(m.trim()))).toEqual([]);
    expect(marks.some((m) => m.startsWith('serious'))).toBe(true); // the heating loop has serious findings (the discount sweep's, at least)
    const targets = await table.locator('a').evaluateAll((links) => links.map((a) => (a as HTMLAnchorElement).hash.slice(1)));
    expect(targets.length).toBe(marks.filter((m) => m !== '—').length);
    // A sentence, or a candidate's name in a sentence said of several candidates (pipeline/findingLines.ts).
    for (const id of targets) expect(await app.page.locator(`[data-section="coverage"] [id="${id}"]`).count(), id).toBe(1);
  });

  it('pictures of the panel, the page and the report’s section in both themes at two sizes, nothing cut', async () => {
    const { page, harness } = app, faults: string[] = [], heights: Record<string, number> = {};
    for (const size of SIZES) {
      await page.setViewportSize(size);
      for (const theme of ['light', 'dark']) {
        await setTheme(page, theme);
        const name = `heating-loop-${size.width}-${theme}`;
        faults.push(...await shootSection(page, page.locator('[data-section="coverage"]'), join(SHOTS, `${name}-coverage-matrix.png`), UNSTICK));
        await page.getByTestId('finding-table').screenshot({ path: join(SHOTS, `${name}-finding-table.png`) });
        await page.screenshot({ path: join(SHOTS, `${name}-findings-page.png`), fullPage: true, style: UNSTICK });
        heights[`${name} page`] = await page.evaluate(() => document.documentElement.scrollHeight);
        heights[`${name} coverage`] = await page.locator('[data-section="coverage"]').evaluate((e) => Math.round(e.getBoundingClientRect().height));
        heights[`${name} matrix`] = await page.getByTestId('finding-table').evaluate((e) => Math.round(e.getBoundingClientRect().height));
        for (const f of await cutTextFindings(page, '[data-section="coverage"]')) faults.push(cutTextLine(`coverage ${size.width} ${theme}`, f));
        // The matrix never runs past its card.
        const spill = await page.locator('[data-section="coverage"]').evaluate((card) => (card.querySelector('table.finding-table')?.getBoundingClientRect().right ?? 0) - card.getBoundingClientRect().right);
        if (spill > 0) faults.push(`coverage ${size.width} ${theme}: the matrix runs ${spill.toFixed(0)} px past its card`);
      }
    }
    await page.setViewportSize(SIZES[0]);
    await setTheme(page, 'light');
    const report = join(harness.workFolder, 'heating-loop-report.html');
    harness.dialogs.nextExport = report;
    await steadyClick(page.getByTestId('write-report'));
    await page.getByTestId('report-status').getByText('Saved').waitFor({ timeout: 60_000 });
    const html = await readFile(report, 'utf8');
    expect(html).toMatch(/<section id="diagnostics">(?:(?!<\/section>).)*<table class="finding-table">/s);
    const view = await page.context().newPage();
    for (const size of SIZES) {
      await view.setViewportSize(size);
      await view.setContent(html);
      await view.locator('#diagnostics').screenshot({ path: join(SHOTS, `heating-loop-report-${size.width}-findings.png`) });
      for (const f of await cutTextFindings(view, '#diagnostics')) faults.push(cutTextLine(`report ${size.width}`, f));
      const wide = await view.evaluate(() => (document.querySelector('table.finding-table')?.getBoundingClientRect().right ?? 0) - document.documentElement.clientWidth);
      if (wide > 1) faults.push(`report ${size.width}: the matrix runs ${wide.toFixed(0)} px past the page`);
    }
    await view.close();
    await writeFile(join(SHOTS, 'coverage-heights.json'), `${JSON.stringify(heights, null, 2)}\n`);
    expect(faults).toEqual([]);
  }, 600_000);
  it('opens a group when it holds a serious finding, folds it to its count otherwise, and a mark opens and focuses its sentence', async () => {
    const { page } = app;
    const groups = await page.locator('[data-section="coverage"] details.finding-group').evaluateAll((ds) => ds.map((d) => ({
      open: (d as HTMLDetailsElement).open, summary: d.querySelector('summary')?.textContent ?? '', id: d.getAttribute('data-testid') ?? '',
    })));
    expect(groups.length).toBeGreaterThan(0);
    for (const g of groups) expect(g.open, g.summary).toBe(/\d+ serious/.test(g.summary));
    // The summary's count agrees with the sentences in the group and the shared sentences that name it.
    for (const g of groups) {
      const row = g.id === 'coverage-present' ? 'present' : `candidate-${g.id.replace('coverage-', '')}`;
      const items = [...await page.getByTestId(g.id).locator('.problems li').allTextContents(), ...await page.locator('[data-testid="coverage-shared"] li')
        .evaluateAll((lis, r) => lis.flatMap((li) => [...li.querySelectorAll(`span[id^="finding-${r}-"]`)].map(() => li.textContent ?? '')), row)];
      const serious = items.filter((t) => t.startsWith('Serious')).length, cautions = items.length - serious;
      const said = `${serious ? `${serious} serious` : ''}${serious && cautions ? ', ' : ''}${cautions ? `${cautions} caution${cautions === 1 ? '' : 's'}` : ''}` || 'no findings';
      expect(g.summary).toContain(said);
    }
    const folded = groups.find((g) => !g.open && !g.summary.includes('no findings'));
    if (!folded) return; // every group with findings holds a serious one: nothing folded to open
    const row = folded.id === 'coverage-present' ? 'present' : `candidate-${folded.id.replace('coverage-', '')}`;
    const link = page.locator(`[data-testid="finding-row-${row}"] a`).first();
    const target = (await link.evaluate((a) => (a as HTMLAnchorElement).hash)).slice(1);
    await steadyClick(link);
    await expect.poll(() => page.getByTestId(folded.id).evaluate((d) => (d as HTMLDetailsElement).open), POLL).toBe(true);
    await expect.poll(() => page.evaluate(() => document.activeElement?.id), POLL).toBe(target);
  });
});
