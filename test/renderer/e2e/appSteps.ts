/**
 * Steps of a user's path through the app, for the end-to-end tests (test/e2e/workflow.test.ts and
 * robustness.test.ts): each drives the page as a person would — buttons, selects, fields by their
 * labels — through the harness's scripted dialogs.
 */
import { resolve } from 'node:path';
import type { Locator, Page } from 'playwright-core';
import type { LaunchedApp } from '../../e2e/harness/launch';
import { steadyClick, steadyFill, steadySelect } from '../../e2e/harness/steadyActions';

export const TANK_CSV = resolve(__dirname, '../../../sample-projects/tank-levels/tank-levels.csv');

export interface CandidateInput {
  name: string;
  offset: number;
  gain: [number, number];
  std: number;
}

/** Click a step's tab and wait until it is the selected one: a click that changed nothing (its fallback's event lost) fails here. */
export async function goToStep(page: Page, step: 'plant-log' | 'candidates' | 'estimator' | 'run' | 'findings'): Promise<void> {
  await steadyClick(page.getByTestId(`step-${step}`));
  await page.locator(`[data-testid="step-${step}"][aria-selected="true"]`).waitFor({ timeout: 15_000 });
}

/** Choose a CSV through the scripted open-data dialog. */
export async function chooseData(app: LaunchedApp, path: string): Promise<void> {
  app.harness.dialogs.nextOpenData = path;
  await goToStep(app.page, 'plant-log');
  await steadyClick(app.page.getByTestId('choose-data'));
  await app.page.getByTestId('role-table').waitFor();
}

/** The tank-levels roles: two level states in m, the valve in %, the cost column, episodes by run. */
export async function mapTankColumns(page: Page): Promise<void> {
  await steadySelect(page.getByTestId('role-level_upper_m'), 'state');
  await steadyFill(page.getByTestId('unit-level_upper_m'), 'm');
  await steadySelect(page.getByTestId('role-level_lower_m'), 'state');
  await steadyFill(page.getByTestId('unit-level_lower_m'), 'm');
  await steadySelect(page.getByTestId('role-inflow_valve_pct'), 'action');
  await steadyFill(page.getByTestId('unit-inflow_valve_pct'), '%');
  await steadySelect(page.getByTestId('role-cost'), 'cost');
  await steadySelect(page.getByTestId('role-run'), 'episode');
  await page.getByTestId('import-summary').waitFor({ timeout: 30_000 });
}

async function fill(field: Locator, value: string): Promise<void> {
  await steadyFill(field, value);
  await field.blur();
}

/** Add a candidate with the Add button and type its values into the labelled fields. */
export async function addCandidate(page: Page, index: number, c: CandidateInput): Promise<void> {
  await steadyClick(page.getByTestId('add-candidate'));
  const card = page.getByTestId(`candidate-${index}`);
  await fill(card.getByLabel('Name', { exact: true }), c.name);
  await fill(card.getByLabel('Offset (%)'), String(c.offset));
  await fill(card.getByLabel('Gain on level_upper_m (% per m)'), String(c.gain[0]));
  await fill(card.getByLabel('Gain on level_lower_m (% per m)'), String(c.gain[1]));
  await fill(card.getByLabel('Standard deviation (%)'), String(c.std));
}

/** Start a run and wait until it has finished; returns each candidate's J as shown (full precision). */
export async function runAndReadValues(page: Page, candidates: number): Promise<number[]> {
  await goToStep(page, 'run');
  await steadyClick(page.getByTestId('run-evaluation'));
  await page.getByTestId('run-finished').waitFor({ timeout: 90_000 });
  await goToStep(page, 'findings');
  await page.getByTestId('value-table').waitFor();
  const values: number[] = [];
  for (let i = 0; i < candidates; i++) values.push(Number(await page.getByTestId(`policy-value-${i}`).getAttribute('data-value')));
  return values;
}

/** Width and height from a PNG's IHDR chunk (PNG specification, W3C 2003, §11.2.2: bytes 16–23, big-endian). */
export function pngSize(bytes: Uint8Array): { width: number; height: number } {
  const signature = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  if (!signature.every((b, i) => bytes[i] === b)) throw new Error('not a PNG: the 8-byte signature is missing');
  if (String.fromCharCode(...bytes.subarray(12, 16)) !== 'IHDR') throw new Error('not a PNG: the first chunk is not IHDR');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  return { width: view.getUint32(16), height: view.getUint32(20) };
}

/**
 * How many distinct colours the browser's own PNG decoder finds in the image, and the share of
 * pixels that differ from the top-left one: a blank image has one colour and a share of 0.
 */
export async function decodedPngContent(page: Page, bytes: Uint8Array): Promise<{ colours: number; differing: number }> {
  const base64 = Buffer.from(bytes).toString('base64');
  return page.evaluate(async (text) => {
    const binary = atob(text);
    const data = Uint8Array.from(binary, (ch) => ch.charCodeAt(0));
    const bitmap = await createImageBitmap(new Blob([data], { type: 'image/png' }));
    const canvas = new OffscreenCanvas(bitmap.width, bitmap.height);
    const context = canvas.getContext('2d')!;
    context.drawImage(bitmap, 0, 0);
    const pixels = context.getImageData(0, 0, bitmap.width, bitmap.height).data;
    const colours = new Set<number>();
    let differing = 0;
    for (let i = 0; i < pixels.length; i += 4) {
      const key = (pixels[i] << 24) | (pixels[i + 1] << 16) | (pixels[i + 2] << 8) | pixels[i + 3];
      if (colours.size < 10_000) colours.add(key);
      if (pixels[i] !== pixels[0] || pixels[i + 1] !== pixels[1] || pixels[i + 2] !== pixels[2] || pixels[i + 3] !== pixels[3]) differing++;
    }
    return { colours: colours.size, differing: differing / (pixels.length / 4) };
  }, base64);
}

/** Switch the app to a theme with the toolbar's button (if it is not on it already) and wait until the page shows it. */
export async function setTheme(page: Page, theme: string): Promise<void> {
  const current = () => page.evaluate(() => document.documentElement.dataset.theme);
  if ((await current()) === theme) return;
  await steadyClick(page.getByTestId('toggle-theme'));
  const deadline = Date.now() + 15_000;
  while ((await current()) !== theme) {
    if (Date.now() > deadline) throw new Error(`setTheme: the page still shows the ${await current()} theme 15 s after the toggle`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** Plant log → Runs left out: add the range `from` to `to` (empty: that one run) with its reason. */
export async function addRunRange(page: Page, from: string, to: string, reason: string): Promise<void> {
  const form = page.getByTestId('add-run-range');
  await steadyFill(form.getByLabel('From run'), from);
  await steadyFill(form.getByLabel('To run'), to);
  await steadyFill(form.getByLabel('Reason'), reason);
  await steadyClick(page.getByTestId('add-run-range-button'));
}
