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

export function createWorkerMemory(pace?: () => Promise<void>): WorkerMemory {
  let data: { bytes: Uint8Array; fileName: string; sha256?: string } | null = null;
  let cached: { key: string; opened: OpenedProject } | null = null;
  let running: RunningImport | null = null;
  const stopImport = (): void => {
    if (running) running.stop.requested = true;
    running = null;
  };
  const startImport = (project: ProjectDocument, file: NonNullable<typeof data>, key: string): RunningImport => {
    const stop = { requested: false };
    const finished = (): void => {
      if (running?.stop === stop) running = null;
    };
    const answer = importProjectDataPaced(project, file.bytes, { cancel: () => stop.requested, pace, fingerprint: file.sha256 }).then((opened) => {
      if (opened.ok) file.sha256 ??= opened.value.fingerprint; // the same bytes are not hashed again by a later import
      if (stop.requested) return opened; // superseded: its answer is its own, the memory keeps nothing of it
      finished();
      cached = opened.ok ? { key, opened: opened.value } : null;
      return opened;
    }, (error: unknown) => {
      finished(); // an internal error is not kept: the same import asked again runs again
      throw error;
    });
    return { key, answer, stop };
  };
  let last: EvaluatedRun | null = null;
  const dropRun = (): void => {
    last?.run.dispose();
    last = null;
  };
  return {
    setData(bytes, fileName, sha256) {
      stopImport();
      data = { bytes, fileName, ...(sha256 ? { sha256 } : {}) };
      cached = null;
      dropRun();
    },
    data() {
      if (!data) throw new WorkerQueryError(NO_DATA);
      return data;
    },
    async open(project) {
      if (!data) return failure({ where: 'data', message: NO_DATA });
      const key = importKey(project);
      if (cached && cached.key === key) return { ok: true, value: openedFor(cached.opened, project), warnings: cached.opened.warnings };
      if (running?.key !== key) {
        stopImport();
        running = startImport(project, data, key);
      }
      const opened = await running.answer;
      return opened.ok ? { ok: true, value: openedFor(opened.value, project), warnings: opened.warnings } : opened;
    },
    stopImport,
    keepRun(evaluated) {
      dropRun();
      last = evaluated;
    },
    dropRun,
    lastRun() {
      if (!last) throw new WorkerQueryError('there is no finished evaluation to draw from; run the evaluation first');
      return last;
    },
    runFor(project) {
      return last && runKey(last.project, '') === runKey(project, '') ? last : null;
    },
    assessmentStop: { requested: false },
  };
}
