/**
 * The discount sweep's check (src/pipeline/assessSweepCheck.ts) measured against the truth at every
 * swept discount: false alarms (a crossed point that was right) and hits (a point far off that was
 * crossed). Each plant's log is assessed as the hosts do (evaluateProject, then assessRun with the
 * sensitivity sweep on, 200 resamples, 90 %), and every candidate's J at each swept γ′ is set beside
 *   - the closed form on the linear-quadratic plants (src/core/lq.ts, the Lyapunov equation of a
 *     linear policy; Bertsekas, "Dynamic Programming and Optimal Control", vol. 1, §4.1), any γ;
 *   - seeded rollouts on the clipped and hold-out plants (test/battery/rolloutTruth.ts, with their
 *     standard error), run at each γ′ from the log's own run starts (the starts the assessment's J is over).
 * One line per plant, seed, candidate and swept γ′: truth, fitted J, error, crossed or not; then one
 * summary line per plant, seed and candidate (prefix ROW): the check's warning (severity), crossed
 * points, the largest error of an uncrossed point, whether the project-γ J's interval holds the truth,
 * and whether the row breaks the rule written before measuring (test/battery/README.md, "The discount
 * sweep's check"): no crossed point within NEAR (3 %) of its truth, no serious warning on a row whose
 * project-γ interval holds the truth.
 *   N=100000 SEEDS=1,2,3,4,5 [PLANTS=a,b] [ROLLOUTS=20] [FLOOR=1] nice -n 10 npx tsx bench/sweepCheck.ts
 *   (FLOOR=1 declares every cost never below 0, as a project would: the check holds J to the reward definition’s bounds only)
 */
import { batteryPlants } from '../test/battery/catalogue';
import { holdoutPlants } from '../test/battery/holdout/levelValvePlant';
import type { BatteryPlant, StartSet } from '../test/battery/batteryPlant';
import type { LinearQuadraticBatteryPlant } from '../test/battery/linearQuadraticPlant';
import { rolloutTruth } from '../test/battery/rolloutTruth';
import { plantProject } from '../test/support/plantProject';
import { evaluateProject } from '../src/pipeline/evaluateProject';
import { assessRun } from '../src/pipeline/assessProject';
import { SWEEP_CHECK_TOPIC } from '../src/pipeline/assessSweepCheck';
import type { ProjectRun } from '../src/pipeline/projectRun';
import { closedFormPolicyCost, lqClosedForm, rewardFromCost } from '../src/core/lq';
import { createGaussianPolicy, type GaussianPolicySpec } from '../src/core/policy';

/** A crossed point nearer its truth than this is a false alarm by the rule written before measuring. */
const NEAR = 0.03;
/** A point farther than this from its truth should be crossed (a "hit" when it is, a "miss" when not). */
const FAR = 0.10;
const ROLLOUT_SEED = 31_337;

const transitions = Number(process.env.N ?? 100000), seeds = (process.env.SEEDS ?? '1,2,3,4,5').split(',').map(Number);
const only = process.env.PLANTS?.split(','), rollouts = Number(process.env.ROLLOUTS ?? 20);
const plants: BatteryPlant[] = [...batteryPlants().filter((p) => p.kind === 'linearQuadratic' || p.name === 'greenhouse-clipped-g0.95'), ...holdoutPlants()]
  .filter((p) => !only || only.includes(p.name));

function candidateDocument(spec: GaussianPolicySpec & { bounds?: unknown }, name: string): object {
  return { name, offset: Array.from(spec.offset), gain: spec.gain.map((r) => Array.from(r)), std: Array.from(spec.std ?? []), ...(spec.bounds ? { bounds: spec.bounds } : {}) };
}

/** Truth (reward terms) and its standard error at discount g over the log's run starts. */
function truthAt(plant: BatteryPlant, spec: GaussianPolicySpec, g: number, starts: StartSet): { value: number; se: number } {
  if (plant.kind === 'linearQuadratic') {
    const lq = (plant as LinearQuadraticBatteryPlant).lq;
    return { value: rewardFromCost(closedFormPolicyCost(lqClosedForm(lq.plant, lq.operatingPoint, createGaussianPolicy(spec, plant.stateDim), g), starts.states, starts.count)), se: 0 };
  }
  // The plant's own dynamics (BatteryPlant.dynamics), rolled out at any discount.
  if (!plant.dynamics) throw new Error(`${plant.name}: no dynamics to roll out, so no truth at another discount`);
  const t = rolloutTruth(plant.dynamics, spec, g, starts, { rolloutsPerStart: rollouts, seed: ROLLOUT_SEED });
  return { value: t.value, se: t.standardError };
}

const pct = (x: number) => (100 * x).toFixed(1);
const floor = process.env.FLOOR === '1';

