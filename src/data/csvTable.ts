/**
 * The first part of the import: the file's bytes → the table of the requested columns (decode,
 * dialect, header, column plan, one streaming pass over the records; importDataset.ts does the rest).
 *
 * The bytes may be handed over (HandedBytes): then the import takes them out of the holder at once
 * and lets go of them when this pass ends, so that a large file is not held in memory together with
 * the transitions built from it, nor together with its UTF-8 copy when it was in another encoding.
 * A host that keeps the file for later imports (the app's worker) passes the bytes themselves.
 *
 * A host may instead let the import read the file in pieces (PieceSource; the command line does
 * for a large file): a first pass learns what the whole-file path learns from holding the bytes
 * (pieceFacts.ts), the header and dialect come from the file's head, and the records are read
 * through a window that slides along the file (byteWindow.ts), so the file is never held whole.
 * What only the whole-file path words (other encodings, a blank file, a faulty or very long
 * header) is read whole and goes that way, so every message stays the same.
 */
import type { ColumnRoles, CsvSettings } from '../project/schema';
import { failure, success, type Result } from '../core/result';
import type { PassSteps } from '../core/fqe/cancellation';
import { isBlank } from './cellText';
import { planColumns, type ColumnPlan } from './columnPlan';
import { readColumnsSteps, type TableColumns } from './columnReader';
import { resolveDialect, type Dialect } from './csvDialect';
import { HEAD_BYTES, readHeader } from './csvHeader';
import { importProblem } from './importProblem';
import { RowProblems } from './rowProblems';
import { SAMPLE_BYTES, sampleText, sourceBytes } from './sourceBytes';
import type { TextEncodingName } from './sourceText';
import { ByteWindow } from './byteWindow';
import { pieceFactsSteps } from './pieceFacts';
import { isPieceSource, PieceReadError, pieceReadProblem, readFully, readWhole, type PieceSource } from './pieceSource';
import { recordBound } from './csvScanner';
import { STREAM_WINDOW_BYTES } from '../core/limits';

/** A data file's bytes handed over to the import, which empties the holder (see above). */
export interface HandedBytes {
  bytes: Uint8Array | null;
}

export type ImportSource = string | Uint8Array | HandedBytes | PieceSource;

/** Bytes of a file read in pieces: its head (dialect and header) and the window over its records; tests make them small. */
export interface PieceSizes {
  readonly head: number;
  readonly window: number;
}

const PIECE_SIZES: PieceSizes = { head: HEAD_BYTES, window: STREAM_WINDOW_BYTES };

export interface CsvTable {
  table: TableColumns;
  plan: ColumnPlan;
  dialect: Dialect;
  encoding: { name: TextEncodingName; how: 'byte-order mark' | 'detected' };
  problems: RowProblems;
}

export function* readTableSteps(source: ImportSource, fileName: string, csv: CsvSettings, columns: ColumnRoles, sizes = PIECE_SIZES): PassSteps<Result<CsvTable>> {
  if (!isPieceSource(source)) return yield* wholeTableSteps(source, fileName, csv, columns);
  try {
    const streamed = yield* streamedTableSteps(source, fileName, csv, columns, sizes);
    return streamed ?? (yield* wholeTableSteps({ bytes: readWhole(source) }, fileName, csv, columns));
  } catch (e) {
    if (!(e instanceof PieceReadError)) throw e;
    return failure(pieceReadProblem(fileName, e));
  }
}

function* wholeTableSteps(source: string | Uint8Array | HandedBytes, fileName: string, csv: CsvSettings, columns: ColumnRoles): PassSteps<Result<CsvTable>> {
  const decoded = sourceBytes(typeof source === 'string' || source instanceof Uint8Array ? source : take(source));
  if (!decoded.ok) return failure(importProblem(decoded.kind, fileName, decoded.reason));
  const { bytes, start } = decoded, encoding = { name: decoded.encoding, how: decoded.how };
  if (isBlank(bytes, start, bytes.length)) return failure(importProblem('empty-file', fileName, 'the file is empty; expected a header line of column names and data rows below it'));
  const dialect = resolveDialect(sampleText(bytes, start), csv.delimiter, csv.decimalMark);
  const header = readHeader(bytes, start, dialect.delimiter);
  if (!header.ok) return failure(importProblem('header-too-long', `${fileName}, line 1`, header.reason));
  if (header.names.every((name) => name === '')) {
    return failure(importProblem('blank-header', `${fileName}, line 1`, 'the first line is blank; expected the header: column names separated by the delimiter'));
  }
  const { plan, problems: namingProblems } = planColumns(header.names, columns, fileName, dialect.decimalMark);
  if (!plan) return failure(...namingProblems);
  const problems = new RowProblems();
  const data = { bytes, start: header.dataStart, firstLine: header.firstDataLine };
  const table = yield* readColumnsSteps(data, dialect.delimiter, dialect.decimalMark, header.names.length, plan.requests, problems);
  return success({ table, plan, dialect, encoding, problems });
}

/**
 * The table of a file read in pieces, or null where the whole-file path must read it (see above).
 * The head is read before the first pass and dropped after the header; the window after the pass.
 */
function* streamedTableSteps(source: PieceSource, fileName: string, csv: CsvSettings, columns: ColumnRoles, sizes: PieceSizes): PassSteps<Result<CsvTable> | null> {
  // The head holds the sample whole whatever the sizes asked (then the sample is the whole-file path's).
  const headBytes = Math.max(sizes.head, SAMPLE_BYTES + 4);
  if (source.byteLength <= headBytes) return null;
  const head = new Uint8Array(headBytes);
  readFully(source, head, 0, head.length, 0);
  // One buffer for the first pass's pieces and then the window: fresh memory costs more to fill than to reuse.
  const scratch = new Uint8Array(Math.min(sizes.window, source.byteLength));
  const facts = yield* pieceFactsSteps(source, sizes.window, scratch);
  if (!facts.plainUtf8 || facts.blank) return null;
  const start = facts.marked ? 3 : 0;
  const dialect = resolveDialect(sampleText(head, start), csv.delimiter, csv.decimalMark);
  const header = readHeader(head, start, dialect.delimiter);
  // A header cut by the head's end, or one the whole-file path refuses: that path words it.
  if (!header.ok || header.dataStart >= head.length || header.names.every((name) => name === '')) return null;
  const { plan, problems: namingProblems } = planColumns(header.names, columns, fileName, dialect.decimalMark);
  if (!plan) return failure(...namingProblems);
  const problems = new RowProblems();
  // Records from the header's end: the file's line breaks less the header's, plus one (recordBound).
  const capacity = facts.lineBreaks - (recordBound(head, 0, header.dataStart) - 1) + 1;
  const window = new ByteWindow(source, header.dataStart, sizes.window, scratch);
  const data = { bytes: window.view, start: 0, firstLine: header.firstDataLine, streamed: { window, capacity } };
  const table = yield* readColumnsSteps(data, dialect.delimiter, dialect.decimalMark, header.names.length, plan.requests, problems);
  const encoding = { name: 'UTF-8' as const, how: facts.marked ? 'byte-order mark' as const : 'detected' as const };
  return success({ table, plan, dialect, encoding, problems });
}

/** The handed bytes, leaving the holder empty. */
function take(handed: HandedBytes): Uint8Array {
  const { bytes } = handed;
  if (bytes === null) throw new Error('readTableSteps: the handed bytes were taken already');
  handed.bytes = null;
  return bytes;
}
