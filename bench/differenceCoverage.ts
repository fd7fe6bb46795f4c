/**
 * Do the intervals of a candidate's difference from the present controller hold the exact
 * difference? On the linear-quadratic battery plants (truth by the closed form, src/core/lq.ts, for
 * the candidate and for the present controller as modelled from each log), linear and network,
 * through evaluateProject and assessRun as the hosts run them. One line per log and candidate:
 * the exact and estimated difference, its interval, whether it holds, the share "better in", the
 * width in % of |J|, whether J's own interval and the present controller's hold, J's error, the
 * function-class verdict, the serious warnings and the network's agreement verdict; PAIRS=1 adds
 * the candidates' difference from each other. ALT=1 (linear only) adds, on the same resamples,
 * whether the studentised interval (per-resample standard error from influence values at the
 * full-data fit, then at each resample's own fit) and BCa hold, with their widths
 * (differenceIntervals.ts), and whether its percentile interval equals the assessment's.
 *   N=20000 SEEDS=1,2,3 KINDS=network,linear [PLANTS=a,b] [PAIRS=1] [ALT=1] nice -n 10 npx tsx bench/differenceCoverage.ts
 * (The measured table is in test/battery/README.md, "Differences from the present controller".)
 */
import { batteryPlants } from '../test/battery/catalogue';
import { plantProject } from '../test/support/plantProject';
import { projectSchema } from '../src/project/schema';
import { evaluateProject } from '../src/pipeline/evaluateProject';
import { assessRun } from '../src/pipeline/assessProject';
import type { ProjectRun } from '../src/pipeline/projectRun';
import { closedFormPolicyCost, lqClosedForm, rewardFromCost } from '../src/core/lq';
import { createGaussianPolicy, type GaussianPolicy } from '../src/core/policy';
import type { LinearQuadraticBatteryPlant } from '../test/battery/linearQuadraticPlant';
import { differenceIntervals, type Interval } from './differenceIntervals';

const transitions = Number(process.env.N ?? 20000), seeds = (process.env.SEEDS ?? '1,2,3').split(',').map(Number);
const kinds = (process.env.KINDS ?? 'network,linear').split(',');
const only = process.env.PLANTS?.split(',');
const plants = batteryPlants().filter((p) => p.kind === 'linearQuadratic' && (!only || only.includes(p.name))) as LinearQuadraticBatteryPlant[];

