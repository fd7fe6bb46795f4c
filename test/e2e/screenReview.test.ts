/**
 * The screen review: every step, the glossary and every export of four projects (the heating-loop
 * and tank-levels samples, tank-levels again with the Estimator step set to a small network, and an
 * invented two-valve log with clipped, correlated dithers: test/fixtures/screens/twoValveBlend.ts) in
 * both themes at 1280 × 800 and 1920 × 1080, written to test-artifacts/screen-review/ (or
 * SCREEN_REVIEW_DIR) to be looked at. Besides the pictures it checks what a person would trip on that a
 * measurement can see: no text cut off, run out of its box or lying over other text on any step, page of
 * the help or the report, by the rule of harness/cutText.ts (which is checked to see the select cut that
 * only a look at a picture had found), no chart blank in a card's picture
 * (harness/sectionShot.ts), the two-action caution shown where the log has it, the report's tables
 * inside its page, every function-class verdict with its reason, the range-cut note written with the
 * tables' minus sign, a network project's differences and ranking, and each number said once by one
 * writer (the values chart's one title, the horizon's precision, the unvisited share, a limit's chance,
 * a tuning value as its axis labels it), the answer table naming the cautions the whole-log list holds
 * about a candidate, and a converged fit's tolerance kept in its details (both from the polish21 capture).
 */
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { POLL } from './harness/poll';
import { openAllFindings } from './harness/findingsSections';
import { openSample } from './harness/openSample';
import { launchApp, type LaunchedApp } from './harness/launch';
import { UNSTICK } from './harness/unstick';
import { shootSection } from './harness/sectionShot';
import { goToStep, setTheme } from '../renderer/e2e/appSteps';
import { writeTwoValveBlendProject } from '../fixtures/screens/twoValveBlend';
import { VALUES_CHART_TITLE } from '../../src/figures/parts/plotTheme';
import { steadyCheck, steadyClick, steadyFill, steadySelect } from './harness/steadyActions';
import { UNIT_GROUP_MOST } from '../../src/core/unitGroups';
import { cutTextFindings, cutTextLine } from './harness/cutText';
import { layoutFaults, svgLayoutIn } from './harness/svgLayout';
import { brokenFormulas } from './harness/formulaWrap';
import { formulaText, HORIZON_FORMULA } from '../../src/core/formulaText';

/** The formulas the app writes into running text, each held on one line (core/formulaText.ts). */
const FORMULAS = [`(${HORIZON_FORMULA})`, HORIZON_FORMULA, formulaText('0 < γ < 1')];

const SHOTS = process.env.SCREEN_REVIEW_DIR ?? resolve(__dirname, '../../test-artifacts/screen-review');
const SIZES = [{ width: 1280, height: 800 }, { width: 1920, height: 1080 }];
const STEPS = ['plant-log', 'candidates', 'estimator', 'run', 'findings'] as const;
const FIGURES = ['comparison', 'surface', 'slice', 'convergence', 'sensitivity', 'retuneMap'] as const;

async function shoot(page: Page, name: string): Promise<void> {
  // Charts are drawn by a worker, and a slice or surface is computed first ("Computing the slice…"): wait for both (a while, without failing).
  await page.waitForFunction(() => document.querySelectorAll('.plot-placeholder').length === 0
    && [...document.querySelectorAll('figure[data-chart-state]')].every((f) => f.getAttribute('data-chart-state') !== 'waiting'), null, { timeout: 30_000 }).catch(() => undefined);
  await page.screenshot({ path: join(SHOTS, `${name}.png`), fullPage: true, style: UNSTICK });
}

/**
 * In the comparison card (its table's name columns and the ranking under it): every number and the unit
 * after it that wrap onto two lines ("PI (25 | %/K, 30 | min)"), read as core/unitGroups.ts reads a unit,
 * and the table running past its card. Each line of a group's text has its own box (Range.getClientRects).
 */
