/**
 * What the evaluation worker remembers between requests: the data file's bytes, the last import
 * (reused while the project's data settings and column roles stay the same), the import in
 * progress (it yields between blocks of records, so a request for another import, new data or a
 * stop message is heard during it and stops it: it ends as cancelled), and the last run —
 * the plan and every candidate's model (src/pipeline/projectRun.ts) — kept to redraw surfaces and
 * slices and to be extended by the assessment, until the next run or data file.
 */
import { failure, type Result } from '../../../core/result';
import { importProjectDataPaced, type OpenedProject } from '../../../pipeline/openProject';
import type { ProjectRun } from '../../../pipeline/projectRun';
import type { ProjectDocument } from '../../../project/schema';
import { csvAsData, runKey } from '../../../shared/runKey';
import { withCurrentReasons } from '../../../data/leftOutReasons';

export interface EvaluatedRun {
  project: ProjectDocument;
  opened: OpenedProject;
  run: ProjectRun;
}

export class WorkerQueryError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'WorkerQueryError';
  }
}

export interface WorkerMemory {
  /** `sha256`: the bytes' SHA-256 when the main process hashed them as it read them; else the first import hashes them, once for the file. */
  setData(bytes: Uint8Array, fileName: string, sha256?: string): void;
  data(): { bytes: Uint8Array; fileName: string };
  /**
   * Import the data for project, or reuse the last import (or the one in progress) when nothing it
   * depends on changed. A different import in progress is stopped: it answers as cancelled.
   */
  open(project: ProjectDocument): Promise<Result<OpenedProject>>;
  /** Stop the import in progress at its next block (it answers with CANCELLED_PROBLEM); nothing when none runs. */
  stopImport(): void;
  /** Release the previous run and keep this one. */
  keepRun(evaluated: EvaluatedRun): void;
  /** Release the previous run (a new one is starting). */
  dropRun(): void;
  lastRun(): EvaluatedRun;
  /** The last run when it evaluated the same project (same runKey), else null. */
  runFor(project: ProjectDocument): EvaluatedRun | null;
  /** A stop request for the assessment in progress: set by a message, polled by the assessment. */
  readonly assessmentStop: { requested: boolean };
}

const NO_DATA = 'no data file is loaded yet; choose a CSV file on the Plant log step';

/** The parts of a project an import depends on (the reasons given for what is left out are not: csvAsData); the same key means the same import. */
function importKey(project: ProjectDocument): string {
  return JSON.stringify([{ ...project.data, csv: csvAsData(project.data.csv) }, project.columns]);
}

/** A kept import for `project`: its reasons for what was left out are the project's (data/leftOutReasons.ts). */
function openedFor(opened: OpenedProject, project: ProjectDocument): OpenedProject {
  return { ...opened, project, imported: withCurrentReasons(opened.imported, project.data.csv, project.columns.episode) };
}

/** An import in progress: its key, its answer to come, and its stop request. */
interface RunningImport {
  readonly key: string;
  readonly answer: Promise<Result<OpenedProject>>;
  readonly stop: { requested: boolean };
}

/** The data file as the worker holds it; `sha256` once known (from the main process, or the first import). */
interface HeldData {
  bytes: Uint8Array;
  fileName: string;
  sha256?: string;
}

/** What the memory holds between requests. */
interface Held {
  data: HeldData | null;
  /** The last finished import and its key (importKey). */
  cached: { key: string; opened: OpenedProject } | null;
  running: RunningImport | null;
  last: EvaluatedRun | null;
  readonly pace?: () => Promise<void>;
}

export function createWorkerMemory(pace?: () => Promise<void>): WorkerMemory {
  const m: Held = { data: null, cached: null, running: null, last: null, pace };
  return {
    setData(bytes, fileName, sha256) {
      stopRunning(m);
      m.data = { bytes, fileName, ...(sha256 ? { sha256 } : {}) };
      m.cached = null;
      dropRun(m);
    },
    data() {
      if (!m.data) throw new WorkerQueryError(NO_DATA);
      return m.data;
    },
    open: (project) => openFor(m, project),
    stopImport: () => stopRunning(m),
    keepRun(evaluated) {
      dropRun(m);
      m.last = evaluated;
    },
    dropRun: () => dropRun(m),
    lastRun() {
      if (!m.last) throw new WorkerQueryError('there is no finished evaluation to draw from; run the evaluation first');
      return m.last;
    },
    runFor(project) {
      return m.last && runKey(m.last.project, '') === runKey(project, '') ? m.last : null;
    },
    assessmentStop: { requested: false },
  };
}

/** The kept import when nothing it depends on changed, else the one in progress for the same key, else a new one (stopping another). */
async function openFor(m: Held, project: ProjectDocument): Promise<Result<OpenedProject>> {
  if (!m.data) return failure({ where: 'data', message: NO_DATA });
  const key = importKey(project);
  if (m.cached && m.cached.key === key) return { ok: true, value: openedFor(m.cached.opened, project), warnings: m.cached.opened.warnings };
  if (m.running?.key !== key) {
    stopRunning(m);
    m.running = startImport(m, project, m.data, key);
  }
  const opened = await m.running.answer;
  return opened.ok ? { ok: true, value: openedFor(opened.value, project), warnings: opened.warnings } : opened;
}

function stopRunning(m: Held): void {
  if (m.running) m.running.stop.requested = true;
  m.running = null;
}

function dropRun(m: Held): void {
  m.last?.run.dispose();
  m.last = null;
}

function startImport(m: Held, project: ProjectDocument, file: HeldData, key: string): RunningImport {
  const stop = { requested: false };
  const answer = importProjectDataPaced(project, file.bytes, { cancel: () => stop.requested, pace: m.pace, fingerprint: file.sha256 }).then((opened) => {
    if (opened.ok) file.sha256 ??= opened.value.fingerprint; // the same bytes are not hashed again by a later import
    if (stop.requested) return opened; // superseded: its answer is its own, the memory keeps nothing of it
    finishImport(m, stop);
    m.cached = opened.ok ? { key, opened: opened.value } : null;
    return opened;
  }, (error: unknown) => {
    finishImport(m, stop); // an internal error is not kept: the same import asked again runs again
    throw error;
  });
  return { key, answer, stop };
}

/** The import with this stop request is over: it is no longer the one in progress (a newer one may be). */
function finishImport(m: Held, stop: RunningImport['stop']): void {
  if (m.running?.stop === stop) m.running = null;
}
