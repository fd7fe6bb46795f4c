/**
 * The run-trend forecast of J at the END of a log (core/drift/driftForecast.ts) against the end-of-log truth,
 * beside the whole log's J and the latest third's, on plants that drift through their logs and on stationary
 * controls. In-process, the pipeline's own plan and linear models (polynomial degree 2 at defaults, as
 * bench/holdoutCliRows.ts's projects): the whole-log J is the model's own fit (the CLI's J); every span's fit
 * and resample reweights the model's per-episode sums (core/drift/runBlockValues.ts), J over ALL the log's run
 * starts held fixed. The rule these rows are read by: /work/notes/drift40-rule.md, written before measuring;
 * the table and the decision: test/battery/README.md, "A forecast of the end of a drifting log".
 *
 *   nice -n 10 npx tsx bench/driftForecastRows.ts [--plants a,b|drifting|stationary] [--seeds 1,2,3]
 *     [--transitions 100000] [--out rows.jsonl] [--blocks 5] [--degree 1] [--rollouts 200]
 *
 * --blocks and --degree: another split and trend shape (drift40b's variant, /work/notes/drift40b-rule.md: 10 blocks,
 * a quadratic; drift41's confirming run, /work/notes/drift41-rule.md: the same on fresh seeds 7–9 with 200 rollouts
 * and a fourth drifting plant, the pump that wears only after 60 % of its runs); --rollouts: rollouts per start for the truth.
 *
 * Per row (a plant, a seed, a law — the present controller or a candidate; J in the project's reward sense,
 * −cost): the truth (rollouts of the law on the END plant from the log's run starts, as holdoutCliRows.ts rolls
 * it: 200 per start, seed 31337), each estimate's error relative to |truth| and its 90 % interval (whole log and
 * latest third: basic bootstrap over their runs, 200 resamples; forecast: the weighted line's t interval),
 * "holds" when the interval misses the truth by at most 2 truth standard errors; the width ratio forecast ÷ whole
 * log. Per log a `# trial` line: the trial the forecast differences name, scored as holdoutCliRows.ts scores one.
 */
import { appendFileSync } from 'node:fs';
import type { BatteryTruth, StartSet } from '../test/battery/batteryPlant';
import type { GaussianPolicySpec } from '../src/core/policy';
import { rolloutTruth } from '../test/battery/rolloutTruth';
import { driftingPlantControls, driftingPlants, keptAssumptionPlants } from '../test/battery/holdout/brokenLogPlants';
import type { BrokenLogPlant } from '../test/battery/holdout/brokenLog';
import { dosingPumpLateWearPlant } from '../test/battery/holdout/dosingPumpLateWearPlant';
import { bootstrapInterval } from '../src/core/bootstrap/bootstrapInterval';
import type { LinearReplicateSetup } from '../src/core/bootstrap/linearFqeReplicate';
import { driftForecast, type TrendSeries } from '../src/core/drift/driftForecast';
import { blockSeed, spanValues } from '../src/core/drift/runBlockValues';
import { runBlocks } from '../src/core/drift/runBlocks';
import { DRIFT_FORECAST, DRIFT_RECENT_SHARE } from '../src/core/limits';
import { linearSolveSettings } from '../src/pipeline/assessCandidate';
import { buildModel } from '../src/pipeline/model/buildModel';
import type { CandidateModel } from '../src/pipeline/model/candidateModel';
import { planEvaluation } from '../src/pipeline/plan/evaluationPlan';
import { projectSchema } from '../src/project/schema';
import type { TransitionSet } from '../src/core/transitions';

const LEVEL = 0.9, ROLLOUT_SEED = 31_337, PRESENT = 'present controller';
/** The trend's split and shape, and the truth's rollouts per start (main sets them from the command line). */
const settings = { blocks: DRIFT_FORECAST.blocks as number, degree: 1, rolloutsPerStart: 200 };

function option(name: string, fallback: string): string {
  const at = process.argv.indexOf(`--${name}`);
  return at >= 0 && at + 1 < process.argv.length ? process.argv[at + 1] : fallback;
}

