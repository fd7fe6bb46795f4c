/**
 * What a user is told on hold-out plants, read from the command line itself: for each plant and seed,
 * the plant's log is written as a CSV (run, states, action, reward, next states) with a project file
 * beside it, `evaluate --json` runs on it (the built CLI when it is there, bench/builtCli.ts), and each
 * candidate's row is compared with the rollout truth over that log's own run starts (the starts the
 * CLI's J is over), with its standard error (rolloutTruth.ts).
 *
 *   nice -n 10 npx tsx bench/holdoutCliRows.ts --plants a,b [--seeds 1,2,3] [--transitions 100000]
 *     [--approximator linear|network] [--resamples N] [--out rows.json] [--keep-runs all|change] [--drift-share 0.333]
 *
 * --keep-runs change: each log is cut as its run-order finding advises before the CSV is written
 * (bench/keptRuns.ts: after a step the runs since it, after a drift the latest third), and the truth is
 * rolled out from the kept runs' starts; a `# kept runs:` line says where the cut fell. --drift-share keeps
 * another latest share after a drift (the words' DRIFT_RECENT_SHARE by default), to see the trade-off.
 * --cut-by excludedRuns (with --keep-runs change): the whole log's CSV is written and the runs before the cut
 * are left out by the project's data.csv.excludedRuns instead, as a user would, so the run-order check also
 * reads the whole log (core/diagnostics/runsLeftOutReading.ts); the default, --cut-by csv, writes the cut CSV.
 *
 * A row is "confident and wrong" when no finding about it is serious, its verdict is settled (or
 * only one class was fitted) and its range to report misses the truth by more than 2 of the truth's
 * standard errors; "confident and right" when it has no serious finding, is settled and its range
 * holds the truth (within that margin); "cautious" otherwise.
 *
 * Each log's `# repeated actions:` line (bench/repeatedActions.ts; descriptive, no rule reads it) gives the share of
 * rows whose action repeats the row before exactly and the longest such streak: the trace of a valve held in manual
 * (the manual-stretch hold-outs, test/battery/holdout/manualStretchPlants.ts).
 *
 * Each log also gives one baseline row (printed with candidate "present controller", kept apart in
 * --out's sibling `*.baseline.json`): the present controller's J and interval, its cross-checks and
 * confirmation status, and the truth of the plant's logging policy (plant.behaviour, with its limits)
 * rolled out from the same run starts, as the candidates' truth is (bench/baselineContradictedRows.ts);
 * and the trial choice (`trial` there, a `# trial:` line printed) scored against those truths (trialVerdict).
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import type { BatteryPlant, BatteryTruth, StartSet } from '../test/battery/batteryPlant';
import type { GaussianPolicySpec } from '../src/core/policy';
import { rolloutTruth } from '../test/battery/rolloutTruth';
import { rolloutTruthPlants } from '../test/battery/rolloutTruthPlants';
import { brokenLogPlants, keptAssumptionPlants, movedSetpointPlants } from '../test/battery/holdout/brokenLogPlants';
import type { BrokenLogPlant } from '../test/battery/holdout/brokenLog';
import { manualStretchPlants } from '../test/battery/holdout/manualStretchPlants';
import { deliveryFeedforwardPlants } from '../test/battery/holdout/coldStoreDeliveryPlant';
import { repeatedActions } from './repeatedActions';
import { cliCommand } from './builtCli';
import { keptRunsAfterChange } from './keptRuns';
import { DRIFT_RECENT_SHARE } from '../src/core/limits';

/**
 * Rollouts per run start for the truth over a log's run starts (this bench's budget, not the plants' own):
 * 100, and 200 on these plants, as the tables in test/battery/README.md were measured. The plants and their
 * dynamics are the one list (test/battery/rolloutTruthPlants.ts); a name here that is not in it stops the bench.
 */
const ROLLOUTS_PER_START = { default: 100, more: 200 } as const;
const MORE_ROLLOUTS = ['holdout-backlash-level-g0.96', 'holdout-header-pressure-g0.98', 'greenhouse-clipped-g0.95', 'pendulum-saturating-g0.97',
  'holdout-aeration-noisy-probe-g0.95', 'holdout-dosing-pump-wear-g0.96', 'holdout-cold-store-retuned-g0.97',
  'holdout-aeration-clean-probe-g0.95', 'holdout-dosing-pump-steady-g0.96', 'holdout-cold-store-one-tuning-g0.97',
  'holdout-cold-store-setpoint-moved-g0.97', 'holdout-cold-store-setpoint-nudged-g0.97', 'holdout-cold-store-manual-10-g0.97', 'holdout-cold-store-manual-30-g0.97',
  ...deliveryFeedforwardPlants().map((p) => p.name)];
