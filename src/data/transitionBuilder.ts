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
  readonly rewards: Float64Array; // records, already rewards
  readonly terminal?: Float64Array; // records, 0/1
  /** Next-state columns on the same row, or undefined for "next row". */
  readonly nextStates?: readonly Float64Array[];
  readonly stateNames: readonly string[];
  readonly actionNames: readonly string[];
  readonly lineOf: (record: number) => number;
  /** Rows kept for the values they supply to later rows' derived states, but starting no transition (derivedStates.ts). */
  readonly supplyOnlyRows?: number;
}

/**
 * successor[r] for each record: the record holding s' (itself with next-state columns), −1 for a
 * terminal row (s' is a copy of s, never used), −2 for no transition (excluded, or the last kept
 * row of its episode's chain). Returns the transition count.
 */
function successors(c: StepColumns, successor: Int32Array): number {
  const { kept, episodeOf, terminal, nextStates } = c, records = kept.length;
  let n = 0;
  for (let r = 0; r < records; r++) {
    if (!kept[r]) { successor[r] = -2; continue; }
    let s: number;
    if (terminal !== undefined && terminal[r] === 1) s = -1;
    else if (nextStates) s = r;
    else s = r + 1 < records && kept[r + 1] && episodeOf[r + 1] === episodeOf[r] ? r + 1 : -2;
    successor[r] = s;
    if (s !== -2) n++;
  }
  return n;
}

export function buildTransitions(c: StepColumns): { transitions: TransitionSet; report: string[] } {
  const ds = c.states.length, m = c.actions.length, records = c.kept.length;
  const successor = new Int32Array(records);
  const n = successors(c, successor);
  const t = allocate(n, ds, m, c.hasStart);
  copyRows(c, successor, t);
  writeStartStates(c, t.startStates, t.startEpisode);
  const transitions: TransitionSet = {
    count: n, stateDim: ds, actionDim: m, stateNames: [...c.stateNames], actionNames: [...c.actionNames],
    episodeCount: c.episodeCount, ...t, startEpisode: t.startEpisode.length === c.episodeCount ? undefined : t.startEpisode,
  };
  return { transitions, report: describeSteps(c, transitions) };
}

/** Transitions written per block: their rows' indices stay in cache while every column is copied. */
const BLOCK = 4096;

/**
 * The transitions' columns from the records, a block of transitions at a time: the source rows of
 * the block first, then one column at a time into the block's slice of the row-major output (a
 * row-by-row loop over every column was the import's slowest step at 10⁶ rows; column by column over
 * all rows at once wrote each output line of cache once per column).
 */
function copyRows(c: StepColumns, successor: Int32Array, t: ReturnType<typeof allocate>): void {
  const ds = c.states.length, m = c.actions.length, next = c.nextStates ?? c.states;
  const from = new Int32Array(BLOCK), to = new Int32Array(BLOCK);
  let r = 0, k0 = 0;
  while (r < successor.length) {
    let b = 0;
    for (; r < successor.length && b < BLOCK; r++) {
      const s = successor[r];
      if (s === -2) continue;
      const k = k0 + b;
      from[b] = r;
      to[b++] = s;
      t.rewards[k] = c.rewards[r];
      t.terminal[k] = s === -1 ? 1 : 0;
      t.episode[k] = c.episodeOf[r];
      t.sourceLine[k] = c.lineOf(r);
    }
    for (let j = 0; j < ds; j++) {
      const column = c.states[j], nextColumn = next[j];
      for (let i = 0; i < b; i++) {
        const row = (k0 + i) * ds + j;
        t.states[row] = column[from[i]];
        t.nextStates[row] = to[i] < 0 ? column[from[i]] : nextColumn[to[i]];
      }
    }
    for (let j = 0; j < m; j++) {
      const column = c.actions[j];
      for (let i = 0; i < b; i++) t.actions[(k0 + i) * m + j] = column[from[i]];
    }
    k0 += b;
  }
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