function projectFor(plant: BrokenLogPlant, data: TransitionSet) {
  const candidates = plant.candidates.map((c) => {
    const spec = c.spec as { offset: number[]; gain: number[][]; std: number[]; bounds?: { lo: number[]; hi: number[]; mode: string } };
    return { name: c.name, offset: [...spec.offset], gain: spec.gain.map((r) => [...r]), std: [...spec.std], ...(spec.bounds ? { bounds: spec.bounds } : {}) };
  });
  return projectSchema.parse({
    format: 'setpoint-critic-project', version: 1, name: plant.name, data: { path: 'in-memory.csv' },
    columns: { states: data.stateNames.map((column) => ({ column })), actions: data.actionNames.map((column) => ({ column })), reward: { kind: 'column', column: 'r', sense: 'reward' } },
    discount: plant.discount, candidates, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
  });
}

function setupOf(plan: Parameters<typeof linearSolveSettings>[0], model: CandidateModel): LinearReplicateSetup {
  const linear = model.linear;
  if (!linear || linear.resampling.kind !== 'exact') throw new Error(`${model.name}: no per-episode sums to reweight (${linear?.resampling.kind ?? 'not linear'})`);
  return { ...linearSolveSettings(plan, model), sums: linear.resampling.sums, startFeatures: linear.startFeatures, startsFollowEpisodes: false };
}

/** A span's J with its 90 % basic bootstrap interval, per policy. */
function spanEstimates(setups: readonly LinearReplicateSetup[], first: number, size: number, seed: number) {
  const span = spanValues(setups, first, size, DRIFT_FORECAST.resamples, seed);
  return setups.map((_, i) => {
    const finite = span.replicates[i].filter(Number.isFinite), b = bootstrapInterval(span.values[i], finite, LEVEL);
    return { value: span.values[i], interval: b.basic as [number, number] };
  });
}

function holds(interval: readonly [number, number], truth: BatteryTruth): boolean {
  return Math.max(interval[0] - truth.value, truth.value - interval[1], 0) <= 2 * truth.standardError;
}

const relative = (j: number, truth: BatteryTruth) => (100 * (j - truth.value)) / Math.abs(truth.value);
const fmt = (r: readonly [number, number]) => `${r[0].toFixed(3)}..${r[1].toFixed(3)}`;

/** The trial the forecast differences name (reward sense: the best forecast difference whose interval lies wholly above 0), scored as holdoutCliRows.ts's trialVerdict. */
function forecastTrial(names: readonly string[], differences: readonly (TrendSeries | null)[], present: BatteryTruth, truths: readonly BatteryTruth[]) {
  let named: string | null = null, best = -Infinity;
  differences.forEach((d, i) => {
    if (d && d.forecast.interval[0] > 0 && d.forecast.value > best) {
      best = d.forecast.value;
      named = names[i];
    }
  });
  const trulyBetter = names.filter((_, i) => i > 0 && truths[i].value - present.value > 2 * Math.hypot(truths[i].standardError, present.standardError));
  const verdict = named === null ? (trulyBetter.length ? 'none named (a miss)' : 'none named') : trulyBetter.includes(named) ? 'right' : 'WRONG';
  return { named, trulyBetter, verdict };
}

