/**
 * The per-decision checks' standard errors resampled beside their first-order route
 * (src/core/offPolicy/perDecisionDerivatives.ts), judged by the rule written before measuring
 * (/work/notes/pdis36-rule.md; test/battery/README.md, "First-order standard errors of the
 * per-decision checks"): each battery and hold-out plant's log is evaluated once (linear path) and
 * assessed twice on the same resamples (same seed), with `perDecision: 'resampled'` and
 * `'firstOrder'`; a row per model and applicable check (weighted importance sampling, weighted doubly
 * robust): the paired difference's standard error both ways and their ratio, the verdict both ways,
 * and per model the headline both ways. Where a model turns to "confirmed" its truth is formed
 * (closed form on the linear-quadratic plants, seeded rollouts over the log's run starts elsewhere)
 * and the row says whether the model's range to report misses it.
 *
 *   nice -n 10 npx tsx bench/perDecisionFirstOrderRows.ts [--seeds 1,2] [--transitions 100000] [--resamples 1000] [--plants a,b]
 */
import { closedFormPolicyCost, lqClosedForm, rewardFromCost } from '../src/core/lq';
import { createGaussianPolicy, type GaussianPolicySpec } from '../src/core/policy';
import type { PerDecisionResampling } from '../src/core/limits';
import { assessRun } from '../src/pipeline/assessProject';
import type { CrossCheck } from '../src/pipeline/assessment';
import { evaluateProject } from '../src/pipeline/evaluateProject';
import type { ProjectRun } from '../src/pipeline/projectRun';
import { projectSchema } from '../src/project/schema';
import { batteryPlants } from '../test/battery/catalogue';
import type { BatteryPlant } from '../test/battery/batteryPlant';
import { holdoutPlants } from '../test/battery/holdout/levelValvePlant';
import type { LinearQuadraticBatteryPlant } from '../test/battery/linearQuadraticPlant';
import { rolloutTruth } from '../test/battery/rolloutTruth';
import { plantProject } from '../test/support/plantProject';

const CHECKS = ['weightedImportanceSampling', 'weightedDoublyRobust'];
const ROLLOUTS_PER_START = 100, ROLLOUT_SEED = 31_337;

function option(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && i + 1 < process.argv.length ? process.argv[i + 1] : fallback;
}

interface ModelView { name: string; status: string; checks: CrossCheck[]; range: [number, number] | null; value: number }

function modelsOf(a: Awaited<ReturnType<typeof assessRun>>): ModelView[] {
  if (!a.ok) return [];
  const v = a.value, out: ModelView[] = v.candidates.map((c) => ({ name: c.name, status: c.confirmation.status, checks: c.crossChecks, range: c.reportedRange, value: c.policyValue.value }));
  const p = v.presentController;
  if (p) out.push({ name: 'present controller', status: p.confirmation.status, checks: p.crossChecks, range: p.reportedRange ?? p.policyValue.basic, value: p.policyValue.value });
  return out;
}

function specOf(plant: BatteryPlant, model: string): GaussianPolicySpec {
  return model === 'present controller' ? plant.behaviour : plant.candidates.find((c) => c.name === model)!.spec;
}

/** The model's truth over the log's run starts: the Lyapunov closed form on a linear-quadratic plant, else seeded rollouts. */
function truthOf(plant: BatteryPlant, model: string, data: ReturnType<BatteryPlant['simulate']>): { value: number; standardError: number } {
  const spec = specOf(plant, model);
  if (plant.kind === 'linearQuadratic') {
    const lq = (plant as LinearQuadraticBatteryPlant).lq;
    return { value: rewardFromCost(closedFormPolicyCost(lqClosedForm(lq.plant, lq.operatingPoint, createGaussianPolicy(spec, plant.stateDim), plant.discount), data.startStates, data.episodeCount)), standardError: 0 };
  }
  const starts = { name: 'runStarts', description: 'the log’s run starts', states: data.startStates, count: data.episodeCount };
  return rolloutTruth(plant.dynamics!, spec, plant.discount, starts, { rolloutsPerStart: ROLLOUTS_PER_START, seed: ROLLOUT_SEED });
}

async function assessBoth(run: ProjectRun, seed: number, resamples: number): Promise<Record<PerDecisionResampling, ModelView[]>> {
  const one = async (perDecision: PerDecisionResampling) => modelsOf(await assessRun(run, { settings: { resamples, level: 0.9, seed, sensitivity: false, perDecision } }));
  return { resampled: await one('resampled'), firstOrder: await one('firstOrder') };
}

async function main(): Promise<void> {
  const seeds = option('seeds', '1,2').split(',').map(Number), transitions = Number(option('transitions', '100000')), resamples = Number(option('resamples', '1000'));
  const only = process.argv.includes('--plants') ? option('plants', '').split(',') : null;
  const plants = [...batteryPlants(), ...holdoutPlants()].filter((p) => !only || only.includes(p.name));
  console.log(['plant', 'seed', 'model', 'check', 'SE resampled', 'SE first order', 'ratio', 'verdict resampled', 'verdict first order', 'headline resampled', 'headline first order', 'turned confirmed: misses truth?'].join('\t'));
  for (const plant of plants) for (const seed of seeds) {
    const data = plant.simulate({ transitions, seed });
    const candidates = plant.candidates.map((c) => {
      const s = c.spec as GaussianPolicySpec & { bounds?: unknown };
      return { name: c.name, offset: Array.from(s.offset), gain: s.gain.map((r) => Array.from(r)), std: Array.from(s.std ?? []), ...(s.bounds ? { bounds: s.bounds } : {}) };
    });
    const doc = plantProject(plant, `${plant.name} seed ${seed}`, candidates);
    const ends = data.terminal.some((t) => t !== 0);
    const project = projectSchema.parse({ ...doc, seed, ...(ends ? { columns: { ...doc.columns, terminal: 'done' } } : {}) });
    let run: ProjectRun | null = null;
    const ev = await evaluateProject({ project, dataset: data, keepRun: (r) => { run = r; } });
    if (!ev.ok || !run) { console.log(`${plant.name}\t${seed}\tFAILED evaluate`); continue; }
    const r = run as ProjectRun;
    try {
      const both = await assessBoth(r, seed, resamples);
      both.resampled.forEach((before, m) => {
        const after = both.firstOrder[m];
        let turned = '-';
        if (after.status === 'confirmed' && before.status !== 'confirmed') {
          const truth = truthOf(plant, before.name, data), margin = 2 * truth.standardError;
          const misses = before.range ? truth.value < before.range[0] - margin || truth.value > before.range[1] + margin : Math.abs(before.value / truth.value - 1) > 0.1;
          turned = `${misses ? 'MISSES' : 'holds'} (truth ${truth.value.toFixed(4)}, range ${before.range ? before.range.map((x) => x.toFixed(4)).join('..') : '-'})`;
        }
        for (const method of CHECKS) {
          const x = before.checks.find((c) => c.method === method), y = after.checks.find((c) => c.method === method);
          if (!x || !y || x.agreement === 'notApplicable') continue;
          const a = x.difference?.standardError ?? NaN, b = y.difference?.standardError ?? NaN;
          console.log([plant.name, seed, before.name, method === CHECKS[0] ? 'WPDIS' : 'WDR', a.toPrecision(4), b.toPrecision(4), (b / a).toFixed(3), x.agreement, y.agreement, before.status, after.status, turned].join('\t'));
        }
      });
    } finally {
      r.dispose();
    }
  }
}
void main();
