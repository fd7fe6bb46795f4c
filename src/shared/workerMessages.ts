/**
 * Every message between the renderer and its evaluation worker, typed once for both sides.
 *
 * The renderer sends a request { call, id, ...arguments }; the worker answers each with exactly one
 * { kind: 'result', id, ok, ... } and, while an evaluation runs, any number of
 * { kind: 'progress', id, progress } first. Large arrays travel as typed arrays (structured clone or
 * transfer), never as JSON.
 */
import type { BehaviourModel } from '../core/behaviourModel';
import type { Problem } from '../core/result';
import type { DatasetSummary, ExcludedRow, LeftOutRuns, LeftOutWindow, LogClock, TrendData } from '../data/importDataset';
import type { LeftOutLines } from '../data/leftOutReasons';
import type { Assessment } from '../pipeline/assessment';
import type { AssessmentProgress } from '../pipeline/assessProject';
import type { Evaluation, ValueSurface } from '../pipeline/estimates';
import type { EvaluationProgress } from '../pipeline/projectRun';
import type { RetuneMapResult } from '../pipeline/retuneMaps';
import type { CsvSettings, ProjectDocument } from '../project/schema';

/** What the first lines of a data file look like, before any column has a role. */
export interface DataInspection {
  fileName: string;
  /** Column names from the header line, trimmed. */
  header: string[];
  /** Up to five data rows as text, for the role table's sample column. */
  previewRows: string[][];
  delimiter: ',' | ';' | '\t';
  decimalMark: '.' | ',';
  /** The text encoding the bytes were read in (src/data/sourceText.ts), and how it was known. */
  encoding?: { name: string; how: 'byte-order mark' | 'detected' };
}

/** An evenly spaced subset of the logged transitions, small enough to draw. */
export interface LoggedSample {
  count: number; // k
  states: Float64Array; // k×ds row-major
  actions: Float64Array; // k×m row-major
}

/** The present controller's law as the evaluation fits it; `heldRowsLeftOut` > 0 when it was fitted on the rows not held (the held-actions check). */
export type BehaviourFit = { ok: true; model: BehaviourModel; heldRowsLeftOut: number } | { ok: false; message: string };

/** The outcome of importing the data with the project's column roles. */
export interface DataImport {
  summary: DatasetSummary;
  /** The first excluded rows (at most EXCLUDED_ROWS_SHOWN); summary.excludedRowCount has the total. */
  excluded: ExcludedRow[];
  episodeReport: string[];
  /** Where episodeReport holds the sentences on what was left out (ImportedDataset.leftOutLines). */
  leftOutLines: LeftOutLines;
  rowCount: number;
  /** SHA-256 of the bytes imported (saved into the project as data.sha256). */
  fingerprint: string;
  warnings: Problem[];
  stateNames: string[];
  actionNames: string[];
  /** Mean of each state over the transitions (the default held values of sliders). */
  stateMeans: number[];
  /** [min, max] of each state over the transitions. */
  stateRanges: [number, number][];
  sample: LoggedSample;
  behaviour: BehaviourFit;
  /** Each time window left out and the rows it left out (their rows are in summary.excludedRowCount, not in `excluded`). */
  timeWindows: LeftOutWindow[];
  /** Each range of runs left out and its runs and rows (their rows are in summary.excludedRowCount, not in `excluded` nor in a window). */
  runsLeftOut: LeftOutRuns[];
  /** The run column's labels in the order the runs first appear (at most RUN_LABELS_OFFERED), offered where runs are left out; empty without a run column. */
  runLabels: string[];
  /** The timestamp column's first and last time, when there is one. */
  clock?: LogClock;
  /** The logged signals over every row as min/max envelopes, for the Plant log step's trend. */
  trend: TrendData;
}

export const EXCLUDED_ROWS_SHOWN = 1000;
/** Run labels the Plant log offers where runs are left out (typing names any other). */
export const RUN_LABELS_OFFERED = 1000;
export const LOGGED_SAMPLE_SIZE = 2000;

/** Recompute V^π from a retained fit over two chosen state axes, the other states held. */
export interface SurfaceQuery {
  candidateIndex: number;
  xAxis: number;
  yAxis: number;
  /** Values of every state; the two axis entries are ignored. */
  heldState: number[];
  resolution: number;
}

/** Q(s, ·) of a retained fit along one action at a chosen state. */
export interface SliceQuery {
  candidateIndex: number;
  state: number[];
  actionIndex: number;
  points: number;
}

