/**
 * Which rows belong to which episode. Only kept rows (not excluded) take part; an episode is a
 * run of kept rows in file order, cut where the episode column changes value, where the
 * timestamp jumps by more than the allowed gap, after every terminal row (the plant was
 * reset, so the next row starts afresh), after a time window left out (timeWindows.ts), and after
 * a run left out by label (runRanges.ts).
 */
import type { ColumnRoles } from '../project/schema';
import { formatCount, formatSeconds, plural } from './reportFormat';
import { medianStepSeconds } from './stepMedian';
import { runLabelText } from '../core/runLabelText';

export interface EpisodeAssignment {
  /** Episode of each record, 0-based in file order; −1 for excluded records. */
  readonly episodeOf: Int32Array; // records
  readonly episodeCount: number;
  /**
   * 1 where the episode's first kept row is its true first row, 0 where an excluded row before it
   * may have been (then that row is mid-episode and no start state; see startIsFirstRow).
   */
  readonly hasStart: Uint8Array; // episodes
  /** Sentences for the import report. */
  readonly report: string[];
}

export interface EpisodeInputs {
  readonly kept: Uint8Array; // records; 1 = row used
  readonly terminal?: Float64Array; // records; 1 = next state terminal
  readonly labels?: { codes: Float64Array; values: string[] }; // episode column
  readonly timestampsSeconds?: Float64Array; // timeGap column
  /** medianStepSeconds(timestampsSeconds, kept) where the caller has it already (stepMedian.ts: a pass over the records, and an array of their size for a jittery clock). */
  readonly medianStepSeconds?: number;
  /** Per record, non-zero where it lies in a time window left out (timeWindows.ts): the episode is cut there. */
  readonly inWindow?: Uint16Array; // records
  /** Per record, non-zero where its run is left out by label (runRanges.ts): a label seen again after it starts another run. */
  readonly inRunRange?: Uint16Array; // records
  /** True for an excluded record that is a blank line (it holds no row of any episode). */
  readonly isBlankLine?: (record: number) => boolean;
  readonly lineOf: (record: number) => number;
}

const LISTED = 5;

export function assignEpisodes(rule: ColumnRoles['episode'], inputs: EpisodeInputs): EpisodeAssignment {
  const { kept } = inputs;
  const episodeOf = new Int32Array(kept.length).fill(-1);
  const startsNew = boundaryRule(rule, inputs);
  const firstRows: number[] = [];
  let episode = -1, previous = -1, terminalCuts = 0, windowCuts = 0, afterWindow = false, afterRunLeftOut = false;
  for (let r = 0; r < kept.length; r++) {
    if (!kept[r]) {
      afterWindow ||= (inputs.inWindow?.[r] ?? 0) > 0;
      afterRunLeftOut ||= (inputs.inRunRange?.[r] ?? 0) > 0;
      continue;
    }
    const afterTerminal = previous >= 0 && inputs.terminal?.[previous] === 1;
    // a label kept on both sides of a run left out (A, B left out, A again) is two runs, as A, B, A would be
    const ruleCut = previous < 0 || startsNew.cut(previous, r) || afterRunLeftOut;
    afterRunLeftOut = false;
    if (afterTerminal && !ruleCut) terminalCuts++;
    const windowCut = previous >= 0 && afterWindow && !ruleCut && !afterTerminal;
    if (windowCut) windowCuts++;
    afterWindow = false;
    if (ruleCut || afterTerminal || windowCut) {
      episode++;
      firstRows.push(r);
    }
    episodeOf[r] = episode;
    previous = r;
  }
  const hasStart = Uint8Array.from(firstRows, (r) => (startIsFirstRow(r, startsNew, inputs) ? 1 : 0));
  const report = [...startsNew.report(episode + 1)];
  if (terminalCuts > 0) {
    report.push(`${plural(terminalCuts, 'end-of-run flag')} ended a run before the run rule did; the following row starts a new run.`);
  }
  if (windowCuts > 0) report.push(`${plural(windowCuts, 'run')} cut in two by a time window left out (one more run each).`);
  report.push(...lostStartReport(hasStart, firstRows, inputs.lineOf));
  return { episodeOf, episodeCount: episode + 1, hasStart, report };
}

/**
 * Kept record r begins an episode. Its state is a start state only if r is the episode's first
 * row: true when the record before it (blank lines skipped) is kept — the rule cut between two
 * kept rows — or is the end of the file's head, or is an excluded row that the rule or a terminal
 * flag places in another episode. An excluded row whose episode cannot be read (or that belongs
 * to r's episode) may have been the first row, so r is mid-episode: no start state.
 */
function startIsFirstRow(r: number, rule: BoundaryRule, inputs: EpisodeInputs): boolean {
  for (let q = r - 1; q >= 0; q--) {
    if (inputs.kept[q]) return true;
    if (inputs.isBlankLine?.(q)) continue;
    // The plant was elsewhere (a start-up, a test) and the present controller takes over again here.
    if ((inputs.inWindow?.[q] ?? 0) > 0 || (inputs.inRunRange?.[q] ?? 0) > 0) return true;
    return inputs.terminal?.[q] === 1 || rule.apart(q, r);
  }
  return true;
}

