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
  readonly states: readonly Float64Array[]; // ds columns over records
  readonly actions: readonly Float64Array[]; // m columns over records
  readonly rewards: Float64Array; // records, already rewards
  readonly terminal?: Float64Array; // records, 0/1
  /** Next-state columns on the same row, or undefined for "next row". */
  readonly nextStates?: readonly Float64Array[];
  readonly stateNames: readonly string[];
  readonly actionNames: readonly string[];
  readonly lineOf: (record: number) => number;
}

type Successor = number | 'terminal' | 'none';

/** The record holding s' for kept record r, 'terminal', or 'none' (end of episode or broken chain). */
function successorOf(c: StepColumns, r: number): Successor {
  if (c.terminal?.[r] === 1) return 'terminal';
  if (c.nextStates) return r;
  const next = r + 1;
  return next < c.kept.length && c.kept[next] && c.episodeOf[next] === c.episodeOf[r] ? next : 'none';
}

export function buildTransitions(c: StepColumns): { transitions: TransitionSet; report: string[] } {
  const ds = c.states.length, m = c.actions.length, records = c.kept.length;
  const successor = new Int32Array(records).fill(-2); // −2 no transition, −1 terminal, else record
  let n = 0;
  for (let r = 0; r < records; r++) {
    if (!c.kept[r]) continue;
    const s = successorOf(c, r);
    if (s === 'none') continue;
    successor[r] = s === 'terminal' ? -1 : s;
    n++;
  }
  const t = allocate(n, ds, m, c.episodeCount);
  let k = 0;
  const started = new Uint8Array(c.episodeCount);
  for (let r = 0; r < records; r++) {
    if (!c.kept[r]) continue;
    const e = c.episodeOf[r];
    if (!started[e]) {
      started[e] = 1;
      for (let j = 0; j < ds; j++) t.startStates[e * ds + j] = c.states[j][r];
    }
    if (successor[r] === -2) continue;
    writeStep(c, r, successor[r], k, t);
    k++;
  }
  const transitions: TransitionSet = {
    count: n, stateDim: ds, actionDim: m, stateNames: [...c.stateNames], actionNames: [...c.actionNames],
    episodeCount: c.episodeCount, ...t,
  };
  return { transitions, report: describeSteps(c, transitions) };
}

function allocate(n: number, ds: number, m: number, e: number) {
  return {
    states: new Float64Array(n * ds), actions: new Float64Array(n * m), rewards: new Float64Array(n),
    nextStates: new Float64Array(n * ds), terminal: new Uint8Array(n), episode: new Int32Array(n),
    startStates: new Float64Array(e * ds), sourceLine: new Int32Array(n),
  };
}

function writeStep(c: StepColumns, r: number, successor: number, k: number, t: ReturnType<typeof allocate>): void {
  const ds = c.states.length, m = c.actions.length;
  const next = successor === -1 ? c.states : c.nextStates ?? c.states;
  const from = successor === -1 ? r : successor;
  for (let j = 0; j < ds; j++) {
    t.states[k * ds + j] = c.states[j][r];
    t.nextStates[k * ds + j] = next[j][from];
  }
  for (let j = 0; j < m; j++) t.actions[k * m + j] = c.actions[j][r];
  t.rewards[k] = c.rewards[r];
  t.terminal[k] = successor === -1 ? 1 : 0;
  t.episode[k] = c.episodeOf[r];
  t.sourceLine[k] = c.lineOf(r);
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
    report.push(`Next states from the next row of the same episode: ${plural(chained, 'transition')}; the last row of each episode has no successor.`);
  }
  if (c.terminal) report.push(`Terminal column: ${plural(terminal, 'transition')} end${terminal === 1 ? 's' : ''} in a terminal state (not bootstrapped past).`);
  report.push(...describeHoles(c));
  report.push(`In all: ${plural(t.count, 'transition')} in ${plural(t.episodeCount, 'episode')}.`);
  return report;
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
    : 'the rows on either side are not joined into a transition; the episode is split there into separate chains of steps but keeps its one start state';
  const lines = count === 1 && !holes[0].includes('–') ? 'line' : 'lines';
  return [`${plural(count, 'run')} of excluded rows inside an episode (${lines} ${holes.join(', ')}${more}): ${effect}.`];
}
