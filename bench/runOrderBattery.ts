/**
 * The run-order check (src/core/diagnostics/runOrder.ts, runOrderFinding.ts) on simulated logs
 * directly, no evaluation: every battery plant, every hold-out, the probe37 plants and their controls,
 * and the three sample projects. Per log: the runs, the runs skipped per block, the smallest
 * Bonferroni-corrected p of the law's coefficients, of the plant model's slopes and of its intercepts
 * (K·p, K the coefficients tested), the finding at each candidate family-wise level, and where the finding
 * has one, the shape of the change it leads with (core/diagnostics/changeShape.ts: step at a run position,
 * or drift) and the shapes of every changed coefficient (l: law, m: plant model; -1 the intercept).
 *
 *   nice -n 10 npx tsx bench/runOrderBattery.ts [--seeds 1,2,3,4,5] [--transitions 100000] [--plants a,b] [--left-out-first 0.333]
 *
 * --left-out-first f: each log's earliest share f of runs is left out as data.csv.excludedRuns leaves them
 * (the runs kept cut by episodeTransitions, the whole log beside them, core/transitions.ts WholeLog), and the
 * pipeline's check (pipeline/runOrderCheck.ts) reads both: the columns are then the reading of the whole log
 * (core/diagnostics/runsLeftOutReading.ts) and the severity given at RUN_ORDER_ALPHA (memory38's rule).
 *
 * The rule these columns are read by: test/battery/README.md, "Run order".
 */
import { readFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { batteryPlants } from '../test/battery/catalogue';
import { holdoutPlants } from '../test/battery/holdout/levelValvePlant';
import { brokenLogPlants, keptAssumptionPlants, movedSetpointPlants } from '../test/battery/holdout/brokenLogPlants';
import { runOrderTrends, type RunOrderData, type RunOrderResult } from '../src/core/diagnostics/runOrder';
import { changedTrends, runOrderSeverity, shownTrends } from '../src/core/diagnostics/runOrderFinding';
import { RUN_ORDER_ALPHA, RUN_ORDER_MIN_RUNS } from '../src/core/limits';
import { episodeTransitions, indexEpisodes } from '../src/core/bootstrap/episodeTransitions';
import type { TransitionSet } from '../src/core/transitions';
import { runOrderAssessment } from '../src/pipeline/runOrderCheck';
import { loggedActionLimits } from '../src/core/loggedActionLimits';
import { openProject } from '../src/pipeline/openProject';
import { startRun } from '../src/pipeline/projectRun';

const ALPHAS = [1e-2, 1e-3, 1e-4, 1e-5];
const CHANGED = new Set(['holdout-dosing-pump-wear-g0.96', 'holdout-cold-store-retuned-g0.97', ...movedSetpointPlants().map((p) => p.name)]);

function option(name: string, fallback: string): string {
  const at = process.argv.indexOf(`--${name}`);
  return at >= 0 ? process.argv[at + 1] : fallback;
}

function smallest(result: RunOrderResult, pick: (block: string, input: number) => boolean): string {
  if ('reason' in result) return '—';
  const k = result.trends.length, ps = result.trends.filter((t) => pick(t.block, t.input)).map((t) => Math.min(1, t.p * k));
  return ps.length ? Math.min(...ps).toExponential(1) : '—';
}

function row(name: string, seed: number | string, data: RunOrderData): { serious: boolean[]; caution: boolean[] } {
  // The limits as the baseline reads them from the log (repeated extremes; no candidate's declared bounds here).
  const result = runOrderTrends({ ...data, actionLimits: loggedActionLimits(data.actions, data.count, data.actionDim) }, RUN_ORDER_MIN_RUNS);
  const severities = ALPHAS.map((a) => runOrderSeverity(result, a));
  const runs = 'reason' in result ? result.reason : `${result.runs} (skip ${result.lawSkipped}/${result.modelSkipped})`;
  console.log([name, seed, runs, smallest(result, (b) => b === 'law'), smallest(result, (b, i) => b === 'model' && i >= 0), smallest(result, (b, i) => b === 'model' && i < 0),
    ...severities.map((s) => s ?? '·'), shapes(result)].join(' | '));
  return { serious: severities.map((s) => s === 'serious'), caution: severities.map((s) => s === 'caution') };
}

/** The shown coefficient's change, then every changed one's: "step@125 [l0.0 step@125, m0.-1 drift]". */
function shapes(result: RunOrderResult): string {
  const shown = shownTrends(result), changed = changedTrends(result);
  const text = (t: (typeof shown)[number]) => (t.change ? (t.change.kind === 'step' ? `${t.change.clear ? 'step' : 'unclear-step'}@${t.change.run}` : 'drift') : '?');
  return shown.length ? `${text(shown[0])} [${changed.map((t) => `${t.block[0]}${t.output}.${t.input} ${text(t)}`).join(', ')}]` : '·';
}

/** The check with the earliest `share` of runs left out: the whole log's reading and the finding's severity. */
function leftOutRow(name: string, seed: number | string, data: TransitionSet, share: number): { serious: boolean[]; caution: boolean[] } {
  const from = Math.round(data.episodeCount * share), runs = Int32Array.from({ length: data.episodeCount - from }, (_, k) => from + k);
  const kept = episodeTransitions(data, indexEpisodes(data), runs);
  const keptRuns = Uint8Array.from({ length: data.episodeCount }, (_, e) => (e >= from ? 1 : 0));
  const { summary, warnings } = runOrderAssessment({ ...kept, wholeLog: { transitions: data, keptRuns } }, loggedActionLimits(kept.actions, kept.count, kept.actionDim));
  const severity = warnings[0]?.severity ?? null;
  console.log([name, seed, `${data.episodeCount} runs, first ${from} left out`, summary.wholeLog?.reading ?? '?', severity ?? '·'].join(' | '));
  return { serious: ALPHAS.map(() => severity === 'serious'), caution: ALPHAS.map(() => severity === 'caution') };
}

async function sampleData(sample: string): Promise<{ data: TransitionSet; dispose: () => void }> {
  const folder = join(dirname(fileURLToPath(import.meta.url)), '..', 'sample-projects', sample);
  const opened = await openProject(await readFile(join(folder, `${sample}.spcritic`), 'utf8'), `${sample}.spcritic`, async (p: string) => new Uint8Array(await readFile(join(folder, p))));
  if (!opened.ok) throw new Error(`${sample}: ${opened.problems.map((p) => p.message).join('; ')}`);
  const started = await startRun(opened.value.project, opened.value.dataset);
  if (!started.ok) throw new Error(`${sample}: ${started.problems.map((p) => p.message).join('; ')}`);
  return { data: started.value.plan.data, dispose: () => started.value.dispose() };
}

async function main(): Promise<void> {
  const seeds = option('seeds', '1,2,3,4,5').split(',').map(Number), transitions = Number(option('transitions', '100000'));
  const only = option('plants', '').split(',').filter(Boolean);
  const plants = [...batteryPlants(), ...holdoutPlants(), ...brokenLogPlants(), ...movedSetpointPlants(), ...keptAssumptionPlants().map((p) => ({ ...p, name: `${p.name} (control)` }))]
    .filter((p) => only.length === 0 || only.some((o) => p.name.includes(o)));
  console.log(`# ${transitions} transitions, seeds ${seeds.join(',')}; K·p smallest over law | model slopes | model intercepts; finding at α = ${ALPHAS.map((a) => a.toExponential(0)).join(', ')}`);
  console.log('log | seed | runs (skipped law/model) | law K·p | model slope K·p | model offset K·p | ' + ALPHAS.map((a) => `α ${a.toExponential(0)}`).join(' | '));
  const stationaryFalse = ALPHAS.map(() => 0), changedMissed = ALPHAS.map(() => 0), stationaryCautions = ALPHAS.map(() => 0);
  let stationary = 0, changed = 0;
  const tally = (name: string, r: { serious: boolean[]; caution: boolean[] }) => {
    const isChanged = CHANGED.has(name);
    if (isChanged) changed++; else stationary++;
    ALPHAS.forEach((_, k) => {
      if (isChanged && !r.serious[k]) changedMissed[k]++;
      if (!isChanged && r.serious[k]) stationaryFalse[k]++;
      if (!isChanged && r.caution[k]) stationaryCautions[k]++;
    });
  };
  const share = Number(option('left-out-first', '0'));
  const check = (name: string, seed: number | string, data: TransitionSet) => (share > 0 ? leftOutRow(name, seed, data, share) : row(name, seed, data));
  if (share > 0) console.log(`# the earliest ${share} of each log's runs left out; columns: log | seed | runs | whole-log reading | finding at α ${RUN_ORDER_ALPHA} (every α column of the tally is this one)`);
  for (const plant of plants) for (const seed of seeds) tally(plant.name, check(plant.name, seed, plant.simulate({ transitions, seed })));
  if (only.length === 0) {
    for (const sample of ['heating-loop', 'heating-historian', 'tank-levels']) {
      const s = await sampleData(sample);
      try { tally(sample, check(`sample ${sample}`, '—', s.data)); } finally { s.dispose(); }
    }
  }
  console.log(`# stationary logs ${stationary}, changed logs ${changed}`);
  ALPHAS.forEach((a, k) => console.log(`# α ${a.toExponential(0)}: serious on stationary ${stationaryFalse[k]}, cautions on stationary ${stationaryCautions[k]}, changed logs not serious ${changedMissed[k]}`));
}

void main();
