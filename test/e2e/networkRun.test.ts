/**
 * The network approximator chosen in the app: the worker loads TensorFlow.js, picks the wasm backend
 * in the cross-origin-isolated page, fits, and the Findings say which backend computed the values;
 * the polynomial part set in the Estimator step reaches the fit (the Run step says the degree used).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchApp, type LaunchedApp } from './harness/launch';
import { addCandidate, chooseData, goToStep, mapTankColumns, runAndReadValues, TANK_CSV } from '../renderer/e2e/appSteps';
import { POLL } from './harness/poll';
import { steadyCheck, steadyFill, steadySelect } from './harness/steadyActions';

let app: LaunchedApp;
beforeAll(async () => { app = await launchApp(); });
afterAll(async () => { await app?.close(); });

describe('a network fit in the app', () => {
  it('runs TensorFlow.js in the worker and reports the backend', async () => {
    const { page } = app;
    await chooseData(app, TANK_CSV);
    await mapTankColumns(page);
    await goToStep(page, 'candidates');
    await addCandidate(page, 0, { name: 'Tuned', offset: 189, gain: [-60, -90], std: 1.5 });
    await goToStep(page, 'estimator');
    await steadyCheck(page.getByLabel('Neural network'));
    // Tiny on purpose: the accuracy of network fits is tested in test/core/fqe/network*.test.ts.
    await steadyFill(page.getByLabel('Hidden layers'), '16, 16');
    for (const [label, value] of [['Most outer iterations', '3'], ['Gradient steps per outer iteration', '20'], ['Batch size', '256']] as const) {
      const field = page.getByLabel(label, { exact: true });
      await steadyFill(field, value);
      await field.blur();
    }
    // The polynomial part fixed for a comparison run: the project holds it and the run says the degree the fits used.
    await steadySelect(page.getByLabel('Polynomial part'), '2');
    const [value] = await runAndReadValues(page, 1);
    expect(Number.isFinite(value)).toBe(true);
    await goToStep(page, 'run');
    await expect.poll(() => page.getByTestId('run-polynomial-part').textContent(), POLL).toBe('Polynomial part of degree 2, as set in the project (not chosen from the log).');
    await goToStep(page, 'findings');
    await expect.poll(() => page.getByTestId('policy-account-0').textContent(), POLL).toMatch(/Computed by TensorFlow\.js \((WebAssembly|plain JavaScript)\)/);
    expect(await page.getByTestId('policy-account-0').textContent()).toMatch(/TensorFlow\.js \(WebAssembly\)/);
    await app.screenshot('network-findings');
    expect(app.consoleErrors).toEqual([]);
  });
});
