/**
 * The Plant log step's trend and time windows, in the built renderer with the real main-process
 * modules behind it, on the heating-historian sample (invented data: one row a minute, runs split
 * at overnight stops, a few corrupt cells). A window from 08:00 to 08:59 on 13 Jan inside the first
 * run takes out its 60 rows (one a minute, both ends included, none of them corrupt: counted
 * independently from the CSV in Python) and cuts that run in two. A window dragged on the trend is
 * checked against the rows of the CSV counted here with Date.UTC, independently of the app's reader. Screenshots of the step in both
 * themes at 1280×800 and 1920×1080 go to test-artifacts/screens/.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { drawnPixels } from './harness/drawnPixels';
import { startMainThreadProbe, startTaskTrace, stopMainThreadProbe } from './harness/mainThreadProbe';
import { openSample } from './harness/openSample';
import { POLL } from './harness/poll';
import { launchApp, type LaunchedApp } from './harness/launch';
import { UNSTICK } from './harness/unstick';
import { addRunRange, setTheme } from '../renderer/e2e/appSteps';
import { MUTED_RUNS_WORDS } from '../../src/figures/charts/trendChart';
import { steadyClick, steadyFill, steadyPress, steadySelect } from './harness/steadyActions';


const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "16 Jan 2025 10:00" (the app's list) → seconds since 1970, by Date.UTC. */
function listedSeconds(text: string): number {
  const m = /(\d+) (\w{3}) (\d{4}) (\d\d):(\d\d)(?::(\d\d))?/.exec(text);
  if (!m) throw new Error(`not a listed time: ${text}`);
  return Date.UTC(Number(m[3]), MONTHS.indexOf(m[2]), Number(m[1]), Number(m[4]), Number(m[5]), Number(m[6] ?? 0)) / 1000;
}

/** "10 min", "9 min 30 s", "45 s", "0 s" (the app's list on an elapsed clock) → seconds. */
function durationSeconds(text: string): number {
  const units: Record<string, number> = { d: 86400, h: 3600, min: 60, s: 1 };
  let total = 0;
  for (const [, n, unit] of text.matchAll(/([\d.]+) (d|h|min|s)\b/g)) total += Number(n) * units[unit];
  return total;
}

/** Rows of the heating-historian CSV whose timestamp (dd.mm.yyyy hh:mm:ss) lies in [from, to], by Date.UTC. */
function csvRowsBetween(fromSeconds: number, toSeconds: number): number {
  const text = readFileSync(resolve(__dirname, '../../sample-projects/heating-historian/heating-historian.csv'), 'utf8');
  let rows = 0;
  for (const line of text.split(/\r?\n/).slice(1)) {
    const m = /^(\d\d)\.(\d\d)\.(\d{4}) (\d\d):(\d\d):(\d\d);/.exec(line);
    if (!m) continue;
    const t = Date.UTC(Number(m[3]), Number(m[2]) - 1, Number(m[1]), Number(m[4]), Number(m[5]), Number(m[6])) / 1000;
    if (t >= fromSeconds && t <= toSeconds) rows++;
  }
  return rows;
}

/** The page position of a time on the trend, from the plot area the drag layer reports. */
async function trendPoint(page: Page, seconds: number): Promise<{ x: number; y: number }> {
  const layer = page.getByTestId('trend-drag');
  await expect.poll(() => layer.getAttribute('data-plot-area'), POLL).toBeTruthy();
  const [left, right, atLeft, atRight] = (await layer.getAttribute('data-plot-area'))!.split(' ').map(Number);
  const box = (await layer.boundingBox())!;
  return { x: box.x + left + ((seconds - atLeft) / (atRight - atLeft)) * (right - left), y: box.y + box.height / 2 };
}

/** The plot area the drag layer reports once it has held still for a moment (the trend may still be redrawing after an edit). */
async function settledPlotArea(page: Page): Promise<void> {
  const layer = page.getByTestId('trend-drag');
  let previous: string | null = null;
  await expect.poll(async () => {
    const now = await layer.getAttribute('data-plot-area');
    const still = now !== null && now === previous;
    previous = now;
    return still;
  }, { timeout: POLL.timeout, interval: 400 }).toBe(true);
}

