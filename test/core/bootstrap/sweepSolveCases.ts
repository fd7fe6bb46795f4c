/**
 * The sweep's solves recorded exactly, for the test that holds reachedSolve and
 * linearFqeReplicateDiscounts to the numbers they gave before a change that must not move them
 * (reachedSolveSame.test.ts). Each J is kept as its 16 hexadecimal digits (the double's bits), with
 * the status and the iteration steps.
 *
 * Cases: every linear candidate of every sample project and of the heating-loop sample with degree-3
 * features (an invented edit of its project, as in test/pipeline/discountSweepReach.test.ts), at the
 * five swept discounts, by each route (the project's own; the iteration; the iteration stopped at 3
 * steps, which a proved contraction takes to the fixed point), and 8 resamples of the runs by the
 * paired check's route; and the linear-quadratic cascade plant (test/core/testPlants.ts) at the same
 * kind of sweep.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { episodeBellmanSums, resampleBellmanStatistics } from '../../../src/core/bootstrap/episodeBellmanSums';
import { episodeMultiplicities, unitMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { linearFqeReplicateDiscounts, reachedSolve, type LinearReplicate, type LinearReplicateSetup, type LinearSolveSettings } from '../../../src/core/bootstrap/linearFqeReplicate';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { meanStartFeatures, startStateFeatures } from '../../../src/core/features/policyFeatures';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { createGaussianPolicy } from '../../../src/core/policy';
import { RESAMPLE_BLOCK } from '../../../src/core/offPolicy/perDecisionResamples';
import { openProject } from '../../../src/pipeline/openProject';
import { startRun, type ProjectRun } from '../../../src/pipeline/projectRun';
import { linearSolveSettings } from '../../../src/pipeline/assessCandidate';
import { sweptDiscount } from '../../../src/pipeline/assessSensitivity';
import { cascadeLogging, cascadePlant, startLaws } from '../testPlants';
import { simulateLog } from '../linearGaussianPlant';

export const SWEEP_FACTORS = [0.5, 0.75, 1, 1.5, 2]; // assessSensitivity.ts HORIZON_FACTORS
export const CASCADE_DISCOUNT = 0.97;
const RESAMPLES = 8;

export interface RecordedSolve { policyValue: string | null; status: string; iterations: number | null }
export interface RecordedCase { name: string; points: RecordedSolve[]; resamples: (string | null)[][] }

/** The double's bits as 16 hex digits (bit for bit, −0 and NaN included). */
export function bits(x: number | null): string | null {
  if (x === null) return null;
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  return view.getBigUint64(0).toString(16).padStart(16, '0');
}

function record(fit: LinearReplicate): RecordedSolve {
  return { policyValue: bits(fit.policyValue), status: fit.status, iterations: fit.iterations ?? null };
}

/** One sample's run, with its features' degree edited where asked (an invented edit). */
export async function projectRun(sample: string, degree?: number): Promise<ProjectRun> {
  const folder = join(__dirname, '..', '..', '..', 'sample-projects', sample);
  const doc = JSON.parse(await readFile(join(folder, `${sample}.spcritic`), 'utf8')) as { approximator: { features: { degree: number } } };
  if (degree !== undefined) doc.approximator.features.degree = degree;
  const opened = await openProject(JSON.stringify(doc), `${sample}.spcritic`, async (p) => new Uint8Array(await readFile(join(folder, p))));
  if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
  const started = await startRun(opened.value.project, opened.value.dataset);
  if (!started.ok) throw new Error(started.problems.map((p) => p.message).join('\n'));
  return started.value;
}

