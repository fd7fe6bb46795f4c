/**
 * unused42 (issue 9; measure only, not a rule: /work/notes/unused42-rule.md, written before anything was
 * computed). For a logged numeric column c the project does not use, two effects in the held check's scale
 * (src/core/diagnostics/heldActions.ts: RMS over the logged rows of the difference of two fits' means, in the
 * fuller fit's residual sd, max over components):
 *   E_law   — each action fitted on [1, s] and on [1, s, c];
 *   E_plant — each next state fitted on [1, s, a] and on [1, s, a, c].
 * Both fits are the project's own model of the present controller (core/behaviourModel.ts fitBehaviourModel:
 * least squares, or its censored fit where the fitted column shows limits), so a check built on them would read
 * what the product reads. A column that explains the action beyond the states is not harm by itself: the action
 * then carries c, and the estimates are biased only if c also moves the next state beyond (s, a) (a confounder;
 * omitted-variable bias, common practice). Logs: the cold store of probe42 (coldStoreDeliveryPlant.ts) with its
 * fed-forward delivery load w left unused, with an invented actuator-position column, without the feedforward,
 * and a row counter; the three samples with their unused numeric columns.
 *   nice -n 10 npx tsx bench/unusedColumnEffects.ts [--rows 100000] [--seeds 1,2,3]
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { BehaviourModelError, fitBehaviourModel, type BehaviourModel } from '../src/core/behaviourModel';
import { hasLimits } from '../src/core/loggedActionLimits';
import { createRandom } from '../src/core/random';
import type { TransitionSet } from '../src/core/transitions';
import { importDataset } from '../src/data/importDataset';
import type { ColumnRoles, CsvSettings } from '../src/project/schema';
import { logBrokenRuns, steadyRun } from '../test/battery/holdout/brokenLog';
import { DELIVERY_FEEDFORWARD, DELIVERY_MEMORY, TODAY_WITHOUT_FEEDFORWARD, coldStoreDeliveryPlant, deliveryDynamics, deliveryLaw } from '../test/battery/holdout/coldStoreDeliveryPlant';

/** The two fits of one fitted column: on [1, x] and on [1, x, c]; null where the model could not fit it. */
export type PairedFit = { readonly small: BehaviourModel; readonly full: BehaviourModel } | null;

/** One effect: its value, whether a fit read limits from the fitted column (then its censored fit ran), components left out, the fits. */
export type ColumnEffect = { readonly effect: number; readonly censored: boolean; readonly skipped: number; readonly fits: readonly PairedFit[] } | { readonly reason: string };

/** Rows i with c[i] finite. */
function finiteRows(c: ArrayLike<number>): number[] {
  const rows: number[] = [];
  for (let i = 0; i < c.length; i++) if (Number.isFinite(c[i])) rows.push(i);
  return rows;
}

/** x (n×dx) over `rows`, with c appended as one more column when given. */
function design(x: ArrayLike<number>, dx: number, rows: readonly number[], c?: ArrayLike<number>): Float64Array {
  const d = dx + (c ? 1 : 0), out = new Float64Array(rows.length * d);
  rows.forEach((i, r) => {
    for (let p = 0; p < dx; p++) out[r * d + p] = x[i * dx + p];
    if (c) out[r * d + dx] = c[i];
  });
  return out;
}

function means(model: { offset: number[]; gain: number[][] }, x: Float64Array, d: number, r: number): number {
  let mu = model.offset[0];
  for (let p = 0; p < d; p++) mu += model.gain[0][p] * x[r * d + p];
  return mu;
}

/**
 * max_j RMS_rows (μ_j(x) − μ_j(x, c)) / σ_j(x, c): each column j of y (n×dy) fitted on [1, x] and [1, x, c] by
 * fitBehaviourModel, one column at a time, over the rows where c is finite. A column the model cannot fit (e.g. a
 * derived state that follows the row exactly: no residual, nothing for c to move) is left out and counted.
 * Shapes: x n×dx, y n×dy, c n, all row-major.
 */