/** The action-value slice with the policy's density and quadrature nodes, in the project's sense. */
export interface ActionSliceReply {
  actions: Float64Array;
  actionValues: Float64Array;
  density: Float64Array;
  nodes: { points: Float64Array; weights: Float64Array };
  state: number[];
  policyName: string;
}

/** A progress report while an evaluation runs. */
export interface RunProgress extends EvaluationProgress {
  /** Milliseconds since the evaluation started. */
  elapsedMs: number;
  /** The linear fit's iteration cap and tolerance (null for a network fit). */
  maxIterations: number | null;
  tolerance: number | null;
  /** Outer iterations of a network fit (null for a linear fit). */
  outerIterations: number | null;
}

/** A progress report while an assessment (bootstrap, cross-checks, sensitivity) runs. */
export interface AssessRunProgress extends AssessmentProgress {
  /** Milliseconds since the assessment started. */
  elapsedMs: number;
}

/** A progress report while the retune maps are computed: point pointsDone of pointsTotal in map map + 1 of maps. */
export interface RetuneMapProgress {
  map: number;
  maps: number;
  pointsDone: number;
  pointsTotal: number;
  /** Milliseconds since the maps started. */
  elapsedMs: number;
}

/** Each call's arguments and the value its successful result carries. */
export interface WorkerCalls {
  /** Keep these bytes as the data file (until the next setData) and look at its first lines; `sha256`, their SHA-256 where the main process read them (DataFileReply), else the first import hashes them. */
  setData: { args: { bytes: Uint8Array; fileName: string; csv: CsvSettings; sha256?: string }; value: DataInspection };
  /** Look at the kept data file's first lines again with other CSV settings. */
  inspect: { args: { csv: CsvSettings }; value: DataInspection };
  /**
   * Import the kept data file for the project (or reuse the last import). It yields between blocks
   * of records: a newer importData, setData or stopImport heard meanwhile ends it as cancelled.
   */
  importData: { args: { project: ProjectDocument }; value: DataImport };
  /** Ask the import in progress to stop at its next block of records; nothing when none runs. */
  stopImport: { args: Record<string, never>; value: null };
  evaluate: { args: { project: ProjectDocument }; value: Evaluation };
  surface: { args: { query: SurfaceQuery }; value: ValueSurface };
  slice: { args: { query: SliceQuery }; value: ActionSliceReply };
  /**
   * Intervals, cross-checks, diagnostics, sensitivity and comparison for the project last evaluated,
   * with its `bootstrap` settings: extends that run's models (it fails when the project no longer
   * matches the last run). Surface and slice requests are answered between its resamples.
   */
  assess: { args: { project: ProjectDocument }; value: Assessment };
  /** Ask the assessment in progress to stop at its next resample; the run's models are kept. */
  stopAssessment: { args: Record<string, never>; value: null };
  /**
   * The project's retune maps over the last run's data and plan (it fails when the project no longer
   * matches the last run). The maps run synchronously, so a stop cannot arrive as a message: the
   * renderer sets stopFlag[0] to 1 (an Int32Array on a SharedArrayBuffer, where the page is
   * cross-origin isolated), which the worker reads between points; null where no such buffer exists.
   */
  retuneMaps: { args: { project: ProjectDocument; stopFlag: Int32Array | null }; value: RetuneMapResult[] };
}

export type WorkerCall = keyof WorkerCalls;

export type WorkerRequest = { [K in WorkerCall]: { call: K; id: number } & WorkerCalls[K]['args'] }[WorkerCall];

export type WorkerResult<K extends WorkerCall = WorkerCall> =
  | { kind: 'result'; id: number; ok: true; value: WorkerCalls[K]['value']; warnings: Problem[] }
  | { kind: 'result'; id: number; ok: false; problems: Problem[] };

export type WorkerProgress =
  | { kind: 'progress'; id: number; progress: RunProgress }
  | { kind: 'assessmentProgress'; id: number; progress: AssessRunProgress }
  | { kind: 'retuneMapProgress'; id: number; progress: RetuneMapProgress };

/** The progress reports a call sends before its result. */
export type ProgressOf<K extends WorkerCall> = K extends 'assess' ? AssessRunProgress : K extends 'retuneMaps' ? RetuneMapProgress : RunProgress;

export type WorkerReply = WorkerResult | WorkerProgress;