function lostStartReport(hasStart: Uint8Array, firstRows: readonly number[], lineOf: (r: number) => number): string[] {
  const lost: number[] = [];
  hasStart.forEach((h, e) => { if (!h) lost.push(lineOf(firstRows[e])); });
  if (lost.length === 0) return [];
  const one = lost.length === 1;
  const listed = lost.slice(0, LISTED).join(', ') + (lost.length > LISTED ? ` and ${formatCount(lost.length - LISTED)} more` : '');
  const kept = hasStart.length - lost.length;
  return [`${plural(lost.length, 'run')} lost ${one ? 'its' : 'their'} first row to exclusion, so ${one ? 'its' : 'their'} first usable row (line${one ? '' : 's'} ${listed}) is mid-run and not a start state; the start states are the first rows of the other ${plural(kept, 'run')}.`];
}

/**
 * Whether record q (before r) lies in another run than r by the run rule alone (the run column, a
 * stop in the timestamps), for counting the runs a time window takes rows from (timeWindows.ts).
 */
export function runsApart(rule: ColumnRoles['episode'], inputs: EpisodeInputs): (q: number, r: number) => boolean {
  return boundaryRule(rule, inputs).apart;
}

interface BoundaryRule {
  /** True when kept record `r` starts a new episode after kept record `previous` (counted for the report). */
  cut(previous: number, r: number): boolean;
  /** True when record q (before r; it may be excluded) is readably in another episode than r. Not counted. */
  apart(q: number, r: number): boolean;
  report(episodeCount: number): string[];
}

function boundaryRule(rule: ColumnRoles['episode'], inputs: EpisodeInputs): BoundaryRule {
  if (rule.kind === 'column') return labelRule(rule.column, inputs.labels!, inputs.lineOf);
  if (rule.kind === 'timeGap') return gapRule(rule.column, rule.maxGapSeconds, inputs);
  return { cut: () => false, apart: () => false, report: (count) => [`One run for the whole file${count > 1 ? `, cut into ${count} by end-of-run flags` : ''}.`] };
}

function labelRule(column: string, labels: { codes: Float64Array; values: string[] }, lineOf: (r: number) => number): BoundaryRule {
  const finished = new Set<number>();
  const reappearing: string[] = [];
  let reappearCount = 0;
  return {
    cut(previous, r) {
      const before = labels.codes[previous], now = labels.codes[r];
      if (before === now) return false;
      finished.add(before);
      if (finished.has(now)) {
        reappearCount++;
        if (reappearing.length < LISTED) reappearing.push(`${runLabelText(labels.values[now])} at line ${lineOf(r)}`);
      }
      return true;
    },
    apart: (q, r) => labels.codes[q] >= 0 && labels.codes[q] !== labels.codes[r],
    report(count) {
      const lines = [`Runs from column ${column}: ${formatCount(count)} run${count === 1 ? '' : 's'} (a new run wherever the value changes).`];
      if (reappearCount > 0) {
        const more = reappearCount > LISTED ? ` and ${reappearCount - LISTED} more` : '';
        const one = reappearCount === 1;
        lines.push(`${plural(reappearCount, 'value')} of ${column} ${one ? 'reappears' : 'reappear'} after other values and ${one ? 'starts' : 'start'} a new run there: ${reappearing.join(', ')}${more}.`);
      }
      return lines;
    },
  };
}

function gapRule(column: string, maxGapSeconds: number | undefined, inputs: EpisodeInputs): BoundaryRule {
  const t = inputs.timestampsSeconds!;
  const periodSeconds = inputs.medianStepSeconds ?? medianStepSeconds(t, inputs.kept);
  const limit = maxGapSeconds ?? 3 * periodSeconds;
  let gaps = 0;
  return {
    cut(previous, r) {
      const cut = t[r] - t[previous] > limit;
      if (cut) gaps++;
      return cut;
    },
    apart: (q, r) => t[r] - t[q] > limit,
    report(count) {
      if (Number.isNaN(limit)) return [`Runs from timestamp gaps in column ${column}: no two adjacent rows have increasing timestamps, so the sampling period is unknown and the file is one run${count > 1 ? ` (cut into ${count} by end-of-run flags)` : ''}.`];
      const why = maxGapSeconds === undefined ? `3 × the median sampling period of ${formatSeconds(periodSeconds)}` : 'as set';
      return [`Runs from timestamp gaps in column ${column}: a step longer than ${formatSeconds(limit)} (${why}) starts a new run; ${formatCount(gaps)} gap${gaps === 1 ? '' : 's'} → ${formatCount(count)} run${count === 1 ? '' : 's'}.`];
    },
  };
}