export function columnEffect(x: ArrayLike<number>, dx: number, y: ArrayLike<number>, dy: number, c: ArrayLike<number>): ColumnEffect {
  const rows = finiteRows(c), n = rows.length, without = design(x, dx, rows), withC = design(x, dx, rows, c);
  let effect = 0, censored = false, skipped = 0, reason = '';
  const fits: PairedFit[] = [];
  for (let j = 0; j < dy; j++) {
    const yj = Float64Array.from(rows, (i) => y[i * dy + j]);
    try {
      const small = fitBehaviourModel(without, yj, n, dx, 1), full = fitBehaviourModel(withC, yj, n, dx + 1, 1);
      let sum = 0;
      for (let r = 0; r < n; r++) sum += (means(small, without, dx, r) - means(full, withC, dx + 1, r)) ** 2;
      effect = Math.max(effect, Math.sqrt(sum / n) / full.std[0]);
      censored ||= hasLimits(small.limits) || hasLimits(full.limits);
      fits.push({ small, full });
    } catch (error) {
      if (!(error instanceof BehaviourModelError)) throw error;
      fits.push(null);
      skipped++;
      reason = error.message;
    }
  }
  return skipped === dy ? { reason } : { effect, censored, skipped, fits };
}

/** [s, a] per row: n×(ds + m). */
function statesAndActions(d: TransitionSet, ds: number): Float64Array {
  const dx = ds + d.actionDim, out = new Float64Array(d.count * dx);
  for (let i = 0; i < d.count; i++) {
    for (let p = 0; p < ds; p++) out[i * dx + p] = d.states[i * d.stateDim + p];
    for (let j = 0; j < d.actionDim; j++) out[i * dx + ds + j] = d.actions[i * d.actionDim + j];
  }
  return out;
}

/** The first ds of each row's stateDim values (the states the project uses when extra columns ride along). */
function firstStates(x: Float64Array, d: TransitionSet, ds: number): Float64Array {
  return Float64Array.from({ length: d.count * ds }, (_, k) => x[Math.floor(k / ds) * d.stateDim + (k % ds)]);
}

/**
 * B (the rule file's addendum 2): max over next-state component k and action j of |g_kj(without c) − g_kj(with c)|·
 * sd(a_j | s)/τ_k — how far leaving c out moves the plant's answer to the action, over the action's logged spread given
 * the states, in the next state's noise. Null where a fit is missing.
 */
export function actionAnswerShift(law: ColumnEffect, plant: ColumnEffect, ds: number): number | null {
  if ('reason' in law || 'reason' in plant) return null;
  let shift = 0;
  for (const fit of plant.fits) {
    if (!fit) continue;
    law.fits.forEach((lawFit, j) => {
      if (lawFit) shift = Math.max(shift, (Math.abs(fit.small.gain[0][ds + j] - fit.full.gain[0][ds + j]) * lawFit.small.std[0]) / fit.full.std[0]);
    });
  }
  return shift;
}

/** E_law, E_plant and B of column c on a log whose first ds state columns are the project's states. */
export function lawAndPlantEffects(d: TransitionSet, ds: number, c: ArrayLike<number>): { law: ColumnEffect; plant: ColumnEffect; shift: number | null } {
  const law = columnEffect(firstStates(d.states, d, ds), ds, d.actions, d.actionDim, c);
  const plant = columnEffect(statesAndActions(d, ds), ds + d.actionDim, firstStates(d.nextStates, d, ds), ds, c);
  return { law, plant, shift: actionAnswerShift(law, plant, ds) };
}

/** State column k of the log (n values). */
export function stateColumn(d: TransitionSet, k: number): Float64Array {
  return Float64Array.from({ length: d.count }, (_, i) => d.states[i * d.stateDim + k]);
}

/** Position noise (sd, fraction of the stroke) and the lag's step weight (first order: p += 0.5·(u − p)); the rule file. */
export const POSITION_NOISE = 0.005, POSITION_LAG_WEIGHT = 0.5;

/**
 * An invented actuator-position reading of action 0 (the rule file): 'lagged' p_t = p_{t−1} + 0.5·(u_t − p_{t−1}),
 * 'delayed' p_t = u_{t−1}; both plus white noise of sd 0.005; each run starts at p = u_0.
 */
