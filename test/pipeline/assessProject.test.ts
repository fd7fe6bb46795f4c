/**
 * The assessment pipeline on the sample projects, read through the same openProject path the CLI
 * and the app use. The point estimates must be exactly those of evaluateProject (the bootstrap
 * reruns the same fit), the model-based cross-check must agree on the linear-quadratic tank plant
 * and stay out of the nonlinear heating loop, and the same seed must give the same numbers.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { closedFormPolicyCost, lqClosedForm } from '../../src/core/lq';
import { createGaussianPolicy } from '../../src/core/policy';
import type { Assessment } from '../../src/pipeline/assessment';
import { assessProject, assessRun } from '../../src/pipeline/assessProject';
import { assessmentSettingsFor } from '../../src/pipeline/assessSettings';
import type { ProjectRun } from '../../src/pipeline/projectRun';
import { evaluateProject } from '../../src/pipeline/evaluateProject';
import { openProject, type OpenedProject } from '../../src/pipeline/openProject';
import { tankDiscount, tankOperatingPoint, tankPlant, tankTunedPolicy } from '../../sample-projects/tank-levels/simulate';
import { projectSchema } from '../../src/project/schema';
import { simulateLinearPlant } from '../core/fqe/simulatedTransitions';

async function open(sample: string, edit: (doc: Record<string, unknown>) => void = () => undefined): Promise<OpenedProject> {
  const folder = join(__dirname, '..', '..', 'sample-projects', sample);
  const doc = JSON.parse(await readFile(join(folder, `${sample}.spcritic`), 'utf8'));
  edit(doc);
  const opened = await openProject(JSON.stringify(doc), `${sample}.spcritic`, async (p) => new Uint8Array(await readFile(join(folder, p))));
  if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
  return opened.value;
}

const settings = { resamples: 200, level: 0.9, seed: 4, sensitivity: false };

describe('assessProject on the tank-levels sample', () => {
  let project: OpenedProject['project'], dataset: OpenedProject['dataset'], result: Awaited<ReturnType<typeof assessProject>>, a: Assessment;
  beforeAll(async () => {
    ({ project, dataset } = await open('tank-levels'));
    result = await assessProject({ project, dataset, settings });
    if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
    a = result.value;
  });

  it('gives the evaluation’s own J and logged return as its point estimates', async () => {
    const evaluation = await evaluateProject({ project, dataset });
    if (!evaluation.ok) throw new Error('evaluation failed');
    a.candidates.forEach((c, i) => expect(Math.abs(c.policyValue.value - evaluation.value.policies[i].policyValue) / evaluation.value.policies[i].policyValue).toBeLessThan(1e-9));
    expect(a.behaviour.value).toBeCloseTo(evaluation.value.behaviour.value, 12);
  });

  it('puts every point estimate inside its interval, in the project’s sense (cost)', () => {
    for (const e of [a.behaviour, ...a.candidates.map((c) => c.policyValue)]) {
      expect(e.replicates).toBe(200);
      expect(e.percentile![0]).toBeLessThan(e.value);
      expect(e.percentile![1]).toBeGreaterThan(e.value);
      expect(e.value).toBeGreaterThan(0); // a cost
    }
    // Closed form (src/core/lq.ts) at the logged start states: the tuned candidate's cost lies in its interval here.
    const exact = closedFormPolicyCost(lqClosedForm(tankPlant, tankOperatingPoint, createGaussianPolicy(tankTunedPolicy, 2), tankDiscount), dataset.startStates, dataset.episodeCount);
    expect(exact).toBeGreaterThan(a.candidates[0].policyValue.percentile![0]);
    expect(exact).toBeLessThan(a.candidates[0].policyValue.percentile![1]);
  });

  it('compares every candidate with the present controller’s model and with each other on the same resamples', () => {
    const d = a.comparison.differences, today = 'present controller (model fitted to the log)';
    expect(a.comparison.baseline).toMatchObject({ name: today, kind: 'presentController' });
    expect(d.map((x) => [x.a, x.b])).toEqual([
      ['Tuned (60, 90 %/m)', today], ['Tuned, 1.5 % trim error', today], ['Tuned (60, 90 %/m)', 'Tuned, 1.5 % trim error'],
    ]);
    expect(d[0].difference.value).toBeCloseTo(a.candidates[0].policyValue.value - a.presentController!.policyValue.value, 10);
    expect(d[0].probabilityBetter).toBeGreaterThan(0.95); // lower cost than today in nearly every resample
    // Paired differences are much tighter than the separate intervals (the resamples share episodes).
    expect(d[2].difference.standardError!).toBeLessThan(0.5 * a.candidates[0].policyValue.standardError!);
    expect(a.comparison.ranking.order[0]).toBe('Tuned (60, 90 %/m)');
    expect(a.comparison.ranking.order.at(-1)).toBe('present controller (model fitted to the log)');
  });

  it('finds the linear-quadratic model agreeing and the importance weights too concentrated to judge', () => {
    for (const c of a.candidates) {
      const byMethod = Object.fromEntries(c.crossChecks.map((x) => [x.method, x]));
      expect(byMethod.linearQuadraticModel.agreement).toBe('agrees');
      expect(byMethod.weightedImportanceSampling.agreement).toBe('uninformative');
      expect(c.warnings.some((w) => w.topic === 'importanceWeights')).toBe(true);
      expect(c.diagnostics.presentControllerShift).toBe(a.presentController!.occupancyShift);
      expect(c.diagnostics.occupancyShift!).toBeGreaterThan(0);
      expect(c.slices.length).toBe(3);
    }
  });

  it('gives identical numbers for the same seed and different resamples for another seed', async () => {
    const again = await assessProject({ project, dataset, settings });
    expect(again).toEqual(result);
    const other = await assessProject({ project, dataset, settings: { ...settings, seed: 5 } });
    if (!other.ok) throw new Error('second run failed');
    expect(other.value.candidates[0].policyValue.value).toBe(a.candidates[0].policyValue.value);
    expect(other.value.candidates[0].policyValue.percentile).not.toEqual(a.candidates[0].policyValue.percentile);
  });
});

describe('assessProject on the heating-loop sample and on unusable inputs', () => {
  it('keeps the linear-quadratic check out of a saturating, nonlinear loop and says why', async () => {
    const { project, dataset } = await open('heating-loop');
    const result = await assessProject({ project, dataset, settings: { ...settings, sensitivity: true } });
    if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
    const check = result.value.candidates[0].crossChecks.find((x) => x.method === 'linearQuadraticModel')!;
    expect(check.agreement).toBe('notApplicable');
    expect(check.note).toMatch(/quadratic terms explain|actuator limits/);
    expect(result.value.presentController?.name).toBe('present controller (model fitted to the log)');
    const curves = result.value.sensitivity!.curves;
    expect(curves.map((c) => c.parameter)).toEqual(['discount', 'polynomialDegree']);
    expect(curves[0].settings[curves[0].projectIndex]).toBe(0.95);
    // From degree 2 up, as the function-class check compares (assessSensitivity.ts, sweptDegrees).
    expect(curves[1].settings).toEqual([2, 3, 4]);
    // Where the class check's degree-4 fit diverged, the sweep has no J there and says so: before, solved at its
    // fixed point, it read "converged" at J = −26 for a cost that is never negative.
    const swept = curves[1].series.find((s) => /rate limit/.test(s.name))!;
    expect([swept.values[2], swept.status[2]]).toEqual([null, 'diverged']);
    // A compared class whose fit did not converge is carried to the verdict and named (functionClassRange.ts):
    // in this sample the rate-limited PI's degree-4 fit diverges, while degrees 2 and 3 converge.
    const rateLimited = result.value.candidates.find((c) => /rate limit/.test(c.name))!;
    expect(rateLimited.functionClasses?.classes.map((c) => c.label)).toEqual(['polynomial, degree 2', 'polynomial, degree 3']);
    expect(rateLimited.functionClasses?.reason).toContain('Not compared, as their fits did not converge: polynomial, degree 4 (diverged).');
  });

  it('refuses too few episodes, and stops when cancelled', async () => {
    const { project, dataset } = await open('tank-levels', (doc) => { (doc.columns as Record<string, unknown>).episode = { kind: 'single' }; });
    expect(await assessProject({ project, dataset, settings })).toMatchObject({ ok: false, problems: [{ message: expect.stringMatching(/at least 10; the data have 1/) }] });
    const tank = await open('tank-levels');
    expect(await assessProject({ ...tank, settings, cancel: () => true })).toMatchObject({ ok: false, problems: [{ message: expect.stringMatching(/cancelled/) }] });
  });

  it('handles two actions, a partly limited candidate and given start states', async () => {
    const dataset = simulateLinearPlant({
      dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.1, 0.2, 0.4], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1, 0, 0, 0.2],
      behaviourGain: [-0.3, -0.1, 0, -0.2], behaviourStd: [0.5, 0.4], startStd: 1, episodes: 30, stepsPerEpisode: 100, seed: 4,
    });
    const gain = [[-0.4, -0.1], [0, -0.3]];
    const project = projectSchema.parse({
      format: 'setpoint-critic-project', version: 1, name: 'two actions', data: { path: 'none.csv' },
      columns: { states: [{ column: 'x1' }, { column: 'x2' }], actions: [{ column: 'u1' }, { column: 'u2' }], reward: { kind: 'column', column: 'r', sense: 'reward' } },
      discount: 0.9, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } }, startStates: { kind: 'given', states: [[0.5, -0.5], [1, 1]] },
      candidates: [{ name: 'free', offset: [0, 0], gain, std: [0.4, 0.3] }, { name: 'limited', offset: [0, 0], gain, std: [0.4, 0.3], bounds: { lo: [-1, null], hi: [1, null], mode: 'clip' } }],
    });
    const evaluation = await evaluateProject({ project, dataset });
    const result = await assessProject({ project, dataset, settings });
    if (!evaluation.ok || !result.ok) throw new Error('pipeline failed');
    result.value.candidates.forEach((c, i) => {
      expect(c.policyValue.value).toBeCloseTo(evaluation.value.policies[i].policyValue, 9);
      expect(c.slices.length).toBe(6); // 3 states × 2 actions
      expect(c.crossChecks[0]).toMatchObject({ agreement: 'notApplicable', note: expect.stringMatching(/given start states/) });
    });
    expect(result.value.candidates[1].crossChecks.find((x) => x.method === 'linearQuadraticModel')!.note).toMatch(/actuator limits/);
    expect(result.value.warnings.some((w) => w.topic === 'startStates')).toBe(true);
    // Both given starts lie within the logged states (started with standard deviation 1): no start-coverage finding, its rule stated.
    expect(result.value.warnings.some((w) => w.topic === 'startCoverage')).toBe(false);
    expect(result.value.method.some((m) => m.startsWith('Start states given in the project'))).toBe(true);
    // One of two starts 30 standard deviations out: more than 25 % of the starts outside, serious (src/core/diagnostics/severity.ts).
    const far = await assessProject({ project: { ...project, startStates: { kind: 'given', states: [[0.5, -0.5], [30, 30]] } }, dataset, settings });
    if (!far.ok) throw new Error('pipeline failed');
    expect(far.value.warnings.find((w) => w.topic === 'startCoverage')).toMatchObject({ severity: 'serious', message: expect.stringMatching(/^1 of the 2 start states/) });
  });

  it('assesses a network approximator with its own interval and no refits, extending the run’s models, and sweeps its width', async () => {
    const { project, dataset } = await open('tank-levels', (doc) => {
      doc.approximator = { kind: 'network', hiddenLayers: [6], outerIterations: 2, stepsPerIteration: 10, batchSize: 256, backend: 'cpu', patience: 0 };
    });
    let run: ProjectRun | null = null;
    const evaluation = await evaluateProject({ project, dataset, keepRun: (r) => { run = r; } });
    try {
      if (!run) throw new Error('no run kept');
      const result = await assessRun(run, { settings: { ...settings, sensitivity: true } });
      if (!evaluation.ok || !result.ok) throw new Error('pipeline failed');
      const a = result.value;
      a.candidates.forEach((c, i) => {
        // No bootstrap refits of the network: its interval is the run resamples of its last-layer solve (networkInterval.ts),
        // drawn as the assessment draws the runs and at its level (networkRunResamples.ts); a cost, so the ends are negated.
        // Its resamples are counted as a linear fit's are (used + failed = the assessment's resamples), so failedWarning reads them.
        expect(c.policyValue).toMatchObject({ value: evaluation.value.policies[i].policyValue });
        expect(c.policyValue.replicates + c.policyValue.failedReplicates).toBe(settings.resamples);
        const network = evaluation.value.policies[i].network!;
        const own = run!.models[i].fit.resampleByRuns!({ runs: dataset.episodeCount, resamples: settings.resamples, seed: settings.seed, level: settings.level }).interval;
        expect(c.policyValue.percentile).toEqual([-own.upper, -own.lower]);
        expect(['agree', 'inconclusive', 'disagree']).toContain(network.agreement.verdict);
        expect(c.diagnostics.shiftFeatures).toMatch(/degree-2 polynomial/); // measured in a linear class beside the network
        // The range reported spans every class's interval, the network's own among them (its value and its interval).
        expect(c.reportedRange![0]).toBeLessThanOrEqual(Math.min(c.policyValue.value, c.policyValue.percentile![0]));
        expect(c.reportedRange![1]).toBeGreaterThanOrEqual(Math.max(c.policyValue.value, c.policyValue.percentile![1]));
        expect(c.functionClasses!.classes[0].interval).toEqual(c.policyValue.percentile);
        const lq = c.crossChecks.find((x) => x.method === 'linearQuadraticModel')!;
        expect(lq.estimate!.percentile).not.toBeNull();
        // Nothing to pair with: the difference's standard error is the check's plus the network's own (unpairedDifference.ts).
        const z = Math.abs(lq.estimate!.value - c.policyValue.value) / (lq.estimate!.standardError! + c.policyValue.standardError!);
        expect(lq.note).toContain(`(${z.toFixed(1)} standard errors of the difference, unpaired`);
      });
      expect(a.behaviour.percentile).not.toBeNull();
      // Two outer iterations settle no fit: with no converged candidate only the baseline is ranked (networkPairedDifference.test.ts pairs converged ones).
      expect(evaluation.value.policies.every((p) => p.status !== 'converged')).toBe(true);
      expect(a.comparison.ranking.frequency).toBeNull();
      expect(a.warnings.some((w) => /network’s intervals come from resampling the runs/.test(w.message))).toBe(true);
      expect(a.sensitivity!.curves.map((c) => [c.parameter, c.settings])).toEqual([['networkWidth', [3, 6, 12]]]);
    } finally {
      (run as ProjectRun | null)?.dispose();
    }
  });

  it('checks the bootstrap settings and names the field', async () => {
    const { project } = await open('tank-levels');
    expect(assessmentSettingsFor(project, { resamples: 5 })).toMatchObject({ ok: false, problems: [{ where: 'bootstrap.resamples' }] });
    expect(assessmentSettingsFor(project, { level: 1 })).toMatchObject({ ok: false, problems: [{ where: 'bootstrap.level' }] });
    expect(assessmentSettingsFor(project, { seed: 2 ** 32 })).toMatchObject({ ok: false, problems: [{ where: 'seed' }] }); // SEED.max, core/limits.ts, as the schema
    expect(assessmentSettingsFor({ ...project, bootstrap: { resamples: 300, level: 0.8 } })).toMatchObject({ ok: true, value: { resamples: 300, level: 0.8, seed: 1 } });
  });
});
