/**
 * What the evaluation worker remembers between requests: the data file's bytes, the last import
 * (reused while the project's data settings and column roles stay the same), and each candidate's
 * fitted Q from the last evaluation, kept to redraw surfaces and slices until the next run.
 */
import type { GaussianPolicy } from '../../../core/policy';
import { failure, type Result } from '../../../core/result';
import type { CandidateFit } from '../../../pipeline/candidateFit';
import { importProjectData, type OpenedProject } from '../../../pipeline/openProject';
import type { ProjectDocument } from '../../../project/schema';
import { runKey } from '../session/runKey';

export interface RetainedFit {
  fit: CandidateFit;
  policy: GaussianPolicy;
  name: string;
}

export interface EvaluatedRun {
  project: ProjectDocument;
  opened: OpenedProject;
  fits: Map<number, RetainedFit>;
}

export class WorkerQueryError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'WorkerQueryError';
  }
}

export interface WorkerSession {
  setData(bytes: Uint8Array, fileName: string): void;
  data(): { bytes: Uint8Array; fileName: string };
  /** Import the data for project, or reuse the last import when nothing it depends on changed. */
  open(project: ProjectDocument): Result<OpenedProject>;
  /** Release the previous run's fits and start keeping the new run's. */
  beginRun(project: ProjectDocument, opened: OpenedProject): EvaluatedRun;
  lastRun(): EvaluatedRun;
  /** The last run's fits by candidate when it evaluated the same project (same runKey), else none. */
  retainedFits(project: ProjectDocument): (CandidateFit | undefined)[];
}

const NO_DATA = 'no data file is loaded yet; choose a CSV file on the Plant log step';

/** The parts of a project an import depends on; the same key means the same import. */
function importKey(project: ProjectDocument): string {
  return JSON.stringify([project.data, project.columns]);
}

export function createWorkerSession(): WorkerSession {
  let data: { bytes: Uint8Array; fileName: string } | null = null;
  let cached: { key: string; opened: OpenedProject } | null = null;
  let run: EvaluatedRun | null = null;
  const disposeRun = (): void => {
    run?.fits.forEach((retained) => retained.fit.dispose());
    run = null;
  };
  return {
    setData(bytes, fileName) {
      data = { bytes, fileName };
      cached = null;
      disposeRun();
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
    beginRun(project, opened) {
      disposeRun();
      run = { project, opened, fits: new Map() };
      return run;
    },
    lastRun() {
      if (!run || run.fits.size === 0) throw new WorkerQueryError('there is no finished evaluation to draw from; run the evaluation first');
      return run;
    },
    retainedFits(project) {
      if (!run || runKey(run.project, '') !== runKey(project, '')) return [];
      const fits = run.fits;
      return project.candidates.map((_, i) => fits.get(i)?.fit);
    },
  };
}