function comparisonNameFaults(page: Page): Promise<string[]> {
  return page.evaluate((most) => {
    const card = document.querySelector('[data-section="comparison"]');
    const table = card?.querySelector('[data-testid="comparison-table"]');
    if (!card || !table) return ['the comparison card or its table is not shown'];
    const faults: string[] = [];
    const spill = table.getBoundingClientRect().right - card.getBoundingClientRect().right;
    if (spill > 0) faults.push(`the comparison table runs ${spill.toFixed(0)} px past its card`);
    const group = new RegExp(`\\d+(?:\\.\\d+)?[ \u00a0][\\p{L}%‰°µΩ′″][^\\s,;:)\\]}]{0,${most - 1}}(?=[\\s,;:)\\]}]|$)`, 'gu');
    const boxes = [...table.querySelectorAll('tbody td:nth-child(-n+2)'), ...card.querySelectorAll('[data-testid="ranking"] p, [data-testid="ranking"] li')];
    for (const box of boxes) {
      const walker = document.createTreeWalker(box, NodeFilter.SHOW_TEXT);
      for (let node = walker.nextNode(); node; node = walker.nextNode()) {
        for (const m of node.textContent!.matchAll(group)) {
          const range = document.createRange();
          range.setStart(node, m.index!);
          range.setEnd(node, m.index! + m[0].length);
          const lines = [...range.getClientRects()].filter((r) => r.width > 0);
          if (lines.some((r) => r.top >= lines[0].bottom - 1)) faults.push(`"${m[0].replace(/\u00a0/g, ' ')}" wraps inside “${(box.textContent ?? '').replace(/\u00a0/g, ' ').slice(0, 60)}”`);
        }
      }
    }
    return faults;
  }, UNIT_GROUP_MOST);
}

interface Case { id: string; open: (app: LaunchedApp) => Promise<string>; retuneMap: boolean; twoActions: boolean; network?: boolean }

/**
 * The tank-levels sample with the Estimator step's approximator set to a small network, as an engineer
 * would set it: its differences from the present controller, shares, ranking and trial now come from
 * the network's own resamples. Small on purpose (one layer of 8, few iterations) to keep the capture
 * quick; the accuracy of network fits is tested in test/core/fqe/network*.test.ts and the battery.
 */
async function openTankNetwork(app: LaunchedApp): Promise<string> {
  const path = await openSample(app, 'tank-levels'), { page } = app;
  await goToStep(page, 'estimator');
  await steadyCheck(page.getByLabel('Neural network'));
  await steadyFill(page.getByLabel('Hidden layers'), '8');
  await page.getByLabel('Hidden layers').blur();
  for (const [label, value] of [['Most outer iterations', '15'], ['Gradient steps per outer iteration', '25'], ['Batch size', '256']] as const) {
    const field = page.getByLabel(label, { exact: true });
    await steadyFill(field, value);
    await field.blur();
  }
  return path;
}

const CASES: Case[] = [
  { id: 'heating-loop', open: (app) => openSample(app, 'heating-loop'), retuneMap: true, twoActions: false },
  { id: 'tank-levels', open: (app) => openSample(app, 'tank-levels'), retuneMap: false, twoActions: false },
  { id: 'tank-network', open: openTankNetwork, retuneMap: false, twoActions: false, network: true },
  {
    id: 'two-valve', retuneMap: false, twoActions: true,
    async open(app) {
      const path = await writeTwoValveBlendProject(app.harness.workFolder);
      app.harness.dialogs.nextOpenProject = path;
      await steadyClick(app.page.getByTestId('open-project'));
      await app.page.getByTestId('import-summary').waitFor({ timeout: 60_000 });
      return path;
    },
  },
];

