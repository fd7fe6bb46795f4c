/**
 * The run-order check on a project's log (src/core/diagnostics/runOrder.ts), once per project, not per
 * candidate: is the log one plant under one controller from its first run to its last? Its rule and
 * words come from src/core/diagnostics/runOrderFinding.ts; its numbers go to the assessment as `runOrder`.
 */
import type { ChangeKind } from '../core/diagnostics/changeShape';
import { runOrderTrends, type CoefficientTrend, type RunOrderData, type RunOrderResult } from '../core/diagnostics/runOrder';
import { readRunsLeftOut, runsLeftOutSentence, type RunsLeftOutReading } from '../core/diagnostics/runsLeftOutReading';
import { changedTrends, fewestRunsToShow, runOrderFinding, shownTrends, trendSeverity, type RunOrderNames } from '../core/diagnostics/runOrderFinding';
import { RUN_ORDER_MIN_RUNS } from '../core/limits';
import type { RunName } from '../core/runLabelText';
import type { WholeLog } from '../core/transitions';
import type { AssessmentWarning } from './assessment';

/**
 * The check's numbers (plain JSON): runs read, runs skipped per fit, coefficients tested, and those that changed;
 * where the project leaves runs out, `wholeLog` (runsLeftOutReading.ts), and the numbers are the whole log's when its finding stands.
 */
export type RunOrderSummary = RunOrderNumbers & { readonly wholeLog?: WholeLogReading };

/** The whole log read beside the runs kept (data.csv.excludedRuns set): its runs, how many are left out, and what leaving them out does to its change. */
export interface WholeLogReading {
  readonly read: true;
  readonly runs: number;
  readonly runsLeftOut: number;
  /** 'no-change': the whole log shows none; 'resolved': a step before every run kept; 'stands': the whole log's finding is the finding. */
  readonly reading: RunsLeftOutReading['kind'];
  readonly resolved: boolean;
  /** The one sentence (null for 'no-change'). */
  readonly sentence: string | null;
}

type RunOrderNumbers =
  | {
    readonly runs: number; readonly lawRunsSkipped: number; readonly modelRunsSkipped: number; readonly coefficientsTested: number;
    /** The smallest Bonferroni-corrected p over the coefficients (K·p, at most 1). */
    readonly smallestCorrectedP: number;
    readonly changed: { fit: 'law' | 'model'; output: string; input: string; rho: number; z: number; correctedP: number; early: number; late: number; severity: 'caution' | 'serious'; change: RunOrderChange | null }[];
    /** The change the finding leads with (the first of `changed` it shows), or null when nothing changed. */
    readonly change: RunOrderChange | null;
  }
  | { readonly reason: string };

/**
 * Where a changed coefficient changed (core/diagnostics/changeShape.ts): a step, with the first run after it —
 * its position in the data (0-based), its label as the run column reads (null without one) and its first line;
 * or a drift, with no run (the best single step's run is not a change point then).
 */
export type RunOrderChange =
  /** `clear`: clear enough to cut the log at (core/limits.ts CLEAR_STEP_SHARE); only then does the warning advise runs to leave out. */
  | { readonly kind: Extract<ChangeKind, 'step'>; readonly runIndex: number; readonly runLabel: string | null; readonly line: number; readonly clear: boolean }
  | { readonly kind: Extract<ChangeKind, 'drift'> };

/** Run position → its label and first line, from the log's first row of each run (TransitionSet.episodeLabels, sourceLine). */
function runNames(data: RunOrderData & { readonly episodeLabels?: readonly (string | null)[]; readonly sourceLine?: Int32Array }, firstRows: readonly number[]): (position: number) => RunName {
  return (position) => {
    const row = firstRows[position] ?? 0;
    return { label: data.episodeLabels?.[data.episode[row]] ?? null, line: data.sourceLine?.[row] ?? row + 2 };
  };
}

function changeOf(t: CoefficientTrend, runName: (position: number) => RunName): RunOrderChange | null {
  if (!t.change) return null;
  if (t.change.kind === 'drift') return { kind: 'drift' };
  const run = runName(t.change.run);
  return { kind: 'step', runIndex: t.change.run, runLabel: run.label, line: run.line, clear: t.change.clear };
}

/** "; setpoint_c is constant within every run (…)", naming the columns; empty where there are none (review38: the check said "not checked" without saying which). */
function constantWords(columns: readonly number[] | undefined, names: readonly string[]): string {
  if (!columns?.length) return '';
  const listed = columns.map((c) => names[c] ?? `input ${c + 1}`), many = listed.length > 1;
  return `; ${listed.join(', ')} ${many ? 'are' : 'is'} constant within every run (a setpoint or grade?), so no run’s fit can tell ${many ? 'their effects' : 'its effect'} from the run’s own offset`;
}