const ROLLOUT_SEED = 31_337;
/** The baseline's row name in the printed table (its rows are kept apart in --out, under `baseline`). */
const PRESENT = 'present controller';

/** Where --out's baseline rows go: beside it, `rows.json` → `rows.baseline.json`. */
function baselineFile(out: string): string {
  return `${out.replace(/\.json$/, '')}.baseline.json`;
}

function option(args: string[], name: string, fallback: string): string {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && i + 1 < args.length ? args[i + 1] : fallback;
}

function csvOf(plant: BatteryPlant, data: ReturnType<BatteryPlant['simulate']>): string {
  const ds = data.stateDim, m = data.actionDim;
  // Runs that end in an end state (the kettle) carry it in a column of their own, as a project declares it (columns.terminal).
  const ends = data.terminal.some((t) => t !== 0);
  const head = ['run', ...plant.stateNames, ...plant.actionNames, 'r', ...plant.stateNames.map((n) => `next_${n}`), ...(ends ? ['done'] : [])];
  const lines = [head.join(',')];
  for (let i = 0; i < data.count; i++) {
    const row = [String(data.episode[i])];
    for (let j = 0; j < ds; j++) row.push(String(data.states[i * ds + j]));
    for (let j = 0; j < m; j++) row.push(String(data.actions[i * m + j]));
    row.push(String(data.rewards[i]));
    for (let j = 0; j < ds; j++) row.push(String(data.nextStates[i * ds + j]));
    if (ends) row.push(String(data.terminal[i]));
    lines.push(row.join(','));
  }
  return `${lines.join('\n')}\n`;
}