/**
 * Press at one time, move to the other in steps, and (unless told not to) release. A press that
 * lands while the trend is being redrawn or the page is still growing starts no drag (the plot area
 * it was aimed at has moved), so the gesture is tried again from where the plot now is, as a
 * person would, up to three times.
 */
async function dragTrend(page: Page, fromSeconds: number, toSeconds: number, release = true): Promise<void> {
  const span = page.getByTestId('trend-drag-span');
  for (let attempt = 1; ; attempt++) {
    await settledPlotArea(page);
    // Scrolled into view on every attempt: the page may have grown above the trend since (an import report).
    await page.getByTestId('trend-drag').evaluate((e) => e.scrollIntoView({ block: 'center' }));
    const a = await trendPoint(page, fromSeconds), b = await trendPoint(page, toSeconds);
    await page.mouse.move(a.x, a.y);
    await page.mouse.down();
    await page.mouse.move(b.x, b.y, { steps: 8 });
    // The span is on screen before the release, as a person sees it before letting go.
    try {
      await expect.poll(() => span.count(), { timeout: 5_000 }).toBe(1);
      break;
    } catch (error) {
      await page.mouse.up();
      if (process.env.DRAG_DEBUG) console.log('drag attempt', attempt, a, b, JSON.stringify(await page.getByTestId('trend-drag').boundingBox()));
      if (attempt === 3) throw error;
    }
  }
  if (release) await page.mouse.up();
}

/**
 * At 1280×800 and 1920×1080, in the light theme and the dark, once the trend is drawn in that theme —
 * the pixels on screen, not only the state attribute, which a redraw after the switch may not yet
 * have reset — and nothing on the step is wider than the page: then `shoot`.
 */
async function eachLook(page: Page, shoot: (theme: string, width: number) => Promise<void>): Promise<void> {
  for (const size of [{ width: 1280, height: 800 }, { width: 1920, height: 1080 }]) {
    await page.setViewportSize(size);
    for (const theme of ['light', 'dark']) {
      await setTheme(page, theme);
      await expect.poll(() => page.getByTestId('toggle-theme').getAttribute('aria-pressed'), POLL).toBe(String(theme === 'dark'));
      await expect.poll(() => page.getByTestId('plot-trend').getAttribute('data-chart-state'), POLL).toBe('drawn');
      await expect.poll(() => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth), POLL).toBe(true);
      await page.getByTestId('trend-panel').scrollIntoViewIfNeeded();
      await expect.poll(() => drawnPixels(page, page.getByTestId('plot-trend')).then((p) => p.drawnShare), POLL).toBeGreaterThan(0.02);
      await shoot(theme, size.width);
    }
  }
}

