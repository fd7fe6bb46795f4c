/**
 * A unit typed on the Plant log step (e2e, the built renderer with the real main-process modules behind
 * it): the field keeps what is typed, spaces and all, while the document holds the unit trimmed
 * (project/unitText.ts), so the import table, the cost's bounds and every label read it without the
 * spaces and a space typed on the way to "kg /h" is not lost. Undo takes the unit back in one step. On the
 * heating-loop sample (its cost has no unit, its zone temperature is in °C).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openSample } from './harness/openSample';
import { POLL } from './harness/poll';
import { launchApp, type LaunchedApp } from './harness/launch';
import { steadyFill } from './harness/steadyActions';

describe('a unit typed on the Plant log step (e2e)', () => {
  let app: LaunchedApp;
  beforeAll(async () => {
    app = await launchApp({ viewport: { width: 1280, height: 800 } });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('shows what is typed in the field and the trimmed unit everywhere else', async () => {
    const { page } = app;
    await openSample(app, 'heating-loop');
    const cost = page.getByTestId('unit-cost');
    await expect.poll(() => page.getByTestId('stat-unit-cost').innerText(), POLL).toBe('no unit given');
    await steadyFill(cost, ' € ');
    expect(await cost.inputValue()).toBe(' € ');
    await expect.poll(() => page.getByTestId('stat-unit-cost').innerText(), POLL).toBe('€');
    await expect.poll(() => page.getByLabel('Never below (by its definition), in €').count(), POLL).toBe(1);
    await steadyFill(cost, '   ');
    await expect.poll(() => page.getByTestId('stat-unit-cost').innerText(), POLL).toBe('no unit given');
    await expect.poll(() => page.getByLabel('Never below (by its definition)', { exact: true }).count(), POLL).toBe(1);
  });

  it('keeps a space typed inside a unit, and undo takes the unit back', async () => {
    const { page } = app;
    const state = page.getByTestId('unit-zone_temp_c');
    // Typing goes through the harness's steady actions (test/e2e/harness/steadyActions.ts): the unit typed in two
    // steps, as keys would reach it — the field keeps the trailing space while typing goes on (a field that
    // trimmed as it went would turn "kg /h" into "kg/h"), and the held unit is the trimmed one.
    await steadyFill(state, 'kg ');
    expect(await state.inputValue()).toBe('kg ');
    await steadyFill(state, 'kg /h');
    expect(await state.inputValue()).toBe('kg /h');
    await expect.poll(() => page.getByTestId('stat-unit-zone_temp_c').innerText(), POLL).toBe('kg /h');
    await state.blur();
    await page.getByTestId('step-plant-log').focus();
    await page.keyboard.press('Control+z');
    await expect.poll(() => state.inputValue(), POLL).toBe('°C');
    await expect.poll(() => page.getByTestId('stat-unit-zone_temp_c').innerText(), POLL).toBe('°C');
  });
});