export function actuatorPosition(d: TransitionSet, kind: 'lagged' | 'delayed', seed: number): Float64Array {
  const rng = createRandom(seed), m = d.actionDim, out = new Float64Array(d.count);
  let p = 0, previous = 0;
  for (let i = 0; i < d.count; i++) {
    const u = d.actions[i * m];
    if (i === 0 || d.episode[i] !== d.episode[i - 1]) p = previous = u;
    p = kind === 'lagged' ? p + POSITION_LAG_WEIGHT * (u - p) : previous;
    previous = u;
    out[i] = p + POSITION_NOISE * rng.normal();
  }
  return out;
}

/** The cold store under `law` (default: today's WITHOUT its feedforward, case 3), w logged as a third state column. */
export function deliveryLog(memory: keyof typeof DELIVERY_MEMORY, rows: number, seed: number, law = TODAY_WITHOUT_FEEDFORWARD): TransitionSet {
  const dynamics = deliveryDynamics(DELIVERY_MEMORY[memory]), run = steadyRun(dynamics, law, [-20, 0, 0], 200);
  return logBrokenRuns({ episodes: Math.ceil(rows / 400), stepsPerEpisode: 400, seed, stateNames: ['store_temperature_c', 'heat_load', 'delivery_load'],
    actionNames: ['compressor'], runConditions: () => run });
}

const counter = (n: number) => Float64Array.from({ length: n }, (_, i) => i);
const noise = (n: number, seed: number) => { const rng = createRandom(seed); return Float64Array.from({ length: n }, () => rng.normal()); };

function text(e: ColumnEffect): string {
  return 'reason' in e ? `— (${e.reason})` : `${e.effect < 0.005 ? e.effect.toExponential(1) : e.effect.toFixed(2)}${e.censored ? ' (censored fit)' : ''}${e.skipped ? ` (${e.skipped} exact, left out)` : ''}`;
}

/** E_plant·√(1 + E_law²): by the closed form (white, no clip; the rule file) c's plant effect had the action not carried it. */
function combined(e: { law: ColumnEffect; plant: ColumnEffect }): string {
  return 'reason' in e.law || 'reason' in e.plant ? '—' : (e.plant.effect * Math.sqrt(1 + e.law.effect ** 2)).toFixed(2);
}

function row(log: string, column: string, seed: number | string, e: { law: ColumnEffect; plant: ColumnEffect; shift: number | null }): void {
  console.log(`| ${log} | ${column} | ${seed} | ${text(e.law)} | ${text(e.plant)} | ${combined(e)} | ${e.shift === null ? '—' : e.shift.toFixed(2)} |`);
}

/**
 * Case 1 with today's dither swept (feedforward spread 0.1 over the dither: 1, 2, 3, 5; the rule file's addendum) and with
 * a smaller feedforward at dither 0.05 (k 0.0125, 0.05; addendum 2), the first seed.
 */
function sweepRows(rows: number, seed: number): void {
  const laws = [
    ...[0.1, 0.05, 0.1 / 3, 0.02].map((dither) => ({ label: `dither ${dither.toFixed(3)}`, k: DELIVERY_FEEDFORWARD, dither })),
    ...[0.0125, 0.05].map((k) => ({ label: `feedforward ${k}, dither 0.050`, k, dither: 0.05 })),
  ];
  for (const memory of ['white', 'slow'] as const) {
    for (const { label, k, dither } of laws) {
      const d = deliveryLog(memory, rows, seed, deliveryLaw(0.3, 0, k, dither));
      row(`1 feedforward, ${memory}, ${label}`, 'delivery_load w', seed, lawAndPlantEffects(d, 2, stateColumn(d, 2)));
    }
  }
}