describe('the Plant log step: trend, time windows left out, bad-row hint (e2e)', () => {
  let app: LaunchedApp;
  let runsBefore = 0;

  beforeAll(async () => {
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
    await openSample(app, 'heating-historian');
  });
  afterAll(async () => {
    await app?.close();
  });

  it('draws the trend of the logged signals and shows units and readable times', async () => {
    const { page } = app;
    const figure = page.getByTestId('plot-trend');
    await expect.poll(() => figure.getAttribute('data-chart-state'), POLL).toBe('drawn');
    expect((await drawnPixels(page, figure)).drawnShare).toBeGreaterThan(0.02);
    await expect.poll(() => page.getByTestId('sampling-period').innerText(), POLL).toBe('1 min (median)');
    await expect.poll(() => page.getByTestId('stat-unit-zone_temp_c').innerText(), POLL).toBe('°C');
    await expect.poll(() => page.getByTestId('log-clock').innerText(), POLL).toContain('13 Jan 2025 06:00 to 20 Jan 2025 03:59');
    runsBefore = Number(await page.getByTestId('episode-count').innerText());
    expect(runsBefore).toBeGreaterThan(1);
  });

  it('adds a window by its start and end: 60 rows counted, the run cut in two, the chart drawn again', async () => {
    const { page } = app;
    const form = page.getByTestId('add-window');
    await steadyFill(form.getByLabel('From'), '13.01.2025 08:00:00');
    await steadyFill(form.getByLabel('To'), '13.01.2025 08:59:00');
    await steadyFill(form.getByLabel('Reason'), 'valve test');
    await page.evaluate(startMainThreadProbe);
    const trace = await startTaskTrace(page);
    await steadyClick(page.getByTestId('add-window-button'));
    await expect.poll(() => page.getByTestId('window-rows-0').innerText(), POLL).toBe('60');
    await expect.poll(() => page.getByTestId('episode-count').innerText(), POLL).toBe(String(runsBefore + 1));
    await expect.poll(() => page.getByTestId('row-counts').innerText(), POLL).toContain('60 in time windows left out');
    await expect.poll(() => page.getByTestId('time-windows').innerText(), POLL).toContain('13 Jan 2025 08:00');
    await expect.poll(() => page.getByTestId('plot-trend').getAttribute('data-chart-state'), POLL).toBe('drawn');
    // The figure's text summary (read by screen readers) names the shaded window.
    await expect.poll(() => page.getByTestId('plot-trend').textContent(), POLL).toContain('valve test from 13 Jan 2025 08:00 to 13 Jan 2025 08:59');
    const probe = await page.evaluate(stopMainThreadProbe);
    const cpu = await trace.stop();
    // Printed, not asserted: speed is never asserted in a test. Wall times include waiting for a core on a busy machine; the trace's CPU time does not.
    console.log(`main thread while a window is added, imported and the trend redrawn: longest task ${probe.longestTaskMs.toFixed(0)} ms (Long Tasks API), ${probe.longTasks} over 50 ms; `
      + `trace: longest task ${cpu.longestWallMs.toFixed(0)} ms wall, ${cpu.longestCpuMs.toFixed(0)} ms CPU, ${cpu.tasksOver50CpuMs} of ${cpu.tasks} tasks over 50 ms CPU`);
  });

  it('says which window cannot be used and why, and removing it imports again', async () => {
    const { page } = app;
    const form = page.getByTestId('add-window');
    await steadyFill(form.getByLabel('From'), '13.01.2025 10:00');
    await steadyFill(form.getByLabel('To'), '13.01.2025 09:30');
    await steadyClick(page.getByTestId('add-window-button'));
    await expect.poll(() => page.getByTestId('window-problems').innerText(), POLL).toContain('Window 2, To: window 2 ends (13 Jan 2025 09:30) before it starts (13 Jan 2025 10:00)');
    await steadyClick(page.getByTestId('time-windows').getByRole('button', { name: 'Remove' }).nth(1));
    await expect.poll(() => page.getByTestId('window-problems').count(), POLL).toBe(0);
    await expect.poll(() => page.getByTestId('window-rows-0').innerText(), POLL).toBe('60');
  });

  it('a drag across the trend shows the span, adds the window to the list and the report, Escape cancels, Ctrl+Z removes it', async () => {
    const { page } = app;
    const at = (d: number, h: number, min = 0) => Date.UTC(2025, 0, d, h, min) / 1000;
    // Escape while the button is held: no window.
    await dragTrend(page, at(16, 10), at(16, 12), false);
    await expect.poll(() => page.getByTestId('trend-drag-span').innerText(), POLL).toContain('16 Jan 2025 10:');
    await expect.poll(() => page.getByTestId('trend-drag-span').innerText(), POLL).toContain('release to leave out, Escape to cancel');
    await page.keyboard.press('Escape');
    await expect.poll(() => page.getByTestId('trend-drag-span').count(), POLL).toBe(0);
    await page.mouse.up();
    await expect.poll(() => page.getByTestId('time-windows').locator('tbody tr').count(), POLL).toBe(1);

    // Released: the window is in the list with the rows the import left out, counted here from the CSV.
    await page.evaluate(startMainThreadProbe);
    const trace = await startTaskTrace(page);
    await dragTrend(page, at(16, 10), at(16, 12));
    const row = page.getByTestId('time-windows').locator('tbody tr').nth(1);
    await expect.poll(() => page.getByTestId('window-rows-1').innerText(), POLL).toMatch(/^[\d,]+$/);
    await expect.poll(() => page.getByTestId('plot-trend').getAttribute('data-chart-state'), POLL).toBe('drawn');
    const probe = await page.evaluate(stopMainThreadProbe), cpu = await trace.stop();
    // Printed, not asserted (speed is never asserted in a test).
    console.log(`main thread while a window is dragged, imported and the trend redrawn: longest task ${probe.longestTaskMs.toFixed(0)} ms (Long Tasks API), ${probe.longTasks} over 50 ms; `
      + `trace: longest ${cpu.longestWallMs.toFixed(0)} ms wall, ${cpu.longestCpuMs.toFixed(0)} ms CPU, ${cpu.tasksOver50CpuMs} of ${cpu.tasks} tasks over 50 ms CPU`);
    const [from, to] = [await row.locator('td').nth(1).innerText(), await row.locator('td').nth(2).innerText()];
    // Within a rounding step (at most 15 min at this width: a week over about a thousand pixels) of where the drag began.
    expect(Math.abs(listedSeconds(from) - at(16, 10))).toBeLessThanOrEqual(1800);
    const rows = csvRowsBetween(listedSeconds(from), listedSeconds(to));
    expect(rows).toBeGreaterThan(100); // about two hours of one row a minute
    await expect.poll(() => page.getByTestId('window-rows-1').innerText(), POLL).toBe(String(rows));
    await expect.poll(() => page.getByTestId('window-runs-1').innerText(), POLL).toBe('1');
    await expect.poll(() => page.getByTestId('row-counts').innerText(), POLL).toContain(`${(60 + rows).toLocaleString('en-US')} in time windows left out`);
    await expect.poll(() => page.getByTestId('import-summary').innerText(), POLL).toContain(`${rows.toLocaleString('en-US')} rows in 1 run for window 2`);

    // A dragged window gets its reason in the list (one undo step); two undos take the reason and then the window away.
    await steadyFill(page.getByTestId('window-reason-1'), 'trial of a new valve');
    await steadyPress(page.getByTestId('window-reason-1'), 'Tab');
    await expect.poll(() => page.getByTestId('import-summary').innerText(), POLL).toContain(`${rows.toLocaleString('en-US')} rows in 1 run for trial of a new valve`);
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.getByTestId('window-reason-1').inputValue(), POLL).toBe('');
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.getByTestId('time-windows').locator('tbody tr').count(), POLL).toBe(1);
    await expect.poll(() => page.getByTestId('row-counts').innerText(), POLL).toContain('60 in time windows left out');

    // A drag over the window already there gets the form's overlap message; Ctrl+Z clears it.
    await dragTrend(page, at(13, 8, 30), at(13, 9, 30));
    await expect.poll(() => page.getByTestId('window-problems').innerText(), POLL).toContain('window 2 overlaps window 1 (data.csv.excludedTimes[0])');
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.getByTestId('window-problems').count(), POLL).toBe(0);
    await expect.poll(() => page.getByTestId('window-rows-0').innerText(), POLL).toBe('60');
  });

  it('a stopped import says how to leave the bad rows out, and one click does it', async () => {
    const { page } = app;
    await steadySelect(page.getByTestId('bad-rows'), 'stop');
    await expect.poll(() => page.getByTestId('import-errors').innerText(), POLL).toContain('To import without them');
    await expect.poll(() => page.getByTestId('import-errors').innerText(), POLL).toContain('“Rows that cannot be used” to “Leave them out and list them”');
    await steadyClick(page.getByTestId('leave-out-bad-rows'));
    await expect.poll(() => page.getByTestId('bad-rows').inputValue(), POLL).toBe('exclude');
    await expect.poll(() => page.getByTestId('import-summary').count(), POLL).toBe(1);
    await expect.poll(() => page.getByTestId('row-counts').innerText(), POLL).toContain('60 in time windows left out');
  });

  it('looks right in both themes at 1280×800 and 1920×1080', async () => {
    const { page } = app;
    await eachLook(page, async (theme, width) => {
      await app.screenshot(`plant-log-trend-${theme}-${width}`);
      await page.getByTestId('trend-panel').screenshot({ path: `test-artifacts/screens/plant-log-trend-panel-${theme}-${width}.png`, style: UNSTICK });
    });
    expect(app.consoleErrors).toEqual([]);
  });
});

