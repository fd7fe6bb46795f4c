/**
 * Which rows belong to which episode. Only kept rows (not excluded) take part; an episode is a
 * run of kept rows in file order, cut where the episode column changes value, where the
 * timestamp jumps by more than the allowed gap, and after every terminal row (the plant was
 * reset, so the next row starts afresh).
 */
import type { ColumnRoles } from '../project/schema';
import { formatCount, formatSeconds, plural } from './reportFormat';

export interface EpisodeAssignment {
  /** Episode of each record, 0-based in file order; −1 for excluded records. */
  readonly episodeOf: Int32Array; // records
  readonly episodeCount: number;
  /** Sentences for the import report. */
  readonly report: string[];
}

export interface EpisodeInputs {
  readonly kept: Uint8Array; // records; 1 = row used
  readonly terminal?: Float64Array; // records; 1 = next state terminal
  readonly labels?: { codes: Float64Array; values: string[] }; // episode column
  readonly timestampsSeconds?: Float64Array; // timeGap column
  readonly lineOf: (record: number) => number;
}

const LISTED = 5;

export function assignEpisodes(rule: ColumnRoles['episode'], inputs: EpisodeInputs): EpisodeAssignment {
  const { kept } = inputs;
  const episodeOf = new Int32Array(kept.length).fill(-1);
  const startsNew = boundaryRule(rule, inputs);
  let episode = -1, previous = -1, terminalCuts = 0;
  for (let r = 0; r < kept.length; r++) {
    if (!kept[r]) continue;
    const afterTerminal = previous >= 0 && inputs.terminal?.[previous] === 1;
    const ruleCut = previous < 0 || startsNew.cut(previous, r);
    if (afterTerminal && !ruleCut) terminalCuts++;
    if (ruleCut || afterTerminal) episode++;
    episodeOf[r] = episode;
    previous = r;
  }
  const report = [...startsNew.report(episode + 1)];
  if (terminalCuts > 0) {
    report.push(`${terminalCuts} terminal row${terminalCuts === 1 ? '' : 's'} ended an episode before the episode rule did; the following row starts a new episode.`);
  }
  return { episodeOf, episodeCount: episode + 1, report };
}

interface BoundaryRule {
  /** True when kept record `r` starts a new episode after kept record `previous`. */
  cut(previous: number, r: number): boolean;
  report(episodeCount: number): string[];
}

function boundaryRule(rule: ColumnRoles['episode'], inputs: EpisodeInputs): BoundaryRule {
  if (rule.kind === 'column') return labelRule(rule.column, inputs.labels!, inputs.lineOf);
  if (rule.kind === 'timeGap') return gapRule(rule.column, rule.maxGapSeconds, inputs);
  return { cut: () => false, report: (count) => [`One episode for the whole file${count > 1 ? `, cut into ${count} by terminal rows` : ''}.`] };
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
        if (reappearing.length < LISTED) reappearing.push(`"${labels.values[now]}" at line ${lineOf(r)}`);
      }
      return true;
    },
    report(count) {
      const lines = [`Episodes from column ${column}: ${formatCount(count)} episode${count === 1 ? '' : 's'} (a new episode wherever the value changes).`];
      if (reappearCount > 0) {
        const more = reappearCount > LISTED ? ` and ${reappearCount - LISTED} more` : '';
        const one = reappearCount === 1;
        lines.push(`${plural(reappearCount, 'value')} of ${column} ${one ? 'reappears' : 'reappear'} after other values and ${one ? 'starts' : 'start'} a new episode there: ${reappearing.join(', ')}${more}.`);
      }
      return lines;
    },
  };
}

function gapRule(column: string, maxGapSeconds: number | undefined, inputs: EpisodeInputs): BoundaryRule {
  const t = inputs.timestampsSeconds!;
  const periodSeconds = medianStepSeconds(t, inputs.kept);
  const limit = maxGapSeconds ?? 3 * periodSeconds;
  let gaps = 0;
  return {
    cut(previous, r) {
      const cut = t[r] - t[previous] > limit;
      if (cut) gaps++;
      return cut;
    },
    report(count) {
      if (Number.isNaN(limit)) return [`Episodes from timestamp gaps in column ${column}: no two adjacent rows have increasing timestamps, so the sampling period is unknown and the file is one episode${count > 1 ? ` (cut into ${count} by terminal rows)` : ''}.`];
      const why = maxGapSeconds === undefined ? `3 × the median sampling period of ${formatSeconds(periodSeconds)}` : 'as set';
      return [`Episodes from timestamp gaps in column ${column}: a step longer than ${formatSeconds(limit)} (${why}) starts a new episode; ${formatCount(gaps)} gap${gaps === 1 ? '' : 's'} → ${formatCount(count)} episode${count === 1 ? '' : 's'}.`];
    },
  };
}

/**
 * Median of the positive steps between adjacent kept rows (NaN when there is none). Steps across
 * an excluded row are skipped so a hole does not count as a long sample; zero steps (repeated
 * timestamps) are skipped so they cannot make every later step look like a gap.
 */
export function medianStepSeconds(t: Float64Array, kept: Uint8Array): number {
  const steps = new Float64Array(Math.max(0, t.length - 1));
  let count = 0;
  for (let r = 1; r < t.length; r++) {
    const step = t[r] - t[r - 1];
    if (kept[r] && kept[r - 1] && step > 0) steps[count++] = step;
  }
  if (count === 0) return NaN;
  const sorted = steps.subarray(0, count).sort();
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}
