/**
 * What `evaluate` and `report` share: read a project file and its data from disk, run the one
 * evaluation pipeline, then the assessment (intervals, cross-checks, diagnostics) on the same fits.
 * Files are read here (Node); everything after the bytes is the shared pipeline.
 */
import { createRequire } from 'node:module';
import { basename, dirname, join, resolve } from 'node:path';
import { describeProblems, type Problem, type Result } from '../core/result';
import type { Assessment } from '../pipeline/assessment';
import { assessRun } from '../pipeline/assessProject';
import { assessmentSettingsFor, type AssessmentOverrides } from '../pipeline/assessSettings';
import type { Evaluation } from '../pipeline/estimates';
import { evaluationOf } from '../pipeline/evaluateProject';
import { openProject, type OpenedProject } from '../pipeline/openProject';
import { CANCELLED_PROBLEM, startRun } from '../pipeline/projectRun';
import { retuneMapsOfRun, type RetuneMapResult } from '../pipeline/retuneMaps';
import { HostFileError, MAX_DATA_BYTES, MAX_PROJECT_BYTES, openRegularFile, readRegularFile } from '../host/regularFile';
import { STREAMED_FILE_BYTES } from '../core/limits';
import type { OpenDataFile } from '../pipeline/openProject';
import { helperThread } from './helperThread';
import { nativeSha256 } from './nativeSha256';
import type { TerminalProgress } from './terminalProgress';

export interface ProjectFileRun extends OpenedProject {
  evaluation: Evaluation;
  assessment: Result<Assessment>;
  /** The project's retune maps (none when it has none). */
  retuneMaps: Result<RetuneMapResult[]>;
}

/** A failure to report on stderr, with the exit status (1 bad input, 2 bad usage). */
export interface CliFailure {
  message: string;
  exitCode: 1 | 2 | 130;
}

/** The files a run reads, absolute; `check` may refuse the run before any work (e.g. an --out that names one of them). */
export interface RunFiles {
  projectPath: string;
  dataPath: string;
}

export async function evaluateProjectFile(
  projectPath: string, overrides: AssessmentOverrides, now?: () => Date, progress: TerminalProgress | null = null,
  check?: (files: RunFiles) => Promise<CliFailure | null>,
): Promise<{ ok: true; run: ProjectFileRun } | { ok: false; failure: CliFailure }> {
  let text: string;
  try {
    text = new TextDecoder().decode(await readRegularFile(projectPath, { maxBytes: MAX_PROJECT_BYTES, what: 'project file' }));
  } catch (e) {
    if (!(e instanceof HostFileError)) throw e;
    return { ok: false, failure: { message: e.message, exitCode: 1 } };
  }
  const folder = dirname(resolve(projectPath));
  let refusal: CliFailure | null = null;
  const cancel = progress ? () => progress.cancelled() : undefined;
  const opened = await openProject(text, basename(projectPath), async (relativePath) => {
    const dataPath = resolve(folder, relativePath);
    refusal = (await check?.({ projectPath: resolve(projectPath), dataPath })) ?? null;
    if (refusal) return new Uint8Array(0);
    try {
      return await dataFile(dataPath);
    } catch (e) {
      throw e instanceof HostFileError ? new Error(e.reason) : e;
    }
  }, { cancel, pace: progress?.pace, sha256: nativeSha256 });
  if (refusal) return { ok: false, failure: refusal };
  if (!opened.ok) return { ok: false, failure: failureOf(opened.problems) };
  const { project, dataset, warnings } = opened.value;
  const settings = assessmentSettingsFor(project, overrides);
  if (!settings.ok) return { ok: false, failure: { message: describeProblems(settings.problems), exitCode: 2 } };
  const wasmPath = tensorflowWasmFolder();
  if (project.approximator.kind === 'network') await quietTensorflow();
  const started = await startRun(project, dataset, { wasmPath, cancel, pace: progress?.pace, onProgress: progress?.evaluation });
  if (!started.ok) return { ok: false, failure: failureOf(started.problems) };
  const run = started.value;
  try {
    const evaluation = evaluationOf(run, [...warnings, ...started.warnings].map((w) => `${w.where}: ${w.message}`), now);
    const assessment = await assessRun(run, { settings: settings.value, wasmPath, cancel, onProgress: progress?.assessment, helper: helperThread() });
    if (!assessment.ok && isCancelled(assessment.problems)) return { ok: false, failure: failureOf(assessment.problems) };
    const retuneMaps = retuneMapsOfRun(run, { cancel });
    if (!retuneMaps.ok && isCancelled(retuneMaps.problems)) return { ok: false, failure: failureOf(retuneMaps.problems) };
    return { ok: true, run: { ...opened.value, evaluation, assessment, retuneMaps } };
  } finally {
    run.dispose();
  }
}

/** A large data file stays open for the import to read in pieces (never held whole); a smaller one is read whole. Also the peer bench's way in (bench/peerBench.ts). */
export async function dataFile(path: string): Promise<Uint8Array | OpenDataFile> {
  const file = await openRegularFile(path, { maxBytes: MAX_DATA_BYTES, what: 'data file' });
  if (file.byteLength >= STREAMED_FILE_BYTES) return file;
  try {
    return await file.readAll();
  } finally {
    await file.close();
  }
}

function isCancelled(problems: readonly Problem[]): boolean {
  return problems.length === 1 && problems[0].message === CANCELLED_PROBLEM.message;
}

/** Exit 1 for problems with the project or its data; 130 when the user stopped the run (Ctrl+C). */
function failureOf(problems: readonly Problem[]): CliFailure {
  return isCancelled(problems) ? { message: 'Cancelled (Ctrl+C): no results were written.', exitCode: 130 } : { message: describeProblems(problems), exitCode: 1 };
}

/** The folder holding TensorFlow.js's .wasm files in node_modules (with a trailing slash, as setWasmPaths wants). */
function tensorflowWasmFolder(): string {
  const packageJson = createRequire(import.meta.url).resolve('@tensorflow/tfjs-backend-wasm/package.json');
  return `${join(dirname(packageJson), 'dist')}/`;
}

/**
 * TensorFlow.js in Node prints advice to install its native backend on first use; the CLI cannot act
 * on it and its users should not have to read it. Production mode silences library warnings only.
 */
async function quietTensorflow(): Promise<void> {
  const tf = await import('@tensorflow/tfjs');
  tf.enableProdMode();
}
