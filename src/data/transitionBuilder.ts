/**
 * Rows → transitions (s, a, r, s', done). Each kept row is one step. With next states from the
 * next row, row r pairs with row r + 1 only when both are kept and in the same episode, so an
 * excluded row breaks the chain there instead of joining its neighbours into a step the plant
 * never took. A terminal row is a transition of its own with done = 1; its s' is a copy of s,
 * never used because nothing is bootstrapped past a terminal state.
 */
import type { TransitionSet } from '../core/transitions';
import { formatCount, plural } from './reportFormat';

export interface StepColumns {
  readonly kept: Uint8Array; // records
  readonly episodeOf: Int32Array; // records, −1 where excluded
  readonly episodeCount: number;
  /** 1 where the episode's first kept row is its true first row (episodes.ts). */
  readonly hasStart: Uint8Array; // episodes
  readonly states: readonly Float64Array[]; // ds columns over records
  readonly actions: readonly Float64Array[]; // m columns over records
  readonly rewards: Float64Array; // records: the reward rule's values, a cost as a cost
  /** −1 for a cost: each transition's reward is rewardSign · rewards[r] (rewardColumn.ts). */
  readonly rewardSign: 1 | -1;
  readonly terminal?: Float64Array; // records, 0/1
  /** Next-state columns on the same row, or undefined for "next row". */
  readonly nextStates?: readonly Float64Array[];
  readonly stateNames: readonly string[];
  readonly actionNames: readonly string[];
  readonly lineOf: (record: number) => number;
  /** Rows kept for the values they supply to later rows' derived states, but starting no transition (derivedStates.ts). */
  readonly supplyOnlyRows?: number;
  /** The run column as codes into its values (−1 where unreadable), where runs are cut by one: each episode's label (TransitionSet.episodeLabels). */
  readonly labels?: { readonly codes: Float64Array; readonly values: readonly string[] };
}

/**
 * The record holding s' for record r: itself with next-state columns, −1 for a terminal row (s' is
 * a copy of s, never used), −2 for no transition (excluded, or the last kept row of its episode's
 * chain). Found where it is used (counted once, then again while copying) rather than kept in an
 * array of the records' size: the array cost more to fill in fresh memory than the test costs twice.
 */
function successorOf(c: StepColumns, r: number): number {
  const { kept, episodeOf, terminal } = c;
  if (!kept[r]) return -2;
  if (terminal !== undefined && terminal[r] === 1) return -1;
  if (c.nextStates) return r;
  return r + 1 < kept.length && kept[r + 1] && episodeOf[r + 1] === episodeOf[r] ? r + 1 : -2;
}

function transitionCount(c: StepColumns): number {
  let n = 0;
  for (let r = 0; r < c.kept.length; r++) if (successorOf(c, r) !== -2) n++;
  return n;
}

export function buildTransitions(c: StepColumns): { transitions: TransitionSet; report: string[] } {
  const ds = c.states.length, m = c.actions.length;
  const n = transitionCount(c);
  const t = allocate(n, ds, m, c.hasStart);
  copyRows(c, t);
  writeStartStates(c, t.startStates, t.startEpisode);
  const transitions: TransitionSet = {
    count: n, stateDim: ds, actionDim: m, stateNames: [...c.stateNames], actionNames: [...c.actionNames],
    episodeCount: c.episodeCount, ...t, startEpisode: t.startEpisode.length === c.episodeCount ? undefined : t.startEpisode,
    ...(c.labels ? { episodeLabels: episodeLabelsOf(c, c.labels) } : {}),
  };
  return { transitions, report: describeSteps(c, transitions) };
}

/** Transitions written per block: their rows' indices stay in cache while every column is copied. */
const BLOCK = 4096;
type Output = ReturnType<typeof allocate>;

/**
 * The transitions' columns from the records, a block of transitions at a time: the source rows of
 * the block first (blockRows), then one column at a time into the block's slice of the row-major
 * output (a row-by-row loop over every column was the import's slowest step at 10⁶ rows; column by
 * column over all rows at once wrote each output line of cache once per column).
 */
function copyRows(c: StepColumns, t: Output): void {
  const ds = c.states.length, m = c.actions.length, next = c.nextStates ?? c.states;
  const from = new Int32Array(BLOCK), to = new Int32Array(BLOCK), records = c.kept.length;
  const { rewards, terminal, episode, sourceLine } = t, sign = c.rewardSign;
  let r = 0, k0 = 0;
  while (r < records) {
    let b = 0;
    for (; r < records && b < BLOCK; r++) {
      const s = successorOf(c, r);
      if (s === -2) continue;
      const k = k0 + b;
      from[b] = r;
      to[b++] = s;
      rewards[k] = sign * c.rewards[r];
      terminal[k] = s === -1 ? 1 : 0;
      episode[k] = c.episodeOf[r];
      sourceLine[k] = c.lineOf(r);
    }
    for (let j = 0; j < ds; j++) copyStateColumn(c.states[j], next[j], from, to, b, t.states, t.nextStates, k0 * ds + j, ds);
    for (let j = 0; j < m; j++) copyColumn(c.actions[j], from, b, t.actions, k0 * m + j, m);
    k0 += b;
  }
}