/** Every route of the sweep on given statistics and sums: the points at the swept discounts and the paired check's resamples. */
export function sweepCase(name: string, solve: LinearSolveSettings, setup: LinearReplicateSetup, full: Parameters<typeof reachedSolve>[1], xiBar: Float64Array, episodes: number): RecordedCase {
  const settings = SWEEP_FACTORS.map((f) => sweptDiscount(solve.discount, f));
  const own = settings.map((g) => reachedSolve({ ...solve, discount: g }, full, xiBar));
  const iterated = settings.map((g) => reachedSolve({ ...solve, solver: 'iteration', discount: g }, full, xiBar));
  const stopped = settings.map((g) => reachedSolve({ ...solve, solver: 'iteration', maxIterations: 3, discount: g }, full, xiBar));
  const block = Array.from({ length: RESAMPLES }, (_, r) => episodeMultiplicities(episodes, 1, r));
  const scratch = Array.from({ length: RESAMPLE_BLOCK }, () => new Float64Array(setup.sums.stride)), resamples: (number | null)[][] = [];
  for (let first = 0; first < RESAMPLES; first += RESAMPLE_BLOCK) {
    resamples.push(...linearFqeReplicateDiscounts(setup, block.slice(first, first + RESAMPLE_BLOCK), scratch, settings, own.map((p) => (p.status === 'converged' ? p.weights : null))));
  }
  return { name, points: [...own, ...iterated, ...stopped].map(record), resamples: resamples.map((r) => r.map(bits)) };
}

/** The sample projects' cases (every linear candidate). */
export async function sampleCases(): Promise<RecordedCase[]> {
  const cases: RecordedCase[] = [];
  for (const [sample, degree] of [['heating-loop', undefined], ['heating-loop', 3], ['heating-historian', undefined], ['tank-levels', undefined]] as const) {
    const run = await projectRun(sample, degree);
    try {
      for (const model of run.models) {
        const linear = model.linear;
        if (!linear || linear.resampling.kind !== 'exact') continue;
        const solve = linearSolveSettings(run.plan, model), xiBar = meanStartFeatures(linear.startFeatures, linear.features.dim);
        const setup: LinearReplicateSetup = { ...solve, sums: linear.resampling.sums, startFeatures: linear.startFeatures, startsFollowEpisodes: run.plan.starts.followEpisodes, startEpisode: run.plan.starts.episode };
        cases.push(sweepCase(`${sample}${degree ? ` degree ${degree}` : ''}: ${model.name}`, solve, setup, linear.statistics, xiBar, run.plan.episodes.episodes));
      }
    } finally {
      run.dispose();
    }
  }
  return cases;
}

/** The cascade plant logged by its own controller from its steady state (300 runs of 100 steps, seed 41), degree-2 features: its setup and full-data statistics. */
export function cascadeSetup() {
  const [, steady] = startLaws(cascadePlant, cascadeLogging)[0];
  const data = simulateLog(cascadePlant, cascadeLogging, { episodes: 300, steps: 100, seed: 41, start: steady });
  const policy = createGaussianPolicy({ offset: cascadeLogging.offset, gain: [cascadeLogging.gain], std: cascadeLogging.std }, 3);
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2)), quadrature = createActionQuadrature(policy, 10);
  const sums = episodeBellmanSums(data, features, quadrature, undefined, indexEpisodes(data));
  const solve: LinearSolveSettings = {
    ridge: 1e-9, constantIndex: features.constantIndex, discount: CASCADE_DISCOUNT, solver: 'fixedPoint', tolerance: 1e-10, maxIterations: 5000, initialWeights: new Float64Array(features.dim),
  };
  const setup: LinearReplicateSetup = { ...solve, sums, startFeatures: startStateFeatures(features, quadrature, data.startStates, 3), startsFollowEpisodes: true };
  const full = resampleBellmanStatistics(sums, unitMultiplicities(data.episodeCount));
  return { data, solve, setup, full, xiBar: meanStartFeatures(setup.startFeatures, features.dim) };
}

export function cascadeCase(): RecordedCase {
  const { data, solve, setup, full, xiBar } = cascadeSetup();
  return sweepCase('cascade plant', solve, setup, full, xiBar, data.episodeCount);
}
