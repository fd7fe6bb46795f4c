/**
 * Everything about the open project that is not the document itself: the data file's bytes and
 * where they came from, the first look at its header, the last import, the run in progress and the
 * last evaluation. Not saved and not undoable; it follows the document.
 */
import type { Problem } from '../../../core/result';
import type { Assessment } from '../../../pipeline/assessment';
import type { Evaluation } from '../../../pipeline/estimates';
import type { RetuneMapResult } from '../../../pipeline/retuneMaps';
import type { AssessRunProgress, DataImport, DataInspection, RetuneMapProgress, RunProgress } from '../../../shared/workerMessages';
import { createStore, type Store } from '../state/store';

export type DataSource =
  | { kind: 'none' }
  /** Picked in a dialog or read from the project's path; the main process knows it. */
  | { kind: 'file'; absolutePath: string; bytes: Uint8Array }
  /** Dropped on the window: the bytes are here, but the path is unknown to the main process until linked. */
  | { kind: 'dropped'; fileName: string; bytes: Uint8Array }
  /** A sample project's data, bundled with the app: saving writes a copy where the user says. */
  | { kind: 'sample'; fileName: string; bytes: Uint8Array };

export type ImportState =
  | { status: 'idle' }
  | { status: 'importing'; key: string }
  | { status: 'done'; key: string; result: DataImport; warnings: Problem[] }
  | { status: 'failed'; key: string; problems: Problem[] };

export type RunState =
  | { status: 'idle' }
  /** progress: the latest reports; startsMs[c]: elapsed time at which candidate c started. */
  | { status: 'running'; progress: RunProgress[]; startsMs: number[] }
  | { status: 'cancelled' }
  | { status: 'failed'; problems: Problem[] };

export interface EvaluationRecord {
  evaluation: Evaluation;
  /** runKey of the document that was evaluated; a different key now means the results are stale. */
  runKey: string;
  /** Set when the results were read back from the project file rather than computed in this session. */
  restored?: { savedAt: string; current: boolean };
}

/** The intervals, cross-checks and diagnostics of the last evaluation (runKey says which). */
export type AssessmentState =
  | { status: 'idle' }
  | { status: 'running'; runKey: string; progress: AssessRunProgress | null }
  | { status: 'done'; runKey: string; assessment: Assessment }
  | { status: 'cancelled'; runKey: string }
  | { status: 'failed'; runKey: string; problems: Problem[] };

/** The retune maps of the last evaluation (runKey says which); computed on request only. */
export type RetuneMapState =
  | { status: 'idle' }
  | { status: 'running'; runKey: string; progress: RetuneMapProgress | null }
  | { status: 'done'; runKey: string; maps: RetuneMapResult[] }
  | { status: 'cancelled'; runKey: string }
  | { status: 'failed'; runKey: string; problems: Problem[] };

export interface Notice {
  tone: 'info' | 'warning' | 'error';
  title: string;
  problems: Problem[];
}

export interface SessionState {
  source: DataSource;
  /** Increments whenever new data bytes are loaded (part of the import key). */
  sourceVersion: number;
  inspection: DataInspection | null;
  /** Why the data file could not be read or looked at (missing, unreadable, empty …). */
  dataProblems: Problem[];
  /** True when the project's data file was not found where the project says: offer to locate it. */
  dataMissing: boolean;
  importState: ImportState;
  run: RunState;
  evaluation: EvaluationRecord | null;
  assessment: AssessmentState;
  retuneMaps: RetuneMapState;
  notice: Notice | null;
  recentProjects: string[];
}

/**
 * A fresh session for another document. The source version only ever grows: it is part of the
 * import key, so restarting it would let the same project with the same roles look already
 * imported after its data is located again (the "Importing…" dead end).
 */
export function emptySession(recentProjects: string[] = [], previousSourceVersion = 0): SessionState {
  return {
    source: { kind: 'none' }, sourceVersion: previousSourceVersion + 1, dataMissing: false, inspection: null, dataProblems: [], importState: { status: 'idle' },
    run: { status: 'idle' }, evaluation: null, assessment: { status: 'idle' }, retuneMaps: { status: 'idle' }, notice: null, recentProjects,
  };
}

export type SessionStore = Store<SessionState>;

export function createSessionStore(): SessionStore {
  return createStore(emptySession());
}
