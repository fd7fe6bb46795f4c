/**
 * Open a project document together with its data: parse and migrate the document, read the data
 * file through the host's reader (the CLI reads from disk; the app asks its main process), check
 * the file against the fingerprint saved in the project, and import it into transitions.
 */
import { failure, success, type Problem, type Result } from '../core/result';
import type { TransitionSet } from '../core/transitions';
import { createPacer, PACE_INTERVAL_MS, runSteps, runStepsPaced, throwIfCancelled, type CancellationCheck, type PassSteps } from '../core/fqe/cancellation';
import { FqeCancelledError } from '../core/fqe/fqeErrors';
import { importDatasetSteps, type HandedBytes, type ImportedDataset } from '../data/importDataset';
import { parseProjectText } from '../project/projectFile';
import type { ProjectDocument } from '../project/schema';
import { dataFingerprintSteps, hashedWhileRead, pieceFingerprintSteps, type HashedPieces, type Sha256Factory } from './dataFingerprint';
import { changedWhileReadProblem, isPieceSource, PieceReadError, pieceReadProblem, type PieceSource } from '../data/pieceSource';
import { CANCELLED_PROBLEM } from './cancelledProblem';

export interface OpenedProject {
  project: ProjectDocument;
  dataset: TransitionSet;
  imported: ImportedDataset;
  /** SHA-256 of the data file as read now. */
  fingerprint: string;
  /** Things the user should know that do not stop the evaluation (changed data file, excluded rows…). */
  warnings: Problem[];
}

/** Reads the data file named in the project (a path relative to the project's folder): its bytes, or the file opened to be read in pieces (closed once imported). */
export type DataFileReader = (relativePath: string) => Promise<Uint8Array | OpenDataFile>;

/** A data file the host left open for the import to read in pieces (the command line, for a large log). */
export interface OpenDataFile extends PieceSource {
  close(): Promise<void>;
}

/** What an import reads: the bytes (kept by the caller, or handed over) or a file read in pieces. */
export type DataSource = Uint8Array | HandedBytes | PieceSource;

/** What a host may give a paced import: a stop request, polled between blocks of records, and the pacer awaited there. */
export interface ImportHooks {
  readonly cancel?: CancellationCheck;
  /** Default: a yield to the event loop about every PACE_INTERVAL_MS. */
  readonly pace?: () => Promise<void>;
  /** The data file's SHA-256 (dataFingerprint.ts); default the portable one. */
  readonly sha256?: Sha256Factory;
  /** The SHA-256 of the bytes given, where the host has it already (the app's main process hashes the file it reads); then they are not hashed again. Not for a file read in pieces. */
  readonly fingerprint?: string;
}

export async function openProject(projectText: string, projectFileName: string, readDataFile: DataFileReader, hooks: ImportHooks = {}): Promise<Result<OpenedProject>> {
  const loaded = parseProjectText(projectText, projectFileName);
  if (!loaded.ok) return loaded;
  const project = loaded.value.document;
  let data: Uint8Array | OpenDataFile;
  try {
    data = await readDataFile(project.data.path);
  } catch (e) {
    return failure({
      where: `${projectFileName}, data.path`,
      message: `cannot read the data file "${project.data.path}" (${(e as Error).message}); it may have moved: point the project to its new location`,
    });
  }
  if (!isPieceSource(data)) return importProjectDataPaced(project, { bytes: data }, hooks); // handed over: the import lets go of the bytes after its read pass
  try {
    return await importProjectDataPaced(project, data, hooks);
  } finally {
    await data.close();
  }
}

/** Import already-read data bytes for a project, checking them against the saved fingerprint. */
export function importProjectData(project: ProjectDocument, bytes: Uint8Array | HandedBytes): Result<OpenedProject> {
  return runSteps(importSteps(project, bytes));
}

/**
 * importProjectData yielding to the event loop between blocks (hooks.pace), so that a stop request
 * (Ctrl+C, a message to the worker) is heard during the import; then it ends with the one
 * "cancelled" problem (CANCELLED_PROBLEM) and keeps nothing.
 */
