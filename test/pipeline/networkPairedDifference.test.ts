/**
 * A network project compared with the present controller on the assessment's own resamples.
 *
 * Pairing: the network's resamples of the runs (networkRunResamples.ts) must be the linear
 * bootstrap's, resample for resample. The network's linear estimate beside it (networkComparator.ts)
 * is degree-2 LSTD-Q on the same runs, so on the same draws its percentile interval is the linear
 * project's own — the paired bootstrap's definition (Efron & Tibshirani, "An Introduction to the
 * Bootstrap", 1993, §14.1: differences from common resamples).
 *
 * Truth: the tank-levels sample is a linear-quadratic plant; the closed form (src/core/lq.ts;
 * Bertsekas, "Dynamic Programming and Optimal Control", vol. 1, 4th ed., §4.1, the Lyapunov
 * equation of a linear policy) gives the exact J of the tuned candidate and of the present
 * controller as modelled from the log, so the difference's interval can be checked against the
 * exact difference.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closedFormPolicyCost, lqClosedForm } from '../../src/core/lq';
import { createGaussianPolicy, type GaussianPolicy } from '../../src/core/policy';
import type { Assessment } from '../../src/pipeline/assessment';
import { assessProject, assessRun } from '../../src/pipeline/assessProject';
import { NETWORK_DIFFERENCE_COVERS } from '../../src/pipeline/assessIntervals';
import { evaluateProject } from '../../src/pipeline/evaluateProject';
import { openProject, type OpenedProject } from '../../src/pipeline/openProject';
import type { ProjectRun } from '../../src/pipeline/projectRun';
import { tankDiscount, tankOperatingPoint, tankPlant, tankTunedPolicy } from '../../sample-projects/tank-levels/simulate';

async function open(edit: (doc: Record<string, unknown>) => void = () => undefined): Promise<OpenedProject> {
  const folder = join(__dirname, '..', '..', 'sample-projects', 'tank-levels');
  const doc = JSON.parse(await readFile(join(folder, 'tank-levels.spcritic'), 'utf8'));
  edit(doc);
  const opened = await openProject(JSON.stringify(doc), 'tank-levels.spcritic', async (p) => new Uint8Array(await readFile(join(folder, p))));
  if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
  return opened.value;
}

const settings = { resamples: 300, level: 0.9, seed: 5, sensitivity: false };
// Small and quick; the polynomial part is exact for this plant, so the fits settle in a few iterations.
const network = { kind: 'network', hiddenLayers: [6], stepsPerIteration: 10, outerIterations: 40, patience: 2, tolerance: 0.05, backend: 'cpu' };

describe('a network project’s comparison with the present controller (tank-levels sample)', () => {
  let run: ProjectRun | null = null, opened: OpenedProject, a: Assessment;
  beforeAll(async () => {
    opened = await open((doc) => { doc.approximator = network; });
    const evaluation = await evaluateProject({ project: opened.project, dataset: opened.dataset, keepRun: (r) => { run = r; } });
    if (!evaluation.ok || !run) throw new Error('evaluation failed');
    const result = await assessRun(run, { settings });
    if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
    a = result.value;
  }, 600_000);
  afterAll(() => (run as ProjectRun | null)?.dispose());

  it('draws the linear bootstrap’s own resamples: the linear estimate beside the network has the linear project’s interval', async () => {
    const linear = await open();
    const l = await assessProject({ project: linear.project, dataset: linear.dataset, settings });
    if (!l.ok) throw new Error('linear assessment failed');
    const fit = run!.models[0].fit, e = fit.resampleByRuns!({ runs: opened.dataset.episodeCount, resamples: settings.resamples, seed: settings.seed, level: settings.level });
    const [lo, hi] = l.value.candidates[0].policyValue.percentile!; // a cost: the reward interval's ends, negated and swapped
    // Equal to 10⁻⁵ relative (the sample's linear fit carries a ridge of 1e-9, the comparator none); other
    // draws of 300 resamples would move the ends by about a percent of the interval's width (Efron &
    // Tibshirani 1993, §19.3, the Monte Carlo error of a percentile end).
    expect(Math.abs(-e.linear.interval.upper - lo)).toBeLessThan(1e-5 * Math.abs(lo));
    expect(Math.abs(-e.linear.interval.lower - hi)).toBeLessThan(1e-5 * Math.abs(hi));
    expect(e.replicates).toHaveLength(settings.resamples);
  }, 600_000);

  it('gives every converged candidate’s difference from the present controller an interval, a share and a ranking', () => {
    const today = a.comparison.baseline.name;
    expect(a.comparison.baseline.kind).toBe('presentController');
    expect(a.presentController!.policyValue.percentile).not.toBeNull();
    const converged = run!.models.filter((m) => m.fit.status === 'converged').map((m) => m.name);
    expect(converged.length).toBeGreaterThan(0);
    for (const name of converged) {
      const d = a.comparison.differences.find((x) => x.a === name && x.b === today)!;
      expect(d.difference.percentile).not.toBeNull();
      expect(d.difference.covers).toBe(NETWORK_DIFFERENCE_COVERS);
      expect(d.probabilityBetter).not.toBeNull();
      const [lo, hi] = d.difference.percentile!;
      expect(lo).toBeLessThanOrEqual(d.difference.value);
      expect(hi).toBeGreaterThanOrEqual(d.difference.value);
    }
    expect(a.comparison.ranking.frequency).not.toBeNull();
  });

  it('holds the exact difference of the tuned candidate from the present controller as modelled', () => {
    const tuned = a.candidates[0].name, today = a.comparison.baseline.name;
    expect(run!.models[0].fit.status).toBe('converged');
    const starts = opened.dataset.startStates, count = opened.dataset.episodeCount;
    const exact = (policy: GaussianPolicy) => closedFormPolicyCost(lqClosedForm(tankPlant, tankOperatingPoint, policy, tankDiscount), starts, count);
    const truth = exact(createGaussianPolicy(tankTunedPolicy, 2)) - exact(run!.presentController!.policy);
    const d = a.comparison.differences.find((x) => x.a === tuned && x.b === today)!;
    expect(truth).toBeGreaterThan(d.difference.percentile![0]);
    expect(truth).toBeLessThan(d.difference.percentile![1]);
  });

  it('takes the network’s own interval at the assessment’s level', async () => {
    const wide = await assessRun(run!, { settings: { ...settings, level: 0.98 } });
    if (!wide.ok) throw new Error('assessment failed');
    const width = (x: Assessment) => x.candidates[0].policyValue.percentile![1] - x.candidates[0].policyValue.percentile![0];
    expect(width(wide.value)).toBeGreaterThan(width(a));
  }, 600_000);
});