function projectOf(plant: BatteryPlant, csv: string, approximator: string, seed: number, ends: boolean, excludedRuns: { from: string; to: string; reason: string }[] = []): object {
  const candidates = plant.candidates.map((c) => {
    const spec = c.spec as { offset: number[]; gain: number[][]; std: number[]; bounds?: { lo: number[]; hi: number[]; mode: string } };
    return { name: c.name, offset: [...spec.offset], gain: spec.gain.map((r) => [...r]), std: [...spec.std], ...(spec.bounds ? { bounds: spec.bounds } : {}) };
  });
  return {
    format: 'setpoint-critic-project', version: 1, name: `${plant.name} seed ${seed}`, data: { path: csv, ...(excludedRuns.length ? { csv: { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop', excludedRuns } } : {}) },
    columns: {
      states: plant.stateNames.map((column) => ({ column })), actions: plant.actionNames.map((column) => ({ column })),
      reward: { kind: 'column', column: 'r', sense: 'reward' },
      nextState: { kind: 'columns', columns: plant.stateNames.map((n) => `next_${n}`) },
      episode: { kind: 'column', column: 'run' }, ...(ends ? { terminal: 'done' } : {}),
    },
    discount: plant.discount, candidates,
    approximator: approximator === 'network' ? { kind: 'network' } : { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
  };
}

/**
 * The trial choice (`json.trial`, pipeline/trialChoice.ts) against the truth: a named candidate is right when its
 * truth beats the logging policy's by more than 2·√(SE² + SE²) (the rule in notes/probe36-rule.md); none named is a
 * miss when some candidate is truly better by that margin. Rewards: larger is better. Both truths roll out from
 * the same starts with the same seed (ROLLOUT_SEED), so their errors are shared in part and √(SE² + SE²) is no
 * smaller than the difference's own error would be for positively correlated rollouts: strict for "right", lenient for "a miss".
 */
function trialVerdict(trial: { named: string | null; best: string | null } | null, present: BatteryTruth, truths: Map<string, BatteryTruth>) {
  const better = (t: BatteryTruth) => t.value - present.value > 2 * Math.hypot(t.standardError, present.standardError);
  const trulyBetter = [...truths].filter(([, t]) => better(t)).map(([n]) => n);
  const trulyBest = [...truths].sort((a, b) => b[1].value - a[1].value)[0]?.[0] ?? null;
  const named = trial?.named ?? null;
  const verdict = named === null ? (trulyBetter.length ? 'none named (a miss)' : 'none named') : trulyBetter.includes(named) ? 'right' : 'WRONG';
  const words = `named ${named ?? 'none'} (best by J: ${trial?.best ?? '-'}); truly better than the logging policy: ${trulyBetter.join(', ') || 'none'}; truly best ${trulyBest}: ${verdict}`;
  return { named, best: trial?.best ?? null, trulyBetter, trulyBest, verdict, words };
}

type Warning = { severity: 'caution' | 'serious'; topic: string; message: string; candidate?: string };

async function main() {
  const args = process.argv.slice(2);
  // The plants whose logs break an assumption (noisy readings, drift, two tunings) and their controls (kept) after the others; each law's truth is
  // rolled out as it acts on the true state (truthPolicy: a law on a noisy reading), on the end-of-log plant.
  const all: (ReturnType<typeof rolloutTruthPlants>[number] & Partial<Pick<BrokenLogPlant, 'truthPolicy'>>)[] = [...rolloutTruthPlants(), ...brokenLogPlants(), ...keptAssumptionPlants(), ...movedSetpointPlants(), ...manualStretchPlants(), ...deliveryFeedforwardPlants()], known = new Set(all.map((p) => p.name));
  const names = option(args, 'plants', [...known].join(',')).split(',');
  const unknown = [...names, ...MORE_ROLLOUTS].filter((n) => !known.has(n));
  if (unknown.length) throw new Error(`holdoutCliRows: no plant with rollout truth named ${unknown.join(', ')} (have ${[...known].join(', ')})`);
  const seeds = option(args, 'seeds', '1,2,3,4,5').split(',').map(Number);
  const transitions = Number(option(args, 'transitions', '100000')), approximator = option(args, 'approximator', 'linear');
  const resamples = option(args, 'resamples', ''), out = option(args, 'out', ''), keepRuns = option(args, 'keep-runs', 'all');
  const driftShare = Number(option(args, 'drift-share', String(DRIFT_RECENT_SHARE))), cutBy = option(args, 'cut-by', 'csv');
  if (cutBy !== 'csv' && cutBy !== 'excludedRuns') throw new Error(`holdoutCliRows: --cut-by is csv or excludedRuns, not ${cutBy}`);
  const work = join(tmpdir(), `holdout-cli-${process.pid}`);
  mkdirSync(work, { recursive: true });
  const rows: object[] = [], baseline: object[] = [];
  const plants = all.filter((p) => names.includes(p.name));
  console.log(['plant', 'approx', 'seed', 'candidate', 'truth', 'truthSE', 'J', 'err%', 'interval', 'range', 'holds', 'miss/SE', 'settled', 'status', 'most severe', 'exit', 'class', 'seconds'].join('\t'));
  for (const plant of plants) for (const seed of seeds) {
    const whole = plant.simulate({ transitions, seed }), cut = keepRuns === 'change' ? keptRunsAfterChange(whole, driftShare) : null, data = cut?.data ?? whole;
    // By excludedRuns: the whole log is written (runs labelled by their position, csvOf) and the project leaves out runs 0 to cut.from − 1.
    const byLabel = cut !== null && cutBy === 'excludedRuns', excludedRuns = byLabel && cut.from > 0 ? [{ from: '0', to: String(cut.from - 1), reason: cut.why }] : [];
    const csv = `${plant.name}-s${seed}${cut && !byLabel ? '-kept' : ''}.csv`;
    if (cut) console.log(`#\tkept runs: ${cut.from}–${cut.runs - 1} of ${cut.runs} (${cut.why}); ${data.count} transitions${byLabel ? '; left out by data.csv.excludedRuns' : ''}`);
    writeFileSync(join(work, csv), csvOf(plant, byLabel ? whole : data));
    const repeated = repeatedActions(data);
    console.log(`#\trepeated actions: ${(100 * repeated.share).toFixed(2)} % of rows repeat the row before exactly; longest streak ${repeated.longest} rows`);
    const projectPath = join(work, `${plant.name}-s${seed}-${approximator}.spcritic`);
    writeFileSync(projectPath, JSON.stringify(projectOf(plant, csv, approximator, seed, data.terminal.some((t) => t !== 0), excludedRuns), null, 2));
    const cli = cliCommand('evaluate', projectPath, '--json', ...(resamples ? ['--resamples', resamples] : []));
    const started = Date.now();
    const run = spawnSync(process.execPath, cli.args, { encoding: 'utf8', maxBuffer: 1 << 30 });
    const seconds = (Date.now() - started) / 1000;
    if (run.status !== 0 && run.status !== 3) { console.log(`${plant.name}\t${approximator}\t${seed}\tFAILED exit ${run.status}: ${run.stderr.slice(0, 400)}`); continue; }
    const json = JSON.parse(run.stdout);
    // The command line's own answer, kept beside the rows for what they do not carry (e.g. the fit's message).
    if (out) writeFileSync(out.replace(/\.json$/, '') + `-${plant.name}-s${seed}.cli.json`, run.stdout);
    const starts: StartSet = { name: 'runStarts', description: 'the log’s own run starts', states: data.startStates, count: data.episodeCount };
    const dynamics = plant.dynamics, onTrueState = plant.truthPolicy ?? ((spec: GaussianPolicySpec) => spec), rolloutsPerStart = MORE_ROLLOUTS.includes(plant.name) ? ROLLOUTS_PER_START.more : ROLLOUTS_PER_START.default;
    const truths = new Map<string, BatteryTruth>();
    for (const c of json.assessment.candidates) {
      const spec = plant.candidates.find((k) => k.name === c.name)!.spec;
      const truth = rolloutTruth(dynamics, onTrueState(spec), plant.discount, starts, { rolloutsPerStart, seed: ROLLOUT_SEED });
      truths.set(c.name, truth);
      const j: number = c.policyValue.value, interval: [number, number] | null = c.policyValue.basic ?? c.policyValue.percentile;
      const range: [number, number] | null = c.reportedRange;
      const margin = 2 * truth.standardError;
      const miss = range ? Math.max(range[0] - truth.value, truth.value - range[1], 0) : NaN;
      const holds = range ? miss <= margin : false;
      const warnings: Warning[] = [...c.warnings, ...json.assessment.warnings.filter((w: Warning) => !w.candidate || w.candidate === c.name)];
      const serious = warnings.filter((w) => w.severity === 'serious'), cautions = warnings.filter((w) => w.severity === 'caution');
      const most = serious.length ? `serious: ${serious.map((w) => w.topic).join('; ')}` : cautions.length ? `caution: ${cautions.map((w) => w.topic).join('; ')}` : 'none';
      const policy = json.policies.find((p: { name: string }) => p.name === c.name);
      const status = policy?.status ?? '?';
      const settled = c.settled !== false;
      const kind = !serious.length && settled ? (holds ? 'confident & right' : 'confident & wrong') : holds ? 'cautious & right' : 'cautious & wrong';
      const err = 100 * (j - truth.value) / Math.abs(truth.value);
      const fmt = (r: [number, number] | null) => (r ? `${r[0].toFixed(3)}..${r[1].toFixed(3)}` : '-');
      console.log([plant.name, approximator, seed, c.name, truth.value.toFixed(4), truth.standardError.toFixed(4), j.toFixed(4), err.toFixed(2), fmt(interval), fmt(range), holds,
        range ? (miss / truth.standardError).toFixed(1) : '-', c.settled, status, most, run.status, kind, seconds.toFixed(0)].join('\t'));
      rows.push({ plant: plant.name, approximator, seed, candidate: c.name, truth, j, err, interval, range, holds, settled: c.settled, status, warnings, confirmation: c.confirmation, exit: run.status, kind, seconds,
        fitMessage: policy?.message ?? null, functionClasses: c.functionClasses?.reason ?? null, classes: c.functionClasses?.classes?.map((k: { label: string; value: number; interval: [number, number] | null; standardError: number | null }) => ({ label: k.label, value: k.value, interval: k.interval, standardError: k.standardError })) ?? null,
        // Every pair the class rule compared (paired standard errors, the smallest gap it could see), for bench/nestedClassRows.ts.
        classPairs: c.functionClasses?.pairs ?? null, crossChecks: c.crossChecks.map((x: { label: string; agreement: string; estimate: { value: number } | null }) => ({ label: x.label, agreement: x.agreement, value: x.estimate?.value ?? null })) });
    }
    const present = json.assessment.presentController;
    if (json.assessment.runOrder) console.log(`#\trun order: ${JSON.stringify({ changed: json.assessment.runOrder.changed?.length ?? null, change: json.assessment.runOrder.change ?? null, reason: json.assessment.runOrder.reason ?? null, wholeLog: json.assessment.runOrder.wholeLog?.reading ?? null })}`);
    if (present) console.log(`#\tpresent controller J ${present.policyValue.value.toFixed(4)} interval ${JSON.stringify(present.policyValue.basic)}; global warnings: ${json.assessment.warnings.map((w: Warning) => `${w.severity}:${w.topic}`).join('; ')}`);
    // The baseline every difference is taken against: the present controller's J (fitted to the logged actions)
    // beside the truth of the plant's logging policy (plant.behaviour, with its limits), rolled out from the same
    // run starts with the same budget and seed as the candidates' truth (bench/baselineContradictedRows.ts).
    if (present) {
      const truth = rolloutTruth(dynamics, onTrueState(plant.behaviour), plant.discount, starts, { rolloutsPerStart, seed: ROLLOUT_SEED });
      const j: number = present.policyValue.value, interval: [number, number] | null = present.policyValue.basic ?? present.policyValue.percentile;
      const margin = 2 * truth.standardError;
      const miss = interval ? Math.max(interval[0] - truth.value, truth.value - interval[1], 0) : NaN;
      const err = 100 * (j - truth.value) / Math.abs(truth.value);
      // The baseline in the compared function classes (absent from a CLI before it): verdict, range to report, and whether that holds the truth.
      const presentRange: [number, number] | null = present.reportedRange ?? null;
      const rangeMiss = presentRange ? Math.max(presentRange[0] - truth.value, truth.value - presentRange[1], 0) : NaN;
      const classes = { settled: present.settled ?? null, range: presentRange, rangeHolds: presentRange ? rangeMiss <= margin : null, reason: present.functionClasses?.reason ?? null,
        classes: present.functionClasses?.classes?.map((k: { label: string; value: number; interval: [number, number] | null }) => ({ label: k.label, value: k.value, interval: k.interval })) ?? null };
      const checks = present.crossChecks.map((x: { label: string; agreement: string; note: string; estimate: { value: number } | null }) => ({ label: x.label, agreement: x.agreement, note: x.note, value: x.estimate?.value ?? null }));
      console.log([plant.name, approximator, seed, PRESENT, truth.value.toFixed(4), truth.standardError.toFixed(4), j.toFixed(4), err.toFixed(2),
        interval ? `${interval[0].toFixed(3)}..${interval[1].toFixed(3)}` : '-', presentRange ? `${presentRange[0].toFixed(3)}..${presentRange[1].toFixed(3)}` : '-', interval ? miss <= margin : false, interval ? (miss / truth.standardError).toFixed(1) : '-',
        present.settled ?? '-', present.confirmation.status, checks.map((x: { label: string; agreement: string }) => `${x.label}: ${x.agreement}`).join('; '), run.status, '-', seconds.toFixed(0)].join('\t'));
      const trial = trialVerdict(json.trial, truth, truths);
      console.log(`#\ttrial: ${trial.words}`);
      baseline.push({ plant: plant.name, approximator, seed, candidate: PRESENT, keptRuns: cut ? { from: cut.from, runs: cut.runs, why: cut.why } : null, runOrder: json.assessment.runOrder ?? null, truth, j, err, interval, holds: interval ? miss <= margin : false, missOverSE: interval ? miss / truth.standardError : null,
        confirmation: present.confirmation, crossChecks: checks, globalWarnings: json.assessment.warnings, exit: run.status, seconds, ...classes, trial });
    }
    if (out) writeFileSync(out, JSON.stringify(rows, null, 1));
    // Apart, so the readers of the candidate rows (bench/nestedClassRows.ts and the rest) read the same array as before.
    if (out) writeFileSync(baselineFile(out), JSON.stringify(baseline, null, 1));
  }
  console.log(`# CLI: ${cliCommand().which}; ${transitions} transitions; resamples ${resamples || 'the CLI default'}`);
}
main();