export async function importProjectDataPaced(project: ProjectDocument, bytes: DataSource, hooks: ImportHooks = {}): Promise<Result<OpenedProject>> {
  const pace = hooks.pace ?? createPacer(PACE_INTERVAL_MS);
  try {
    return await runStepsPaced(importSteps(project, bytes, hooks), async () => {
      await pace();
      throwIfCancelled(hooks.cancel);
    });
  } catch (error) {
    if (error instanceof FqeCancelledError) return failure(CANCELLED_PROBLEM);
    throw error;
  }
}

/**
 * The fingerprint and the import. Bytes in memory are hashed before the import (which may take them);
 * a file read in pieces is hashed as the import reads it (dataFingerprint.ts hashedWhileRead), so the
 * file is read twice (the import's first pass, then its records), not three times.
 */
function* importSteps(project: ProjectDocument, bytes: DataSource, hooks: Pick<ImportHooks, 'sha256' | 'fingerprint'> = {}): PassSteps<Result<OpenedProject>> {
  if (isPieceSource(bytes)) return yield* importPieceSteps(project, bytes, hooks.sha256);
  const fingerprint = hooks.fingerprint ?? (yield* dataFingerprintSteps(bytes instanceof Uint8Array ? bytes : bytes.bytes ?? new Uint8Array(0), hooks.sha256));
  const imported = yield* importDatasetSteps(bytes, project.data.path, project.data.csv, project.columns);
  return imported.ok ? openedWith(project, imported, fingerprint) : imported;
}

/**
 * The import of a file read in pieces, then the host's word that the file is as it was opened
 * (PieceSource.unchangedSinceOpened, asked after the last read): a rewrite between the first pass and
 * the records, even at the same length, would join two files' bytes, so it stops the import whatever
 * the passes made of it.
 */
function* importPieceSteps(project: ProjectDocument, file: PieceSource, sha256?: Sha256Factory): PassSteps<Result<OpenedProject>> {
  const hashed = hashedWhileRead(file, sha256);
  const imported = yield* importDatasetSteps(hashed.source, project.data.path, project.data.csv, project.columns);
  if (!imported.ok) return changedWhileRead(file, project.data.path) ?? imported;
  const fingerprint = yield* pieceFingerprint(file, hashed, project.data.path, sha256);
  return changedWhileRead(file, project.data.path) ?? (fingerprint.ok ? openedWith(project, imported, fingerprint.value) : fingerprint);
}

/** The fingerprint taken while the import read the file, or by a read of its own where the import left bytes unread. */
function* pieceFingerprint(file: PieceSource, hashed: HashedPieces, fileName: string, sha256?: Sha256Factory): PassSteps<Result<string>> {
  const hex = hashed.hex();
  if (hex !== null) return success(hex);
  try {
    return success(yield* pieceFingerprintSteps(file, sha256));
  } catch (e) {
    if (e instanceof PieceReadError) return failure(pieceReadProblem(fileName, e));
    throw e;
  }
}

/** The failure to return after the last read where the host says the file is no longer as it was opened. */
function changedWhileRead(file: PieceSource, fileName: string): Result<never> | null {
  return file.unchangedSinceOpened?.() === false ? failure(changedWhileReadProblem(fileName)) : null;
}

/** The opened project, with a warning first when the data's fingerprint is not the one saved. */
function openedWith(project: ProjectDocument, imported: Extract<Result<ImportedDataset>, { ok: true }>, fingerprint: string): Result<OpenedProject> {
  const warnings: Problem[] = [...imported.warnings];
  const saved = project.data.sha256;
  if (saved !== undefined && saved !== fingerprint) {
    const rowsThen = project.data.rowCount === undefined ? 'unknown' : project.data.rowCount.toLocaleString('en-US');
    warnings.unshift({
      where: project.data.path,
      message: `the data file has changed since the project was saved (rows then: ${rowsThen}, now: ${imported.value.rowCount.toLocaleString('en-US')}); results will differ from earlier runs`,
    });
  }
  return success({ project, dataset: imported.value.transitions, imported: imported.value, fingerprint, warnings });
}
