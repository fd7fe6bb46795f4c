/**
 * The network's difference candidate − present controller, with the parts its interval is built
 * from, beside the true difference: linear-quadratic battery plants (exact, the closed form for the
 * candidate and for the present controller as modelled from the log, as bench/differenceCoverage.ts)
 * and plants with rollout truth (candidate − the logging policy, the same starts and rollout seed as
 * bench/holdoutCliRows.ts). evaluateProject and assessRun as the hosts run them, network approximator
 * with the project's defaults. One JSON line per log (plant, seed) on stdout: each policy's J, its
 * iterates' J, full-step count, stopping-rule numbers, its raw run-resample replicates (network and
 * linear comparator, before any training-noise draw) and parts; each candidate's assessed difference
 * interval, its truth and what the trial rule needs. bench/networkDifferenceTable.ts reads the lines.
 *   N=20000 SEEDS=1,2,3 PLANTS=lq2-vessel-g0.90 nice -n 10 npx tsx bench/networkDifferenceRows.ts >> rows.jsonl
 * With SAME=1 (netdiff38, /work/notes/netdiff38-rule.md) each candidate whose fit and the present
 * controller's both converged also gets the pair at one iteration W* = max of the two stops: the fit
 * that stopped first run again with the same seed on to W* (fitNetworkFqe's runTo; the first iterates
 * repeat exactly, the largest difference is printed), its replicates read there, and the seconds a warm
 * continuation would add (the run-on fit's elapsed time at W* less at its own stop).
 * (The measured tables are in test/battery/README.md, "The network's difference intervals".)
 */
import { batteryPlants } from '../test/battery/catalogue';
import { rolloutTruthPlants } from '../test/battery/rolloutTruthPlants';
import { rolloutTruth } from '../test/battery/rolloutTruth';
import type { BatteryPlant, StartSet } from '../test/battery/batteryPlant';
import type { LinearQuadraticBatteryPlant } from '../test/battery/linearQuadraticPlant';
import { plantProject } from '../test/support/plantProject';
import { projectSchema } from '../src/project/schema';
import { evaluateProject } from '../src/pipeline/evaluateProject';
import { assessRun } from '../src/pipeline/assessProject';
import type { ProjectRun } from '../src/pipeline/projectRun';
import type { CandidateFit } from '../src/pipeline/candidateFit';
import { closedFormPolicyCost, lqClosedForm, rewardFromCost } from '../src/core/lq';
import { createGaussianPolicy, type GaussianPolicy, type GaussianPolicySpec } from '../src/core/policy';
import { fitNetworkFqe, type NetworkFit } from '../src/core/fqe/networkFqe';

const transitions = Number(process.env.N ?? 20000), seeds = (process.env.SEEDS ?? '1,2,3').split(',').map(Number);
const names = (process.env.PLANTS ?? 'lq2-vessel-g0.90').split(',');
const RESAMPLES = 200, LEVEL = 0.9, ROLLOUT_SEED = 31_337, ROLLOUTS_PER_START = 200; // as bench/holdoutCliRows.ts for these plants

type Truth = { value: number; standardError: number };

function plantsNamed(): BatteryPlant[] {
  const all = [...batteryPlants(), ...rolloutTruthPlants()];
  return names.map((n) => {
    const p = all.find((q) => q.name === n);
    if (!p) throw new Error(`networkDifferenceRows: no plant named ${n}`);
    return p;
  });
}

function projectOf(plant: BatteryPlant) {
  const doc = plantProject(plant, plant.name, plant.candidates.map((c) => {
    const s = c.spec as GaussianPolicySpec & { bounds?: unknown };
    return { name: c.name, offset: Array.from(s.offset), gain: s.gain.map((r) => Array.from(r)), std: Array.from(s.std ?? []), ...(s.bounds ? { bounds: s.bounds } : {}) };
  }));
  return projectSchema.parse({ ...doc, approximator: { kind: 'network' } });
}

/** Truths in reward terms: the candidates' and the baseline's, with standard errors (0 for the closed form). */
function truthsOf(plant: BatteryPlant, run: ProjectRun, data: ReturnType<BatteryPlant['simulate']>): { present: Truth; candidates: Truth[] } {
  if (plant.kind === 'linearQuadratic') {
    const lq = (plant as LinearQuadraticBatteryPlant).lq;
    const exact = (policy: GaussianPolicy): Truth =>
      ({ value: rewardFromCost(closedFormPolicyCost(lqClosedForm(lq.plant, lq.operatingPoint, policy, plant.discount), data.startStates, data.episodeCount)), standardError: 0 });
    return { present: exact(run.presentController!.policy), candidates: plant.candidates.map((c) => exact(createGaussianPolicy(c.spec, plant.stateDim))) };
  }
  const starts: StartSet = { name: 'runStarts', description: 'the log’s own run starts', states: data.startStates, count: data.episodeCount };
  const roll = (spec: GaussianPolicySpec) => rolloutTruth(plant.dynamics!, spec, plant.discount, starts, { rolloutsPerStart: ROLLOUTS_PER_START, seed: ROLLOUT_SEED });
  return { present: roll(plant.behaviour), candidates: plant.candidates.map((c) => roll(c.spec)) };
}