type CheckedData = RunOrderData & RunOrderNames & Parameters<typeof runNames>[0];

/**
 * `limits`: the actuator limits the baseline read from the log (its fitted model's, core/behaviourModel.ts), so a run's law is fitted as the baseline's is.
 * With `wholeLog` (runs left out), the whole log is checked too and read by runsLeftOutReading.ts: its finding stands, or the runs kept decide.
 */
export function runOrderAssessment(data: CheckedData & { readonly wholeLog?: WholeLog }, limits?: RunOrderData['actionLimits']): { summary: RunOrderSummary; warnings: AssessmentWarning[] } {
  const kept = checkOf(data, limits);
  if (!data.wholeLog) return { summary: kept.summary, warnings: kept.warnings };
  const log = data.wholeLog.transitions, keptRuns = data.wholeLog.keptRuns, whole = checkOf(log, limits);
  const firstRows = 'reason' in whole.result ? [] : whole.result.firstRows;
  const reading = readRunsLeftOut(whole.result, (p) => keptRuns[log.episode[firstRows[p]]] === 1);
  const runsLeftOut = keptRuns.reduce((n, k) => n + (k ? 0 : 1), 0);
  const sentence = runsLeftOutSentence(reading, log.episodeCount, runNames(log, firstRows));
  const wholeLog: WholeLogReading = { read: true, runs: log.episodeCount, runsLeftOut, reading: reading.kind, resolved: reading.kind === 'resolved', sentence };
  if (reading.kind !== 'stands') return { summary: { ...kept.summary, wholeLog }, warnings: kept.warnings };
  const standing = whole.warnings.map((w) => ({ ...w, message: `${w.message} ${sentence}` }));
  // Review39: a change the whole log shows only as a caution may be serious within the runs kept; the more severe is not dropped.
  const keptSerious = kept.warnings.filter((w) => w.severity === 'serious' && !standing.some((s) => s.severity === 'serious'));
  return { summary: { ...whole.summary, wholeLog }, warnings: [...standing, ...keptSerious.map((w) => ({ ...w, message: `Within the runs kept: ${w.message}` }))] };
}

/** One log's check: its trends, numbers and finding. */
function checkOf(data: CheckedData, limits?: RunOrderData['actionLimits']): { result: RunOrderResult; summary: RunOrderNumbers; warnings: AssessmentWarning[] } {
  const result: RunOrderResult = data.count > 0 ? runOrderTrends({ ...data, actionLimits: limits ?? data.actionLimits }, RUN_ORDER_MIN_RUNS) : { reason: 'the log has no transitions' };
  const finding = runOrderFinding(result, { ...data, ...('reason' in result ? {} : { runName: runNames(data, result.firstRows) }) });
  const warnings = finding ? [finding] : [];
  if ('reason' in result) return { result, summary: { reason: result.reason + constantWords(result.constantInRuns, [...data.stateNames, ...data.actionNames]) }, warnings };
  const fewest = fewestRunsToShow(result.trends.length), most = Math.max(...result.trends.map((t) => t.runs));
  if (most < fewest) {
    return { result, summary: { reason: `its ${most.toLocaleString('en-US')} fitted runs cannot show a change at this level: with ${result.trends.length} coefficients tested, even a perfect trend needs ${fewest} runs` }, warnings };
  }
  const k = result.trends.length, names = [...data.stateNames, ...data.actionNames], runName = runNames(data, result.firstRows);
  const output = (block: 'law' | 'model', i: number) => (block === 'law' ? data.actionNames[i] ?? `action ${i + 1}` : data.stateNames[i] ?? `state ${i + 1}`);
  return {
    result,
    summary: {
      runs: result.runs, lawRunsSkipped: result.lawSkipped, modelRunsSkipped: result.modelSkipped, coefficientsTested: k,
      smallestCorrectedP: Math.min(1, ...result.trends.map((t) => t.p * k)),
      changed: changedTrends(result).map((t) => ({
        fit: t.block, output: output(t.block, t.output), input: t.input < 0 ? 'intercept' : names[t.input] ?? `input ${t.input + 1}`,
        rho: t.rho, z: t.z, correctedP: Math.min(1, t.p * k), early: t.early, late: t.late, severity: trendSeverity(t), change: changeOf(t, runName),
      })),
      change: shownTrends(result).slice(0, 1).map((t) => changeOf(t, runName))[0] ?? null,
    },
    warnings,
  };
}