/**
 * A clock that starts again in each run: the heating-loop sample (invented data: 40 runs of 500
 * rows, one a minute, time_s counting from 0 in every run). Given time_s as its timestamp beside the
 * run label, the step says where a window is added that a window is run time; a drag over the first
 * minutes of the trend takes those minutes from all 40 runs (rows counted here from the CSV).
 */
describe('the Plant log step on a clock that restarts in each run (e2e)', () => {
  let app: LaunchedApp;

  beforeAll(async () => {
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
    await openSample(app, 'heating-loop');
  });
  afterAll(async () => {
    await app?.close();
  });

  it('says a window is run time where it is added, and a drag leaves out the same minutes of every run', async () => {
    const { page } = app;
    await steadySelect(page.getByTestId('role-time_s'), 'timestamp');
    await expect.poll(() => page.getByTestId('every-run-note').innerText(), POLL).toContain('clock starts again in each run');
    await expect.poll(() => page.getByTestId('episode-count').innerText(), POLL).toBe('40');
    await dragTrend(page, 0, 600, false);
    await expect.poll(() => page.getByTestId('trend-drag-span').innerText(), POLL).toContain('in every run');
    await page.mouse.up();
    const row = page.getByTestId('time-windows').locator('tbody tr').first();
    await expect.poll(() => page.getByTestId('window-runs-0').innerText(), POLL).toBe('40');
    const seconds = async (k: number) => durationSeconds(await row.locator('td').nth(k).innerText());
    const [from, to] = [await seconds(1), await seconds(2)];
    expect(from).toBe(0);
    expect(Math.abs(to - 600)).toBeLessThanOrEqual(60); // within a rounding step of where the drag ended
    const text = readFileSync(resolve(__dirname, '../../sample-projects/heating-loop/heating-loop.csv'), 'utf8');
    const rows = text.split(/\r?\n/).slice(1).filter((line) => line && Number(line.split(',')[1]) >= from && Number(line.split(',')[1]) <= to).length;
    await expect.poll(() => page.getByTestId('window-rows-0').innerText(), POLL).toBe(rows.toLocaleString('en-US'));
    await expect.poll(() => page.getByTestId('import-summary').innerText(), POLL).toContain(`${rows.toLocaleString('en-US')} rows in 40 runs for window 1`);
    await expect.poll(() => page.getByTestId('import-summary').innerText(), POLL).toContain('This log’s clock starts again in each run');
    await expect.poll(() => page.getByTestId('plot-trend').getAttribute('data-chart-state'), POLL).toBe('drawn');
    await page.getByTestId('trend-panel').screenshot({ path: 'test-artifacts/screens/plant-log-run-time-window.png', style: UNSTICK });
    expect(app.consoleErrors).toEqual([]);
  });

  // On run time the runs lie over one another: a band over runs "1" to "10" would cover the runs kept
  // too, so the runs left out are drawn muted and the trend says so (figures/charts/trendChart.ts).
  it('runs left out by label are drawn muted on run time, and the trend says so; both themes at 1280×800 and 1920×1080', async () => {
    const { page } = app;
    await addRunRange(page, '1', '10', 'before the retune');
    await expect.poll(() => page.getByTestId('runs-count-0').innerText(), POLL).toBe('10');
    const summary = () => page.getByTestId('plot-trend').locator('p').last().textContent();
    await expect.poll(summary, POLL).toContain(MUTED_RUNS_WORDS);
    expect(await summary()).toContain('Runs left out by label, drawn muted: runs "1" to "10": before the retune.');
    await eachLook(page, async (theme, width) => {
      await page.getByTestId('trend-panel').screenshot({ path: `test-artifacts/screens/plant-log-run-time-runs-left-out-${theme}-${width}.png`, style: UNSTICK });
    });
    await page.setViewportSize({ width: 1280, height: 800 });
    await setTheme(page, 'light');
    expect(app.consoleErrors).toEqual([]);
  });
});