/** A fit the pipeline made, run again from the same seed on to iteration `to`, as fitRow reads one; and what it cost past its own stop. */
async function ranOn(run: ProjectRun, policy: GaussianPolicy, own: CandidateFit, to: number, seed: number) {
  const { plan } = run, { kind: _kind, ...settings } = plan.approximator as Extract<typeof plan.approximator, { kind: 'network' }>;
  const fit: NetworkFit = await fitNetworkFqe({ data: plan.data, policy, discount: plan.discount, quadratureNodes: plan.quadratureNodes, seed: plan.seed, settings, startStates: plan.starts.states, runTo: to });
  try {
    const runs = plan.data.episodeCount, n = own.history.length;
    const e = fit.estimate(plan.starts.states, { runs, resamples: RESAMPLES, seed, level: LEVEL });
    const repeatError = Math.max(...own.history.map((h, k) => Math.abs((h.policyValue ?? NaN) - fit.history[k].policyValue)));
    return {
      at: to, ownStop: n, repeatError, addedSeconds: fit.history[fit.history.length - 1].elapsedSeconds - fit.history[n - 1].elapsedSeconds, refitSeconds: fit.work.seconds,
      fit: {
        status: fit.status, J: e.value, iterates: fit.history.map((h) => h.policyValue),
        convergence: { tolerance: fit.convergence.rule.tolerance, window: fit.convergence.rule.window, discount: fit.convergence.rule.discount, fullStepIterations: fit.convergence.fullStepIterations },
        replicates: e.replicates ?? null, linearReplicates: e.linearReplicates ?? null, parts: { ...e.parts }, linear: e.linear.value,
      },
    };
  } finally { fit.dispose(); }
}

/** SAME=1: each converged pair at W* = max of the two stops; the present controller run on once per distinct W* above its stop. */
async function sameIteration(run: ProjectRun, seed: number) {
  const present = run.presentController!, np = present.fit.history.length;
  const converged = (f: CandidateFit) => f.status === 'converged';
  const presentAt = new Map<number, Awaited<ReturnType<typeof ranOn>>>();
  const out = [];
  for (const m of run.models) {
    if (!converged(m.fit) || !converged(present.fit)) { out.push(null); continue; }
    const nc = m.fit.history.length, W = Math.max(nc, np);
    const candidate = nc < W ? await ranOn(run, m.policy, m.fit, W, seed) : null;
    if (np < W && !presentAt.has(W)) presentAt.set(W, await ranOn(run, present.policy, present.fit, W, seed));
    out.push({ W, candidate, present: np < W ? presentAt.get(W)! : null });
  }
  const furthest = Math.max(0, ...presentAt.keys());
  return { pairs: out, presentAddedSeconds: furthest ? presentAt.get(furthest)!.addedSeconds : 0 };
}

function fitRow(fit: CandidateFit, runs: number, seed: number) {
  const e = fit.status === 'converged' && fit.resampleByRuns ? fit.resampleByRuns({ runs, resamples: RESAMPLES, seed, level: LEVEL }) : null;
  return {
    status: fit.status, J: fit.policyValue, iterates: fit.history.map((h) => h.policyValue), convergence: fit.convergence ?? null,
    replicates: e?.replicates ?? null, linearReplicates: e?.linearReplicates ?? null, parts: e ? { ...e.parts } : null, linear: fit.linearComparison?.value ?? null,
  };
}

async function main() {
  for (const plant of plantsNamed()) for (const seed of seeds) {
    const data = plant.simulate({ transitions, seed });
    let kept: ProjectRun | null = null;
    const started = Date.now();
    const ev = await evaluateProject({ project: projectOf(plant), dataset: data, keepRun: (r) => { kept = r; } });
    if (!ev.ok || !kept) { console.error(`${plant.name} ${seed}: evaluate failed`); continue; }
    const run = kept as ProjectRun;
    try {
      const a = await assessRun(run, { settings: { resamples: RESAMPLES, level: LEVEL, seed, sensitivity: false } });
      if (!a.ok || !run.presentController) { console.error(`${plant.name} ${seed}: assess failed or no present controller`); continue; }
      const assessedSeconds = (Date.now() - started) / 1000;
      const same = process.env.SAME === '1' ? await sameIteration(run, seed) : null;
      const truths = truthsOf(plant, run, data), as = a.value, runs = data.episodeCount;
      const candidates = as.candidates.map((c, i) => {
        const d = as.comparison.differences.find((x) => x.a === c.name && x.b === as.comparison.baseline.name) ?? null;
        const onLog = as.warnings.filter((w) => w.candidate === undefined || w.candidate === c.name);
        return {
          name: c.name, truth: truths.candidates[i], fit: fitRow(run.models[i].fit, runs, seed),
          assessed: d ? { value: d.difference.value, percentile: d.difference.percentile, probabilityBetter: d.probabilityBetter } : null,
          serious: c.warnings.filter((w) => w.severity === 'serious').length + onLog.filter((w) => w.severity === 'serious').length,
          contradicted: c.confirmation.status === 'contradicted', settled: c.settled, valueInCostSense: c.policyValue.value,
          ...(same ? { same: same.pairs[i] } : {}),
        };
      });
      console.log(JSON.stringify({
        plant: plant.name, kind: plant.kind, seed, transitions, discount: plant.discount, sign: run.plan.sign, seconds: assessedSeconds,
        ...(same ? { presentAddedSeconds: same.presentAddedSeconds } : {}),
        present: { truth: truths.present, fit: fitRow(run.presentController.fit, runs, seed) }, candidates,
      }));
    } finally { run.dispose(); }
  }
}
void main();