async function main() {
  console.log(['plant', 'seed', 'kind', 'candidate', 'status', 'truth diff', 'diff', 'lo', 'hi', 'holds', 'better in', 'width/|truth J|', 'J holds', 'today holds', 'today bounds', 'J err %', 'settled', 'serious', 'agreement', ...(process.env.ALT ? ['same pct', 't-fixed holds', 't-fixed width', 't-refit holds', 't-refit width', 'bca holds', 'bca width'] : [])].join('\t'));
  for (const plant of plants) for (const seed of seeds) for (const kind of kinds) {
    const data = plant.simulate({ transitions, seed });
    const doc = plantProject(plant, plant.name, plant.candidates.map((c) => {
      const s = c.spec;
      return { name: c.name, offset: Array.from(s.offset), gain: s.gain.map((r) => Array.from(r)), std: Array.from(s.std ?? []) };
    }));
    const project = kind === 'network' ? projectSchema.parse({ ...doc, approximator: { kind: 'network' } }) : doc;
    let run: ProjectRun | null = null;
    const ev = await evaluateProject({ project, dataset: data, keepRun: (r) => { run = r; } });
    if (!ev.ok || !run) { console.log(`${plant.name}\t${seed}\t${kind}\tFAILED evaluate ${ev.ok ? '' : ev.problems.map((p) => p.message).join(' | ').slice(0, 200)}`); continue; }
    const r = run as ProjectRun;
    try {
      const a = await assessRun(r, { settings: { resamples: 200, level: 0.9, seed, sensitivity: false } });
      if (!a.ok) { console.log(`${plant.name}\t${seed}\t${kind}\tFAILED assess`); continue; }
      const exact = (p: GaussianPolicy) => rewardFromCost(closedFormPolicyCost(lqClosedForm(plant.lq.plant, plant.lq.operatingPoint, p, plant.discount), data.startStates, data.episodeCount));
      if (!r.presentController) { console.log(`${plant.name}\t${seed}\t${kind}\tno present controller`); continue; }
      let today: number;
      try { today = exact(r.presentController.policy); } catch (e) { console.log(`${plant.name}\t${seed}\t${kind}\tno closed form for today: ${(e as Error).message}`); continue; }
      if (process.env.PAIRS) {
        const [x, y] = a.value.candidates, tx = exact(createGaussianPolicy(plant.candidates[0].spec, plant.stateDim)), ty = exact(createGaussianPolicy(plant.candidates[1].spec, plant.stateDim));
        const d = a.value.comparison.differences.find((q) => q.a === x.name && q.b === y.name)!, iv = d.difference.percentile!;
        console.log(['PAIR', plant.name, seed, (tx - ty).toPrecision(4), d.difference.value.toPrecision(4), iv[0].toPrecision(4), iv[1].toPrecision(4), iv[0] <= tx - ty && tx - ty <= iv[1]].join('\t'));
      }
      const alt = process.env.ALT && kind === 'linear' ? differenceIntervals(r, seed, 200, 0.9) : null;
      a.value.candidates.forEach((c, i) => {
        const spec = plant.candidates[i].spec, truth = exact(createGaussianPolicy(spec, plant.stateDim)) - today;
        const d = a.value.comparison.differences.find((x) => x.a === c.name && x.b === a.value.comparison.baseline.name);
        const iv = d?.difference.percentile ?? null, holds = iv ? iv[0] <= truth && truth <= iv[1] : null;
        const tJ = exact(createGaussianPolicy(spec, plant.stateDim));
        console.log([plant.name, seed, kind, c.name, r.models[i].fit.status, truth.toPrecision(4), d ? d.difference.value.toPrecision(4) : '-', iv ? iv[0].toPrecision(4) : '-', iv ? iv[1].toPrecision(4) : '-', holds, d?.probabilityBetter ?? '-', iv ? ((iv[1] - iv[0]) / Math.abs(tJ)).toFixed(3) : '-',
          c.policyValue.percentile ? c.policyValue.percentile[0] <= tJ && tJ <= c.policyValue.percentile[1] : '-',
          a.value.presentController?.policyValue.percentile ? a.value.presentController.policyValue.percentile[0] <= today && today <= a.value.presentController.policyValue.percentile[1] : '-',
          r.presentController!.policy.bounds ? 'bounded' : 'none', (100 * (c.policyValue.value / tJ - 1)).toFixed(1), c.settled,
          c.warnings.filter((w) => w.severity === 'serious').length + a.value.warnings.filter((w) => w.severity === 'serious').length,
          r.models[i].fit.linearComparison?.agreement.verdict ?? '-', ...(alt ? altColumns(alt[i], iv, truth, tJ) : [])].join('\t'));
      });
    } finally { r.dispose(); }
  }
}
/** Whether the percentile interval recomputed on the same resamples is the assessment's, then each other method's "holds" and width / |truth J|. */
function altColumns(alt: ReturnType<typeof differenceIntervals>[number], iv: readonly [number, number] | null, truth: number, tJ: number): (string | boolean)[] {
  const same = iv !== null && Math.abs(alt.percentile[0] - iv[0]) + Math.abs(alt.percentile[1] - iv[1]) <= 1e-9 * (1 + Math.abs(iv[0]) + Math.abs(iv[1]));
  const cols = (x: Interval) => [x[0] <= truth && truth <= x[1], ((x[1] - x[0]) / Math.abs(tJ)).toFixed(3)];
  return [same, ...cols(alt.studentisedFixed), ...cols(alt.studentisedRefit), ...cols(alt.bca)];
}
void main();