function coldStoreRows(rows: number, seeds: readonly number[]): void {
  for (const memory of ['white', 'slow'] as const) {
    for (const seed of seeds) {
      const d = coldStoreDeliveryPlant(memory, true).simulate({ transitions: rows, seed }), w = stateColumn(d, 2);
      row(`1 feedforward, ${memory}`, 'delivery_load w', seed, lawAndPlantEffects(d, 2, w));
      row(`2a same log, ${memory}`, 'position, lagged', seed, lawAndPlantEffects(d, 2, actuatorPosition(d, 'lagged', 1000 + seed)));
      row(`2b same log, ${memory}`, 'position, delayed 1', seed, lawAndPlantEffects(d, 2, actuatorPosition(d, 'delayed', 2000 + seed)));
      row(`1 same log, ${memory}`, 'pure noise N(0,1)', seed, lawAndPlantEffects(d, 2, noise(d.count, 3000 + seed)));
      if (seed === seeds[0]) row(`5 same log, ${memory}`, 'row counter', seed, lawAndPlantEffects(d, 2, counter(d.count)));
      const f = deliveryLog(memory, rows, seed);
      row(`3 no feedforward, ${memory}`, 'delivery_load w', seed, lawAndPlantEffects(f, 2, stateColumn(f, 2)));
      if (seed === seeds[0]) row(`5 no feedforward, ${memory}`, 'row counter', seed, lawAndPlantEffects(f, 2, counter(f.count)));
      // The clean control for the position: no feedforward and w a state, so nothing the law or plant uses is missing.
      row(`2a′ no feedforward, w a state, ${memory}`, 'position, lagged', seed, lawAndPlantEffects(f, 3, actuatorPosition(f, 'lagged', 4000 + seed)));
      row(`2b′ no feedforward, w a state, ${memory}`, 'position, delayed 1', seed, lawAndPlantEffects(f, 3, actuatorPosition(f, 'delayed', 5000 + seed)));
    }
  }
}

/** The samples' numeric columns their projects do not use (the rule file; timestamp_local is not numeric). */
const SAMPLE_COLUMNS: Readonly<Record<string, readonly string[]>> = {
  'heating-loop': ['time_s'], 'tank-levels': ['time_s'], 'heating-historian': ['supply_temp_c'],
};

/** The sample imported by the data layer with `extra` added as a last state column (its rows: those the import keeps). */
function sampleLog(name: string, extra?: string): TransitionSet {
  const folder = join(fileURLToPath(new URL('../sample-projects/', import.meta.url)), name);
  const doc = JSON.parse(readFileSync(join(folder, `${name}.spcritic`), 'utf8')) as { data: { path: string; csv: CsvSettings }; columns: ColumnRoles };
  const columns: ColumnRoles = extra ? { ...doc.columns, states: [...doc.columns.states, { column: extra, unit: '' }] } : doc.columns;
  const result = importDataset(new Uint8Array(readFileSync(join(folder, doc.data.path))), doc.data.path, doc.data.csv, columns);
  if (!result.ok) throw new Error(`${name}: ${result.problems[0].message}`);
  return result.value.transitions;
}

function sampleRows(): void {
  for (const [name, extras] of Object.entries(SAMPLE_COLUMNS)) {
    for (const extra of extras) {
      const d = sampleLog(name, extra), ds = d.stateDim - 1;
      row(`4 sample ${name} (${d.count} rows)`, extra, '—', lawAndPlantEffects(d, ds, stateColumn(d, ds)));
    }
    const d = sampleLog(name);
    row(`5 sample ${name} (${d.count} rows)`, 'row counter', '—', lawAndPlantEffects(d, d.stateDim, counter(d.count)));
  }
}

function main(argv: readonly string[]): void {
  const option = (flag: string, fallback: string) => { const k = argv.indexOf(flag); return k >= 0 ? argv[k + 1] : fallback; };
  const rows = Number(option('--rows', '100000')), seeds = option('--seeds', '1,2,3').split(',').map(Number);
  console.log(`unused42: ${rows} rows per cold-store log, seeds ${seeds.join(', ')}`);
  console.log('| log | column | seed | E_law | E_plant | E_plant·√(1 + E_law²) | B |\n|---|---|---|---|---|---|---|');
  coldStoreRows(rows, seeds);
  sweepRows(rows, seeds[0]);
  sampleRows();
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) main(process.argv.slice(2));