async function logRows(plant: BrokenLogPlant, seed: number, transitions: number, group: string, out: string) {
  const data = plant.simulate({ transitions, seed }), runs = data.episodeCount;
  const plan = planEvaluation(projectFor(plant, data), data);
  if (!plan.ok) throw new Error(plan.problems.map((p) => p.message).join('; '));
  const present = plan.value.presentController.planned;
  if (!present) throw new Error(`${plant.name}: ${plan.value.presentController.reason}`);
  const models: CandidateModel[] = [];
  for (const planned of [present, ...plan.value.candidates]) models.push(await buildModel(plan.value, planned, {}, models));
  const setups = models.map((m) => setupOf(plan.value, m)), names = [PRESENT, ...plan.value.candidates.map((c) => c.name)];
  const blocks = runBlocks(runs, { ...DRIFT_FORECAST, blocks: settings.blocks, fewestBlocks: settings.degree + 2 });
  if ('reason' in blocks) throw new Error(`${plant.name}: ${blocks.reason}`);
  const forecast = driftForecast(setups, blocks, DRIFT_FORECAST.resamples, seed, LEVEL, settings.degree);
  const whole = spanEstimates(setups, 0, runs, blockSeed(seed, 1000));
  const from = runs - Math.max(1, Math.round(runs * DRIFT_RECENT_SHARE)), third = spanEstimates(setups, from, runs - from, blockSeed(seed, 1001));
  const starts: StartSet = { name: 'runStarts', description: 'the log’s own run starts', states: data.startStates, count: data.episodeCount };
  const onTrueState = plant.truthPolicy ?? ((spec: GaussianPolicySpec) => spec);
  const laws = [plant.behaviour, ...plan.value.candidates.map((c) => plant.candidates.find((k) => k.name === c.name)!.spec)];
  const truths = laws.map((spec) => rolloutTruth(plant.dynamics, onTrueState(spec), plant.discount, starts, { rolloutsPerStart: settings.rolloutsPerStart, seed: ROLLOUT_SEED }));
  names.forEach((who, i) => {
    const truth = truths[i], f = forecast.policies[i].forecast, w = whole[i], t = third[i];
    const fitGap = Math.abs(w.value - models[i].fit.policyValue); // the span over every run is the model's own fit
    const row = {
      group, plant: plant.name, seed, who, truth: truth.value, truthSE: truth.standardError,
      whole: { j: w.value, err: relative(w.value, truth), interval: w.interval, holds: holds(w.interval, truth), fitGap },
      third: { j: t.value, err: relative(t.value, truth), interval: t.interval, holds: holds(t.interval, truth), from },
      forecast: { j: f.value, err: relative(f.value, truth), interval: f.interval, holds: holds(f.interval, truth), scale: f.residualScale, blocks: [...forecast.policies[i].blockValues] },
      widthRatio: (f.interval[1] - f.interval[0]) / (w.interval[1] - w.interval[0]), k: blocks.first.length, degree: settings.degree,
    };
    console.log([plant.name, seed, who, truth.value.toFixed(3), `${w.value.toFixed(3)} (${row.whole.err.toFixed(1)} %, ${row.whole.holds ? 'holds' : 'misses'})`,
      `${t.value.toFixed(3)} (${row.third.err.toFixed(1)} %, ${row.third.holds ? 'holds' : 'misses'})`,
      `${f.value.toFixed(3)} (${row.forecast.err.toFixed(1)} %, ${fmt(f.interval)}, ${row.forecast.holds ? 'holds' : 'misses'})`, row.widthRatio.toFixed(2), row.k, f.residualScale.toFixed(2)].join('\t'));
    if (out) appendFileSync(out, `${JSON.stringify(row)}\n`);
  });
  const trial = forecastTrial(names, forecast.differences, truths[0], truths);
  console.log(`#\ttrial ${plant.name} s${seed}: named ${trial.named ?? 'none'}; truly better: ${trial.trulyBetter.join(', ') || 'none'}: ${trial.verdict}; differences ${forecast.differences.map((d, i) => (d ? `${names[i]} ${d.forecast.value.toFixed(3)} [${fmt(d.forecast.interval)}]` : '')).filter(Boolean).join('; ')}`);
  if (out) appendFileSync(out, `${JSON.stringify({ group, plant: plant.name, seed, trial })}\n`);
}

async function main() {
  const which = option('plants', 'drifting,stationary').split(','), seeds = option('seeds', '1,2,3').split(',').map(Number);
  const transitions = Number(option('transitions', '100000')), out = option('out', '');
  Object.assign(settings, { blocks: Number(option('blocks', String(settings.blocks))), degree: Number(option('degree', '1')), rolloutsPerStart: Number(option('rollouts', '200')) });
  const drifting = [...driftingPlants(), dosingPumpLateWearPlant()], stationary = [...keptAssumptionPlants(), ...driftingPlantControls()];
  const chosen: [BrokenLogPlant, string][] = [
    ...drifting.map((p): [BrokenLogPlant, string] => [p, 'drifting']), ...stationary.map((p): [BrokenLogPlant, string] => [p, 'stationary']),
  ].filter(([p, g]) => which.includes(g) || which.includes(p.name));
  console.log(['plant', 'seed', 'who', 'truth', 'whole log J (err, holds)', 'latest third J (err, holds)', 'forecast (err, interval, holds)', 'width ÷ whole', 'K', 's²'].join('\t'));
  for (const [plant, group] of chosen) for (const seed of seeds) await logRows(plant, seed, transitions, group, out);
}
main();