/** column[from[i]] into out[at + i·stride], and s' (the next row's value, or s again for a terminal row: to[i] < 0) into outNext, for i < b. */
function copyStateColumn(
  column: Float64Array, nextColumn: Float64Array, from: Int32Array, to: Int32Array, b: number,
  out: Float64Array, outNext: Float64Array, at: number, stride: number,
): void {
  for (let i = 0, row = at; i < b; i++, row += stride) {
    const value = column[from[i]], s = to[i];
    out[row] = value;
    outNext[row] = s < 0 ? value : nextColumn[s];
  }
}

/** column[from[i]] into out[at + i·stride] for i < b. */
function copyColumn(column: Float64Array, from: Int32Array, b: number, out: Float64Array, at: number, stride: number): void {
  for (let i = 0, row = at; i < b; i++, row += stride) out[row] = column[from[i]];
}

/** The first kept row's state of every episode that has its true first row (c.hasStart). */
function writeStartStates(c: StepColumns, startStates: Float64Array, startEpisode: Int32Array): void {
  const ds = c.states.length;
  let next = 0, seen = -1;
  for (let r = 0; r < c.kept.length; r++) {
    const e = c.episodeOf[r];
    if (!c.kept[r] || e <= seen) continue;
    seen = e;
    if (!c.hasStart[e]) continue;
    for (let j = 0; j < ds; j++) startStates[next * ds + j] = c.states[j][r];
    startEpisode[next++] = e;
  }
}

/** The run column's cell on each episode's first kept row (null where unreadable). */
function episodeLabelsOf(c: StepColumns, labels: NonNullable<StepColumns['labels']>): (string | null)[] {
  const out: (string | null)[] = new Array(c.episodeCount).fill(null);
  for (let r = 0, seen = -1; r < c.kept.length; r++) {
    const e = c.episodeOf[r];
    if (!c.kept[r] || e <= seen) continue;
    seen = e;
    const code = labels.codes[r];
    out[e] = code >= 0 ? labels.values[code] ?? null : null;
  }
  return out;
}

function allocate(n: number, ds: number, m: number, hasStart: Uint8Array) {
  let starts = 0;
  for (const h of hasStart) starts += h;
  return {
    states: new Float64Array(n * ds), actions: new Float64Array(n * m), rewards: new Float64Array(n),
    nextStates: new Float64Array(n * ds), terminal: new Uint8Array(n), episode: new Int32Array(n),
    startStates: new Float64Array(starts * ds), startEpisode: new Int32Array(starts), sourceLine: new Int32Array(n),
  };
}

const LISTED = 5;

function describeSteps(c: StepColumns, t: TransitionSet): string[] {
  let terminal = 0;
  for (let k = 0; k < t.count; k++) terminal += t.terminal[k];
  const report: string[] = [];
  if (c.nextStates) {
    report.push(`Next states from the next-state columns of the same row: ${plural(t.count, 'transition')}.`);
  } else {
    const chained = t.count - terminal;
    report.push(`Next states from the next row of the same run: ${plural(chained, 'transition')}; the last row of each run has no successor.`);
  }
  if (c.terminal) report.push(`End-of-run column: ${plural(terminal, 'transition')} end${terminal === 1 ? 's' : ''} a run (the plant stopped or was reset there; no value is added past it).`);
  report.push(...describeHoles(c));
  report.push(`In all: ${plural(t.count, 'transition')} in ${plural(t.episodeCount, 'run')}.`);
  report.push(rowAccount(c.kept, t.count, c.supplyOnlyRows));
  return report;
}

/**
 * Every data row is a transition, an excluded row, a row that only supplies earlier values to derived
 * states (kept, but starting no transition: `supplyOnly`), or an unused row (kept, but with no next
 * row: the last row of an episode's chain), and they add up to the rows read. `kept` is the mask of
 * rows that may start a transition, so the supplying rows are among those it leaves out.
 */
export function rowAccount(kept: Uint8Array, transitions: number, supplyOnly = 0): string {
  let used = 0;
  for (let r = 0; r < kept.length; r++) used += kept[r];
  const excluded = kept.length - used - supplyOnly, unused = used - transitions;
  const supplying = supplyOnly > 0 ? ` + ${formatCount(supplyOnly)} supplying earlier values to derived states only` : '';
  return `Rows: ${formatCount(kept.length)} read = ${formatCount(transitions)} transitions + ${formatCount(excluded)} excluded${supplying} + ${formatCount(unused)} unused (kept, with no next row to pair with: the last of a run, or the row before an excluded one).`;
}

/** Runs of excluded rows with kept rows of one episode on both sides: where a chain was cut. */
function describeHoles(c: StepColumns): string[] {
  const holes: string[] = [];
  let count = 0, before = -1;
  for (let r = 0; r < c.kept.length; r++) {
    if (!c.kept[r]) continue;
    if (before >= 0 && r > before + 1 && c.episodeOf[r] === c.episodeOf[before]) {
      count++;
      const first = c.lineOf(before + 1), last = c.lineOf(r - 1);
      if (holes.length < LISTED) holes.push(first === last ? `${first}` : `${first}–${last}`);
    }
    before = r;
  }
  if (count === 0) return [];
  const more = count > LISTED ? ` and ${formatCount(count - LISTED)} more` : '';
  const effect = c.nextStates
    ? 'each excluded row only loses its own transition'
    : 'the rows on either side are not joined into a transition; the run is split there into separate chains of steps but keeps its one start state';
  const lines = count === 1 && !holes[0].includes('–') ? 'line' : 'lines';
  return [`${plural(count, 'stretch', 'stretches')} of excluded rows inside a run (${lines} ${holes.join(', ')}${more}): ${effect}.`];
}