async function main() {
  console.log(`# ${transitions} transitions; seeds ${seeds.join(',')}; rollouts per start ${rollouts} (nonlinear truth); NEAR ${100 * NEAR} %, FAR ${100 * FAR} %; cost declared never below 0: ${floor ? 'yes' : 'no'}`);
  console.log(['plant', 'seed', 'candidate', 'γ′', 'truth', 'truth SE', 'J', 'err %', 'crossed'].join('\t'));
  for (const plant of plants) for (const seed of seeds) {
    const started = Date.now();
    const simulated = plant.simulate({ transitions, seed });
    // FLOOR=1: the cost declared never below 0 (a sum of squares and energy on every plant here; common practice), as a project would declare it — the check holds J to the definition's bounds only.
    const data = floor && simulated.rewards.every((r) => r <= 0) ? { ...simulated, rewardBounds: { lower: -Infinity, upper: 0, from: 'declaration' as const } } : simulated;
    const doc = plantProject(plant, plant.name, plant.candidates.map((c) => candidateDocument(c.spec as GaussianPolicySpec & { bounds?: unknown }, c.name)));
    let run: ProjectRun | null = null;
    const ev = await evaluateProject({ project: doc, dataset: data, keepRun: (r) => { run = r; } });
    if (!ev.ok || !run) { console.log(`${plant.name}\t${seed}\tFAILED evaluate ${ev.ok ? '' : ev.problems.map((p) => p.message).join(' | ').slice(0, 200)}`); continue; }
    const r = run as ProjectRun;
    try {
      const a = await assessRun(r, { settings: { resamples: 200, level: 0.9, seed, sensitivity: true } });
      if (!a.ok) { console.log(`${plant.name}\t${seed}\tFAILED assess`); continue; }
      const curve = a.value.sensitivity?.curves.find((c) => c.parameter === 'discount');
      if (!curve) { console.log(`${plant.name}\t${seed}\tno discount curve`); continue; }
      const starts: StartSet = { name: 'runStarts', description: 'the log’s own run starts', states: data.startStates, count: data.episodeCount };
      const seconds = (Date.now() - started) / 1000;
      a.value.candidates.forEach((c, i) => {
        const spec = plant.candidates[i].spec, series = curve.series.find((s) => s.name === c.name)!;
        // The curve's values are in the project's sense; its point at the project's γ is the candidate's J.
        const sign = series.values[curve.projectIndex]! * c.policyValue.value >= 0 ? 1 : -1;
        const errs: number[] = [], crossed = series.beyondPossible ?? curve.settings.map(() => false);
        let projectTruth = NaN;
        curve.settings.forEach((g, k) => {
          const t = truthAt(plant, spec, g, starts), v = series.values[k];
          if (k === curve.projectIndex) projectTruth = t.value;
          const e = v === null ? NaN : (sign * v - t.value) / Math.abs(t.value);
          errs.push(e);
          console.log([plant.name, seed, c.name, g.toFixed(4), t.value.toPrecision(5), t.se.toPrecision(2), v === null ? '-' : (sign * v).toPrecision(5), pct(e), crossed[k] ? 'CROSSED' : ''].join('\t'));
        });
        const warnings = c.warnings.filter((w) => w.topic === SWEEP_CHECK_TOPIC);
        const iv = c.policyValue.basic ?? c.policyValue.percentile, holds = iv ? iv[0] <= projectTruth && projectTruth <= iv[1] : false;
        const crossedAt = curve.settings.flatMap((g, k) => (crossed[k] ? [`${g.toFixed(4)} (${pct(errs[k])} %)`] : []));
        const uncrossed = errs.filter((_, k) => !crossed[k] && Number.isFinite(errs[k])).map(Math.abs);
        const far = curve.settings.flatMap((g, k) => (Math.abs(errs[k]) > FAR ? [`${g.toFixed(4)}${crossed[k] ? ' hit' : ' MISS'}`] : []));
        const breaks = [
          ...curve.settings.flatMap((g, k) => (crossed[k] && Math.abs(errs[k]) <= NEAR ? [`crossed ${g.toFixed(4)} within ${100 * NEAR} %`] : [])),
          ...(holds && warnings.some((w) => w.severity === 'serious') ? ['serious while the project-γ interval holds the truth'] : []),
        ];
        console.log(['ROW', plant.name, seed, c.name, warnings.map((w) => w.severity).join(',') || 'none', crossedAt.join('; ') || '-',
          uncrossed.length ? pct(Math.max(...uncrossed)) : '-', pct(errs[curve.projectIndex]), holds, far.join('; ') || '-', breaks.join('; ') || 'ok', seconds.toFixed(0)].join('\t'));
        for (const w of warnings) console.log(`#\t${plant.name}\t${seed}\t${c.name}\t${w.severity}: ${w.message}`);
      });
      if (curve.leftOut) console.log(`#\t${plant.name}\t${seed}\tranking verdict leaves out γ′ ${curve.leftOut.map((k) => curve.settings[k].toFixed(4)).join(', ')}`);
      if (a.value.sensitivity?.notes.length) for (const n of a.value.sensitivity.notes.filter((x) => /not checked/.test(x))) console.log(`#\t${plant.name}\t${seed}\tnote: ${n}`);
    } finally { r.dispose(); }
  }
  console.log('# ROW columns: plant, seed, candidate, check warnings, crossed γ′ (error), largest |error| uncrossed %, project-γ error %, project-γ interval holds truth, points > 10 % off (hit/MISS), rule, seconds');
}
void main();
