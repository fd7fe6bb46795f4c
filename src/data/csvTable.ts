/**
 * The first part of the import: the file's bytes → the table of the requested columns (decode,
 * dialect, header, column plan, one streaming pass over the records; importDataset.ts does the rest).
 *
 * The bytes may be handed over (HandedBytes): then the import takes them out of the holder at once
 * and lets go of them when this pass ends, so that a large file is not held in memory together with
 * the transitions built from it, nor together with its UTF-8 copy when it was in another encoding.
 * A host that keeps the file for later imports (the app's worker) passes the bytes themselves.
 */
import type { ColumnRoles, CsvSettings } from '../project/schema';
import { failure, success, type Result } from '../core/result';
import type { PassSteps } from '../core/fqe/cancellation';
import { isBlank } from './cellText';
import { planColumns, type ColumnPlan } from './columnPlan';
import { readColumnsSteps, type TableColumns } from './columnReader';
import { resolveDialect, type Dialect } from './csvDialect';
import { readHeader } from './csvHeader';
import { importProblem } from './importProblem';
import { RowProblems } from './rowProblems';
import { sampleText, sourceBytes } from './sourceBytes';
import type { TextEncodingName } from './sourceText';

/** A data file's bytes handed over to the import, which empties the holder (see above). */
export interface HandedBytes {
  bytes: Uint8Array | null;
}

export type ImportSource = string | Uint8Array | HandedBytes;

export interface CsvTable {
  table: TableColumns;
  plan: ColumnPlan;
  dialect: Dialect;
  encoding: { name: TextEncodingName; how: 'byte-order mark' | 'detected' };
  problems: RowProblems;
}

export function* readTableSteps(source: ImportSource, fileName: string, csv: CsvSettings, columns: ColumnRoles): PassSteps<Result<CsvTable>> {
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

/** The handed bytes, leaving the holder empty. */
function take(handed: HandedBytes): Uint8Array {
  const { bytes } = handed;
  if (bytes === null) throw new Error('readTableSteps: the handed bytes were taken already');
  handed.bytes = null;
  return bytes;
}
