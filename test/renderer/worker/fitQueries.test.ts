/**
 * The worker's evaluation and its follow-up queries, run in Node on the tank-levels sample: the
 * run matches the pipeline run without the worker, the surface recomputed from the retained fit
 * matches the pipeline's own surface, and the slice's quadrature nodes are the 10-point
 * Gauss–Hermite rule mapped onto N(μ(s), σ²) — nodes √2·x_i with x_i from Abramowitz & Stegun,
 * Table 25.10 (n = 10, physicists' Hermite zeros) — with weights summing to 1 and a density that
 * integrates to 1 over μ ± 4σ less the normal tail P(|Z| > 4) = 6.334e-5 (from memory).
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { PRESENT_CONTROLLER_NAME } from '../../../src/pipeline/plan/presentController';
import { describe, expect, it } from 'vitest';
import { parseProjectText } from '../../../src/project/projectFile';
import { evaluateProject } from '../../../src/pipeline/evaluateProject';
import { importProjectData } from '../../../src/pipeline/openProject';
import { runEvaluation } from '../../../src/renderer/src/worker/evaluationRun';
import { sliceFromFit, surfaceFromFit } from '../../../src/renderer/src/worker/fitQueries';
import { createWorkerMemory } from '../../../src/renderer/src/worker/workerMemory';
import { dataImportSummary } from '../../../src/renderer/src/worker/dataImportSummary';
import type { RunProgress } from '../../../src/shared/workerMessages';

const folder = resolve(__dirname, '../../../sample-projects/tank-levels');
const loaded = parseProjectText(readFileSync(resolve(folder, 'tank-levels.spcritic'), 'utf8'), 'tank-levels.spcritic');
if (!loaded.ok) throw new Error('sample project does not load');
const project = loaded.value.document;
const bytes = new Uint8Array(readFileSync(resolve(folder, 'tank-levels.csv')));

// Abramowitz & Stegun Table 25.10, n = 10: positive zeros of H_10 (physicists').
const HERMITE_10 = [0.342901327223705, 1.036610829789514, 1.756683649299882, 2.532731674232790, 3.436159118837738];

describe('evaluation worker handlers', async () => {
  const memory = createWorkerMemory();
  memory.setData(bytes, 'tank-levels.csv');
  const reports: RunProgress[] = [];
  let clock = 0;
  const result = await runEvaluation(memory, project, (p) => reports.push(p), () => (clock += 1));

  it('gives the same numbers as the pipeline called directly', async () => {
    const opened = importProjectData(project, bytes);
    if (!opened.ok || !result.ok) throw new Error('import or run failed');
    const direct = await evaluateProject({ project, dataset: opened.value.dataset, now: () => new Date(result.value.evaluatedAt) });
    if (!direct.ok) throw new Error('direct run failed');
    expect(result.value.policies.map((p) => p.policyValue)).toEqual(direct.value.policies.map((p) => p.policyValue));
    expect(result.value.behaviour.value).toBe(direct.value.behaviour.value);
  });

  it('reports each candidate as it starts, then the present controller’s model (the baseline), then iterations no closer than the interval', () => {
    expect(reports.filter((r) => r.iteration === null && r.dataPass === null).map((r) => r.candidate))
      .toEqual([...project.candidates.map((c) => c.name), PRESENT_CONTROLLER_NAME]);
    expect(reports.every((r) => r.maxIterations === 5000 && r.tolerance === 1e-10)).toBe(true);
  });

  it('recomputes the pipeline’s surface from the retained fit', () => {
    if (!result.ok) throw new Error('run failed');
    const original = result.value.policies[0].surface!;
    const again = surfaceFromFit(memory.lastRun(), { candidateIndex: 0, xAxis: 0, yAxis: 1, heldState: original.heldState, resolution: 60 });
    expect(Array.from(again.values)).toEqual(Array.from(original.values));
    expect(Array.from(again.visits)).toEqual(Array.from(original.visits));
  });

  it('puts the slice’s nodes where the Gauss–Hermite rule puts them, weights summing to one', () => {
    const state = [1.2, 0.8];
    const slice = sliceFromFit(memory.lastRun(), { candidateIndex: 0, state, actionIndex: 0, points: 401 });
    const c = project.candidates[0], form = c.form;
    if (form.kind !== 'affine') throw new Error('the tank sample\'s first candidate is affine');
    const mean = form.offset[0] + form.gain[0][0] * state[0] + form.gain[0][1] * state[1];
    const sigma = c.dither[0];
    const expected = [...HERMITE_10].reverse().map((x) => mean - sigma * Math.SQRT2 * x).concat(HERMITE_10.map((x) => mean + sigma * Math.SQRT2 * x));
    Array.from(slice.nodes.points).forEach((p, i) => expect(p).toBeCloseTo(expected[i], 9));
    expect(slice.nodes.weights.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    let integral = 0; // trapezoid rule over the ±4σ window
    for (let i = 1; i < slice.actions.length; i++) integral += ((slice.density[i] + slice.density[i - 1]) / 2) * (slice.actions[i] - slice.actions[i - 1]);
    expect(integral).toBeCloseTo(1 - 6.334e-5, 4);
    expect(slice.actions[0]).toBeCloseTo(mean - 4 * sigma, 12);
    expect(slice.policyName).toBe(c.name);
  });

  it('summarises the import with an even sample and the behaviour model', async () => {
    const opened = await memory.open(project);
    if (!opened.ok) throw new Error('import failed');
    const summary = dataImportSummary(opened.value);
    expect(summary.sample.count).toBe(Math.ceil(19_960 / Math.ceil(19_960 / 2000)));
    expect(summary.behaviour.ok).toBe(true);
    expect(summary.stateMeans).toHaveLength(2);
  });

  it('says so when asked about a run that has not happened', () => {
    expect(() => createWorkerMemory().lastRun()).toThrow(/run the evaluation first/);
  });
});
