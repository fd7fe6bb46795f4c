/**
 * What the evaluation worker remembers between requests: the data file's bytes, the last import
 * (reused while the project's data settings and column roles stay the same), and the last run —
 * the plan and every candidate's model (src/pipeline/projectRun.ts) — kept to redraw surfaces and
 * slices and to be extended by the assessment, until the next run or data file.
 */
import { failure, type Result } from '../../../core/result';
import { importProjectData, type OpenedProject } from '../../../pipeline/openProject';
import type { ProjectRun } from '../../../pipeline/projectRun';
import type { ProjectDocument } from '../../../project/schema';
import { runKey } from '../../../shared/runKey';

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
  setData(bytes: Uint8Array, fileName: string): void;
  data(): { bytes: Uint8Array; fileName: string };
  /** Import the data for project, or reuse the last import when nothing it depends on changed. */
  open(project: ProjectDocument): Result<OpenedProject>;
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

/** The parts of a project an import depends on; the same key means the same import. */
function importKey(project: ProjectDocument): string {
  return JSON.stringify([project.data, project.columns]);
}

export function createWorkerMemory(): WorkerMemory {
  let data: { bytes: Uint8Array; fileName: string } | null = null;
  let cached: { key: string; opened: OpenedProject } | null = null;
  let last: EvaluatedRun | null = null;
  const dropRun = (): void => {
    last?.run.dispose();
    last = null;
  };
  return {
    setData(bytes, fileName) {
      data = { bytes, fileName };
      cached = null;
      dropRun();
    },
    data() {
      if (!data) throw new WorkerQueryError(NO_DATA);
      return data;
    },
    open(project) {
      if (!data) return failure({ where: 'data', message: NO_DATA });
      const key = importKey(project);
      if (cached && cached.key === key) return { ok: true, value: { ...cached.opened, project }, warnings: cached.opened.warnings };
      const opened = importProjectData(project, data.bytes);
      cached = opened.ok ? { key, opened: opened.value } : null;
      return opened;
    },
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