describe.each(CASES)('screens and exports of $id (e2e)', (c) => {
  let app: LaunchedApp;
  const faults: string[] = [];
  beforeAll(async () => {
    await mkdir(SHOTS, { recursive: true });
    app = await launchApp({ viewport: SIZES[0] });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('runs with the assessment', async () => {
    const { page } = app;
    await c.open(app);
    await goToStep(page, 'run');
    await steadyClick(page.getByTestId('run-evaluation'));
    await page.getByTestId('run-finished').waitFor({ timeout: 240_000 });
    await goToStep(page, 'findings');
    if (c.retuneMap) {
      await steadyClick(page.getByTestId('compute-retune-map'));
      await page.getByTestId('retune-map-headline').waitFor({ timeout: 300_000 });
    }
    await page.getByTestId('answer-rule').waitFor({ timeout: 300_000 });
    await openAllFindings(page);
    await expect.poll(() => page.locator('[data-section][data-open="false"]').count(), POLL).toBe(0);
    if (c.id === 'heating-loop') {
      // The discount sweep's values that cannot be right are crossed and named (assessSweepCheck.ts; every logged cost is positive, so J can only grow with γ).
      await expect.poll(() => page.getByTestId('sensitivity-crossed').innerText(), POLL).toMatch(/J of “PI with a 2\s%\/min rate limit” at 0\.966 and 0\.975\. .* cannot both be right/); // \s: the name's number held to its unit (U+00A0)
      await expect.poll(() => page.getByTestId('sensitivity-verdict').innerText(), POLL).toContain('left out: 0.966, 0.975');
    }
    if (c.network) {
      // A network project is compared with the present controller on its own resamples (before: no differences at all).
      await expect.poll(() => page.getByTestId('value-table').innerText(), POLL).toMatch(/network|TensorFlow/i);
      expect(await page.locator('[data-testid^="difference-row-"]').count()).toBeGreaterThan(0);
      await expect.poll(() => page.getByTestId('ranking').innerText(), POLL).toMatch(/\d\s%/);
    }
  }, 600_000);

  it('every step and the glossary, both themes, both sizes', async () => {
    const { page } = app;
    for (const size of SIZES) {
      await page.setViewportSize(size);
      for (const theme of ['light', 'dark']) {
        await setTheme(page, theme);
        for (const step of STEPS) {
          await goToStep(page, step);
          await expect.poll(() => page.getByTestId(`step-${step}`).getAttribute('aria-selected'), POLL).toBe('true');
          if (step === 'findings') await openAllFindings(page);
          await shoot(page, `${c.id}-${size.width}-${theme}-${step}`);
          // At 1920 px the project's name (the samples' are under 60 characters) is shown whole: the toolbar has the room.
          if (size.width === 1920 && !(await page.getByTestId('project-title').evaluate((e) => e.scrollWidth <= e.clientWidth))) faults.push(`${step} 1920 ${theme}: the project name is cut with room to spare`);
          // Each Findings section on its own as well, at a size the eye can read.
          // The reward panel (declared floor and ceiling of a cost column) on its own, at a size the eye can read.
          if (step === 'plant-log') await page.locator('section[aria-labelledby="reward-heading"]').screenshot({ path: join(SHOTS, `${c.id}-${size.width}-${theme}-plant-log-reward.png`), style: UNSTICK });
          if (step === 'findings') {
            // A candidate's name wraps between its groups in the narrow comparison card, never inside "25 %/K" (core/unitGroups.ts).
            for (const f of await comparisonNameFaults(page)) faults.push(`findings ${size.width} ${theme}: ${f}`);
            for (const section of await page.locator('[data-section]').all()) {
              const shot = join(SHOTS, `${c.id}-${size.width}-${theme}-findings-${await section.getAttribute('data-section')}.png`);
              faults.push(...await shootSection(page, section, shot, UNSTICK));
            }
          }
          // A "Next: …" button names the step the list calls by that name (the Method step's button said "estimator").
          const titles = (await page.locator('nav.steps .step-title').allInnerTexts()).map((t) => t.trim().toLowerCase());
          for (const next of await page.locator('button[data-testid^="next-"]').allInnerTexts()) {
            const named = next.replace(/^Next:\s*/, '').trim().toLowerCase();
            if (!titles.some((t) => t.startsWith(named))) faults.push(`${step}: button "${next}" names no step (${titles.join(', ')})`);
          }
          // No text a person sees cut off, run out of its box or lying over other text (harness/cutText.ts).
          for (const f of await cutTextFindings(page)) faults.push(cutTextLine(`${c.id} ${step} ${size.width} ${theme}`, f));
          for (const f of await brokenFormulas(page, FORMULAS)) faults.push(`${c.id} ${step} ${size.width} ${theme}: ${f}`);
        }
        await steadyClick(page.getByTestId('open-help'));
        await page.getByTestId('glossary').waitFor();
        // The help is a panel over the window that scrolls on its own: the window, then the panel page by page.
        await page.evaluate(() => scrollTo(0, 0));
        const panel = page.getByTestId('help-panel');
        const pages = await panel.evaluate((p) => Math.min(8, Math.ceil(p.scrollHeight / p.clientHeight)));
        for (let i = 0; i < pages; i++) {
          await panel.evaluate((p, k) => { p.scrollTop = k * p.clientHeight; }, i);
          await page.screenshot({ path: join(SHOTS, `${c.id}-${size.width}-${theme}-help-${i + 1}.png`) });
          // Page by page: text scrolled out of the panel is not seen, so not checked for overlaps.
          for (const f of await cutTextFindings(page, '[data-testid="help-panel"]')) faults.push(cutTextLine(`${c.id} help ${i + 1} ${size.width} ${theme}`, f));
          for (const f of await brokenFormulas(page, FORMULAS, '[data-testid="help-panel"]')) faults.push(`${c.id} help ${i + 1} ${size.width} ${theme}: ${f}`);
        }
        await steadyClick(page.getByTestId('close-help'));
      }
    }
    await page.setViewportSize(SIZES[0]);
    await setTheme(page, 'light');
    expect(faults).toEqual([]);
  }, 600_000);

  it('sees a select that cuts its choice (the check itself, on the case that motivated it)', async () => {
    // Until 2026-12-05 the Polynomial part's first choice read "Chosen from the log (degree 2 or 4)" and the select cut it at
    // both sizes, seen only in the pictures: that text put back, harness/cutText.ts must report it (the rule's adoption test, a).
    if (!c.network) return;
    const { page } = app, select = page.getByTestId('polynomial-degree');
    await goToStep(page, 'estimator');
    const shown = await select.evaluate((e: HTMLSelectElement) => e.options[e.selectedIndex].text);
    await select.evaluate((e: HTMLSelectElement) => { e.options[e.selectedIndex].text = 'Chosen from the log (degree 2 or 4)'; });
    const findings = await cutTextFindings(page);
    await select.evaluate((e: HTMLSelectElement, text) => { e.options[e.selectedIndex].text = text; }, shown);
    expect(findings.filter((f) => f.kind === 'select').map((f) => f.text)).toEqual(['Polynomial part [polynomial-degree]: Chosen from the log (degree 2 or 4)']);
  });

  it('names the dependence of the two dithers where the log shows it', async () => {
    const { page } = app;
    await goToStep(page, 'candidates');
    await page.getByTestId('behaviour-model').waitFor({ timeout: 60_000 });
    await expect.poll(() => page.getByTestId('dither-dependence').count(), POLL).toBe(c.twoActions ? 1 : 0);
    if (c.twoActions) {
      await expect.poll(() => page.getByTestId('dither-dependence').innerText(), POLL).toMatch(/hot_valve_pct and cold_valve_pct move together \(correlation 0\.\d\d/);
      await goToStep(page, 'findings');
      // Under Coverage it is the present controller's caution (pipeline/findingMatrix.ts), its group folded to its count: its mark in the findings table opens it.
      await expect.poll(() => page.getByTestId('finding-row-present').innerText(), POLL).toMatch(/caution/);
      await steadyClick(page.getByTestId('finding-row-present').getByRole('link').first());
      await expect.poll(() => page.getByTestId('findings-grid').innerText(), POLL).toContain('move together');
      // The answer names a trial here (no serious warning for it) and says the log's cautions beside it.
      await expect.poll(() => page.getByTestId('answer-log-cautions').innerText(), POLL).toMatch(/cautions? on the whole log/);
    }
  });

  it('names the feature sweep’s gap and why, and shows that sweep’s panel in both themes', async () => {
    // The panel opens on the discount sweep, so the pictures above never showed the feature sweep: on the
    // heating-loop sample the rate-limited PI's degree-4 fit diverges, and the sweep says so under the figure
    // (figures/charts/sensitivity.ts unconvergedPointsSentence) rather than leaving the gap unexplained.
    if (c.id !== 'heating-loop') return;
    const { page } = app;
    await goToStep(page, 'findings');
    await openAllFindings(page);
    await steadySelect(page.getByTestId('sensitivity-curve'), '1');
    await expect.poll(() => page.getByTestId('sensitivity-verdict').innerText(), POLL).toMatch(/^The ranking is the same at every setting\.$/);
    await expect.poll(() => page.getByTestId('sensitivity-unconverged').innerText(), POLL).toMatch(/^No J where the fit at that setting failed or did not converge: “PI with a 2[\s\u00a0\u202f]%\/min rate limit” at 4 \(diverged\); the line has a gap there/);
    const faults: string[] = [];
    // The choice shows whole: at 17rem the select cut "polynomial degree of the features" to "…of the feat".
    const cut = await page.getByTestId('sensitivity-curve').evaluate((select: HTMLSelectElement) => {
      const style = getComputedStyle(select), context = document.createElement('canvas').getContext('2d')!;
      context.font = `${style.fontWeight} ${style.fontSize} ${style.fontFamily}`;
      const room = select.clientWidth - parseFloat(style.paddingLeft) - parseFloat(style.paddingRight) - 16; // 16 px: the drop-down arrow (a browser's own; ours, measured by eye)
      return [...select.options].filter((o) => context.measureText(o.text).width > room).map((o) => o.text);
    });
    if (cut.length) faults.push(`sensitivity: the setting's select cuts ${cut.join(', ')}`);
    for (const size of SIZES) {
      await page.setViewportSize(size);
      for (const theme of ['light', 'dark']) {
        await setTheme(page, theme);
        faults.push(...await shootSection(page, page.locator('[data-section="sensitivity"]'), join(SHOTS, `${c.id}-${size.width}-${theme}-findings-sensitivity-degree.png`), UNSTICK));
      }
    }
    await page.setViewportSize(SIZES[0]);
    await setTheme(page, 'light');
    await steadySelect(page.getByTestId('sensitivity-curve'), '0');
    expect(faults).toEqual([]);
  });

  it('says why each function-class verdict is settled or not, and writes the range-cut note’s numbers as the tables do', async () => {
    const { page } = app;
    await goToStep(page, 'findings');
    await openAllFindings(page);
    // Every candidate compared across classes says why (a settled verdict's too-uncertain classes were shown on the command line only).
    const lines = await page.locator('[data-testid^="classes-"]:not([data-testid^="classes-reason-"])').count();
    expect(await page.locator('[data-testid^="classes-reason-"]').count()).toBe(lines);
    for (const reason of await page.locator('[data-testid^="classes-reason-"]').allInnerTexts()) expect(reason).toMatch(/^[A-Z]/);
    const cuts = await page.locator('[data-testid^="range-cut-"]').allInnerTexts();
    // The two-valve log declares its cost never below 0 and a class's interval reaches below it (test/fixtures/screens/twoValveBlend.ts).
    if (c.twoActions) expect(cuts.length).toBeGreaterThan(0);
    for (const cut of cuts) expect(cut, 'a number’s minus on screen is U+2212, as in the class line above it').not.toMatch(/(^|[\s[(,])-\d/);
    for (const note of await page.getByTestId('verdict').allInnerTexts()) expect(note, 'a note after the verdict’s full stop opens a sentence').not.toMatch(/\.\s+[a-z]/);
  });

  it('names in the answer table the cautions the whole-log list holds about a candidate, and keeps a converged fit’s tolerance in its details', async () => {
    // Folded in from the polish21 capture (its pictures of the same sections are the card shots above).
    const { page } = app;
    await goToStep(page, 'findings');
    await openAllFindings(page);
    // A converged fit's account (its last change against the tolerance) is a detail: the Fit column already says "converged".
    const accounts = await page.locator('[data-testid^="policy-account-"]').evaluateAll((cells) => cells.map((cell) => {
      const copy = cell.cloneNode(true) as HTMLElement;
      copy.querySelectorAll('details').forEach((d) => d.remove());
      return { row: copy.textContent ?? '', details: cell.querySelector('details')?.textContent ?? '' };
    }));
    if (c.id === 'heating-loop') expect(accounts.length).toBeGreaterThan(0);
    for (const a of accounts) {
      // The heating-loop sample's fits all converge (the case the polish21 capture checked); elsewhere, where the details hold it, the row does not repeat it.
      if (c.id === 'heating-loop') expect(a.details).toMatch(/tolerance/);
      if (/tolerance/.test(a.details)) expect(a.row).not.toMatch(/tolerance/);
    }
    // The answer table never says "none" for a candidate while a caution about it sits in the whole-log list: under Coverage
    // that caution is in the candidate's own group (pipeline/findingMatrix.ts), which may be folded, so its text is read whole.
    const logWarnings = await page.locator('[data-section="coverage"] .problems li').allTextContents();
    const rows = await page.locator('[data-testid="answer-table"] tbody tr[data-testid^="answer-row-"]:not([data-testid="answer-row-baseline"])').all();
    for (const row of rows) {
      // The name cell holds a number to its unit by a no-break space (core/unitGroups.ts); the warnings list writes a plain one.
      const name = (await row.locator('th').innerText()).replace(/\u00a0/g, ' ').trim();
      const cell = (await row.locator('td').last().innerText()).trim();
      if (logWarnings.some((line) => line.includes(`${name}:`))) expect(cell, `${name}'s warnings cell`).not.toBe('none');
    }
  });

  it('exports every figure as PNG and SVG, the grids and tables as CSV, and the report', async () => {
    const { page, harness } = app;
    await goToStep(page, 'findings');
    await openAllFindings(page);
    const written: string[] = [], exportFaults: string[] = [];
    for (const kind of FIGURES) {
      const panel = page.getByTestId(`export-${kind}`);
      console.log(`${c.id}: ${await panel.count()} export panel(s) for ${kind}`);
      if ((await panel.count()) === 0) continue;
      await steadyClick(panel.first().locator('summary'));
      for (const format of ['png', 'svg', 'csv'] as const) {
        const button = page.getByTestId(`export-${format}-${kind}`).first();
        if ((await button.count()) === 0) continue;
        const target = join(SHOTS, `${c.id}-export-${kind}.${format}`);
        harness.dialogs.nextExport = target;
        await steadyClick(button);
        const status = panel.first().getByTestId(`export-status-${kind}`);
        await expect.poll(() => status.innerText().catch(() => 'Exporting'), { ...POLL, timeout: 60_000 }).not.toMatch(/^Exporting/);
        const said = await status.innerText();
        if (said.startsWith('Saved')) written.push(target);
        else exportFaults.push(`${kind} ${format}: ${said}`);
      }
      await steadyClick(panel.first().locator('summary'));
    }
    for (const button of await page.locator('[data-testid^="csv-"]').all()) {
      if (!(await button.isVisible())) continue; // a table folded away (the retune map's) is saved where it is shown
      const id = (await button.getAttribute('data-testid'))!.slice(4).replace(/[^\w-]+/g, '-');
      const target = join(SHOTS, `${c.id}-table-${id}.csv`);
      harness.dialogs.nextExport = target;
      await steadyClick(button);
      await expect.poll(() => readFile(target).then(() => true, () => false), POLL).toBe(true);
      written.push(target);
    }
    // Each SVG as a browser draws it, for the eye; and laid out at its pixel size (its viewBox), no text over
    // other text or off the image (harness/svgLayout.ts, the check of the plot page's exports, on the app's own files).
    const view = await page.context().newPage();
    for (const svg of written.filter((p) => p.endsWith('.svg'))) {
      const text = await readFile(svg, 'utf8'), [, widthPx, heightPx] = /viewBox="0 0 (\d+) (\d+)"/.exec(text) ?? [];
      await view.setContent(`<body style="margin:0;background:#fff">${text}</body>`);
      await view.screenshot({ path: svg.replace(/\.svg$/, '-svg.png'), fullPage: true });
      if (widthPx) exportFaults.push(...layoutFaults(await svgLayoutIn(view, text, Number(widthPx), Number(heightPx))).map((f) => `${svg}: ${f}`));
    }
    const report = join(SHOTS, `${c.id}-report.html`);
    harness.dialogs.nextExport = report;
    await steadyClick(page.getByTestId('write-report'));
    await page.getByTestId('report-status').getByText('Saved').waitFor({ timeout: 60_000 });
    const html = await readFile(report, 'utf8');
    for (const size of SIZES) {
      await view.setViewportSize(size);
      await view.setContent(html);
      await view.screenshot({ path: join(SHOTS, `${c.id}-report-${size.width}.png`), fullPage: true });
      // No table of the report runs past the page's right edge.
      const wide = await view.evaluate(() => [...document.querySelectorAll('table')].filter((t) => t.getBoundingClientRect().right > document.documentElement.clientWidth + 1).map((t) => t.closest('section')?.id ?? 'table'));
      expect(wide, `report at ${size.width}`).toEqual([]);
      exportFaults.push(...(await cutTextFindings(view)).map((f) => cutTextLine(`${c.id} report ${size.width}`, f)));
    }
    await view.close();
    await writeFile(join(SHOTS, `${c.id}-written.txt`), `${written.join('\n')}\n`);
    expect(exportFaults).toEqual([]);
    expect(written.length).toBeGreaterThan(4);

    // Each said once, by one writer (the checks of the polish23 capture, folded in here).
    // One title for the values chart: the panel's heading, the exported SVG's title and the report's caption.
    expect(await page.locator('[data-section="values"] .fold-heading').first().innerText()).toContain(VALUES_CHART_TITLE);
    expect(await readFile(join(SHOTS, `${c.id}-export-comparison.svg`), 'utf8')).toContain(`<title id="plot-title">${VALUES_CHART_TITLE}</title>`);
    expect(html).toContain(`${VALUES_CHART_TITLE}, beside the baseline`);
    // An interval's column says it is an interval: "90 % percentile" alone reads as the 90th percentile.
    expect(html).not.toMatch(/% (percentile|basic)<\/th>/);
    // The effective horizon at three significant digits in the report (core/horizonText.ts).
    expect(html).toMatch(/effective horizon \d[\d,]*(\.\d)? steps/);
    expect(html).not.toMatch(/effective horizon \d+\.\d\d/);
    // The unvisited share said once in the Coverage section (pipeline/unvisitedWords.ts).
    const coverage = await page.locator('[data-section="coverage"]').innerText();
    expect(coverage.split('of the value-surface grid has no logged state').length).toBeLessThanOrEqual(2);
    // A limit's chance by the share writer, never "P = 0.1587".
    for (const svg of written.filter((p) => p.endsWith('.svg'))) expect(await readFile(svg, 'utf8'), svg).not.toMatch(/P = \d/);
    // The retune map's headline writes a tuning value as its axis labels it (thousands separated).
    if (c.retuneMap) expect(await page.getByTestId('retune-map-headline').innerText()).not.toMatch(/= \d{4,}\b/);
  }, 600_000);

  it('logged no console errors', () => {
    expect(app.consoleErrors).toEqual([]);
  });
});
