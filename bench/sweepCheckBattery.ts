/**
 * The sweep check's budget on the battery (pipeline/assessSweepCheck.ts, core/bootstrap/solveWork.ts):
 * per candidate of every plant bench/sweepCheck.ts runs (the log simulated and evaluated as there, seed 1),
 * of the three sample projects and of the degree-3 heating-loop sample (stress; with TOLERANCE=1e-300 too),
 * the work its check runs with no limit (U), its CPU and wall seconds, the up-front estimate from the full
 * data's own solves (A, expectedWork × 200) and a pilot's (P: the first block of resamples counted, × 200 /
 * its size), whether each would leave it checked at the budget, and the check as the code runs it at the
 * budget (checked or not, CPU seconds, units). Printed, never asserted (the rule:
 * test/battery/README.md, "The sweep check's budget").
 *   FLOOR=1 N=100000 [PLANTS=a,b] [SAMPLES=heating-loop,…] [STRESS=1] nice -n 10 npx tsx bench/sweepCheckBattery.ts
 */
import { readFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { batteryPlants } from '../test/battery/catalogue';
import { holdoutPlants } from '../test/battery/holdout/levelValvePlant';
import { plantProject } from '../test/support/plantProject';
import { episodeMultiplicities } from '../src/core/bootstrap/episodeMultiplicities';
import { linearFqeReplicateDiscounts, reachedSolve, replicateSystem, type LinearReplicate } from '../src/core/bootstrap/linearFqeReplicate';
import { solveWork, type SolveTally } from '../src/core/bootstrap/solveWork';
import { meanStartFeatures } from '../src/core/features/policyFeatures';
import { SWEEP_CHECK_BUDGET, SWEEP_CHECK_RESAMPLES } from '../src/core/limits';
import { RESAMPLE_BLOCK } from '../src/core/offPolicy/perDecisionResamples';
import type { GaussianPolicySpec } from '../src/core/policy';
import { candidateWork, linearSolveSettings, type AssessmentContext } from '../src/pipeline/assessCandidate';
import { sweptDiscount } from '../src/pipeline/assessSensitivity';
import { checkDiscountSweep } from '../src/pipeline/assessSweepCheck';
import { evaluateProject } from '../src/pipeline/evaluateProject';
import { openProject } from '../src/pipeline/openProject';
import { startRun, type ProjectRun } from '../src/pipeline/projectRun';

const FACTORS = [0.5, 0.75, 1, 1.5, 2], OWN = 2; // assessSensitivity.ts HORIZON_FACTORS
const B = SWEEP_CHECK_RESAMPLES, LIFTED = 1e13;
const transitions = Number(process.env.N ?? 100000), only = process.env.PLANTS?.split(',');
const samples = process.env.SAMPLES === undefined ? ['heating-loop', 'heating-historian', 'tank-levels'] : process.env.SAMPLES.split(',').filter(Boolean);

async function plantRun(name: string): Promise<ProjectRun | null> {
  const plant = [...batteryPlants(), ...holdoutPlants()].find((p) => p.name === name)!;
  const simulated = plant.simulate({ transitions, seed: 1 });
  const data = process.env.FLOOR === '1' && simulated.rewards.every((r) => r <= 0) ? { ...simulated, rewardBounds: { lower: -Infinity, upper: 0, from: 'declaration' as const } } : simulated;
  const candidates = plant.candidates.map((c) => {
    const s = c.spec as GaussianPolicySpec & { bounds?: unknown };
    return { name: c.name, offset: Array.from(s.offset), gain: s.gain.map((r) => Array.from(r)), std: Array.from(s.std ?? []), ...(s.bounds ? { bounds: s.bounds } : {}) };
  });
  let run: ProjectRun | null = null;
  const ev = await evaluateProject({ project: plantProject(plant, plant.name, candidates), dataset: data, keepRun: (r) => { run = r; } });
  return ev.ok ? run : null;
}

/** A sample project (sample-projects/), its polynomial degree edited where given (test/core/bootstrap/sweepSolveCases.ts projectRun, which reads __dirname, absent under tsx's ES modules). */
async function sampleRun(sample: string, degree?: number): Promise<ProjectRun> {
  const folder = join(dirname(fileURLToPath(import.meta.url)), '..', 'sample-projects', sample), doc = JSON.parse(await readFile(join(folder, `${sample}.spcritic`), 'utf8'));
  if (degree !== undefined) doc.approximator.features.degree = degree;
  const opened = await openProject(JSON.stringify(doc), `${sample}.spcritic`, async (p: string) => new Uint8Array(await readFile(join(folder, p))));
  if (!opened.ok) throw new Error(`${sample}: ${opened.problems.map((p) => p.message).join('; ')}`);
  const started = await startRun(opened.value.project, opened.value.dataset);
  if (!started.ok) throw new Error(`${sample}: ${started.problems.map((p) => p.message).join('; ')}`);
  return started.value;
}

/** Each candidate of one run: its points as the assessment forms them (assessSensitivity.ts discountCurve), A, P, U and seconds. */
function measure(label: string, run: ProjectRun, tolerance?: number): void {
  const context: AssessmentContext = { plan: run.plan, presentController: null, presentControllerModel: null, presentControllerReason: '' };
  const settings = FACTORS.map((f) => sweptDiscount(run.plan.discount, f)), e = run.plan.episodes.episodes;
  for (const original of run.models) {
    const model = tolerance === undefined ? original : { ...original, linear: { ...original.linear!, tolerance } };
    const linear = model.linear, w = candidateWork(context, model);
    if (!linear || linear.resampling.kind !== 'exact') { console.log(`| ${label} | ${model.name} | – | not a linear fit with exact resampling |`); continue; }
    const d = linear.features.dim, setup = linearSolveSettings(run.plan, model), xiBar = meanStartFeatures(linear.startFeatures, d), system = replicateSystem(setup, linear.statistics);
    const points: LinearReplicate[] = settings.map((g, k) => (k === OWN && model.fit.status !== 'converged'
      ? { policyValue: model.fit.policyValue, weights: null, status: model.fit.status } as LinearReplicate
      : reachedSolve({ ...setup, discount: g }, linear.statistics, xiBar, system)));
    const solves = points.reduce((s, p) => s + (p.status === 'converged' ? p.work ?? 0 : 0), 0);
    const A = (solveWork.statistics(e, d) + solveWork.ridgeSystem(d) + solves) * B;
    // The pilot: the first block as the check runs it, under the budget's tally.
    const rep = { ...setup, sums: linear.resampling.sums, startFeatures: linear.startFeatures, startsFollowEpisodes: run.plan.starts.followEpisodes, startEpisode: run.plan.starts.episode };
    const block = Array.from({ length: RESAMPLE_BLOCK }, (_, r) => episodeMultiplicities(e, 1, r)), pilot: SolveTally = { units: 0, limit: SWEEP_CHECK_BUDGET };
    linearFqeReplicateDiscounts(rep, block, block.map(() => new Float64Array(rep.sums.stride)), settings, points.map((p) => (p.status === 'converged' ? p.weights : null)), pilot);
    const P = (pilot.units * B) / RESAMPLE_BLOCK;
    const cpu0 = process.cpuUsage(), t0 = performance.now();
    const check = checkDiscountSweep(context, [w], settings, OWN, [points], { level: 0.9, seed: 1, resamples: B, budget: LIFTED });
    const wall = (performance.now() - t0) / 1000, c = process.cpuUsage(cpu0), cpu = (c.user + c.system) / 1e6, U = check.work[0];
    const today = A <= SWEEP_CHECK_BUDGET && U <= SWEEP_CHECK_BUDGET ? 'yes' : A > SWEEP_CHECK_BUDGET ? 'skipped' : 'stopped';
    const withPilot = P <= SWEEP_CHECK_BUDGET && U <= SWEEP_CHECK_BUDGET ? 'yes' : P > SWEEP_CHECK_BUDGET ? 'skipped' : 'stopped';
    // The check as it runs at the budget (the pilot in the code), timed on its own.
    const cpu1 = process.cpuUsage(), atBudget = checkDiscountSweep(context, [w], settings, OWN, [points], { level: 0.9, seed: 1, resamples: B }), c1 = process.cpuUsage(cpu1);
    const ran = `${/not checked/.test(atBudget.note ?? '') ? 'no' : 'yes'}, ${((c1.user + c1.system) / 1e6).toFixed(2)} s, ${atBudget.work[0].toExponential(2)}`;
    const f = (x: number) => x.toExponential(2);
    console.log(`| ${label} | ${model.name} | ${d} | ${f(U)} | ${cpu.toFixed(2)} | ${wall.toFixed(2)} | ${f(A)} | ${f(P)} | ${today} | ${withPilot} | ${ran} | ${check.marks[0].map((m) => (m ? 'x' : '.')).join('')} |`);
  }
}

async function main(): Promise<void> {
  console.log(`# ${transitions} transitions, seed 1, ${B} resamples; budget ${SWEEP_CHECK_BUDGET.toExponential(0)}; U with the limit lifted to ${LIFTED.toExponential(0)}`);
  const at = SWEEP_CHECK_BUDGET.toExponential(0).replace('e+', 'e');
  console.log(`| case | candidate | d | U (no limit) | CPU s | wall s | A (full data) | P (pilot) | at ${at} by A | at ${at} by P | code at ${at}: checked, CPU s, units | marks |`);
  console.log('|---|---|---|---|---|---|---|---|---|---|---|---|');
  const names = [...batteryPlants().filter((p) => p.kind === 'linearQuadratic' || p.name === 'greenhouse-clipped-g0.95'), ...holdoutPlants()].map((p) => p.name).filter((n) => !only || only.includes(n));
  for (const name of names) {
    const run = await plantRun(name);
    if (!run) { console.log(`| ${name} | FAILED evaluate |`); continue; }
    try { measure(name, run); } finally { run.dispose(); }
  }
  for (const s of samples) { const run = await sampleRun(s); try { measure(s, run); } finally { run.dispose(); } }
  if (process.env.STRESS === '1') {
    const run = await sampleRun('heating-loop', 3);
    try { measure('heating-loop, degree 3', run); measure('heating-loop, degree 3, tolerance 1e-300', run, 1e-300); } finally { run.dispose(); }
  }
}

void main();
