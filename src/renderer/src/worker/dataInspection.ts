/**
 * The first look at a data file: its header and a few rows, read with the dialect the project's
 * CSV settings ask for (or detect), so the user can give each column a role before importing.
 *
 * Only the file's head is decoded (HEAD_BYTES, sourceHead.ts) where it decides everything the
 * whole text would: the dialect's sample and the preview rows end inside it, it is long enough
 * for the CSV parser's guess of the line ending, and it is not blank. Otherwise — long records, a
 * blank head (empty lines or spaces), a file in another encoding — the whole file is decoded as
 * before, so the results never depend on the head.
 */
import Papa from 'papaparse';
import { failure, success, type Result } from '../../../core/result';
import { headHoldsSample, resolveDialect } from '../../../data/csvDialect';
import { HEAD_BYTES } from '../../../data/csvHeader';
import { sourceHead } from '../../../data/sourceHead';
import { sourceText, type TextReading } from '../../../data/sourceText';
import type { CsvSettings } from '../../../project/schema';
import type { DataInspection } from '../../../shared/workerMessages';

/** Rows shown below the header; with the header, fewer than the dialect's sample (csvDialect.ts), so a head holding the sample holds them. */
const PREVIEW_ROWS = 5;
/** Papa Parse guesses the line ending from the first 1024 × 1024 characters of its input (papaparse.js, guessLineEndings). */
const LINE_ENDING_GUESS_CHARS = 1024 * 1024;

export function inspectData(bytes: Uint8Array, fileName: string, csv: CsvSettings): Result<DataInspection> {
  const head = sourceHead(bytes, HEAD_BYTES);
  // A head of spaces alone reads as an empty file; the whole one may not be (its header line is then blank).
  const decides = head.whole || (head.ok && head.text.length >= LINE_ENDING_GUESS_CHARS && head.text.trim() !== '' && headHoldsSample(head.text, csv.delimiter));
  return inspectText(decides ? head : sourceText(bytes), fileName, csv);
}

function inspectText(decoded: TextReading, fileName: string, csv: CsvSettings): Result<DataInspection> {
  if (!decoded.ok) return failure({ where: fileName, message: decoded.reason });
  if (decoded.text.trim() === '') return failure({ where: fileName, message: 'the file is empty; expected a header line of column names and data rows below it' });
  const dialect = resolveDialect(decoded.text, csv.delimiter, csv.decimalMark);
  const rows = Papa.parse<string[]>(decoded.text, { delimiter: dialect.delimiter, preview: PREVIEW_ROWS + 1, skipEmptyLines: true }).data;
  const header = (rows[0] ?? []).map((name) => name.trim());
  if (header.every((name) => name === '')) return failure({ where: `${fileName}, line 1`, message: 'the header line has no column names' });
  return success({
    fileName, header, previewRows: rows.slice(1), delimiter: dialect.delimiter, decimalMark: dialect.decimalMark,
    encoding: { name: decoded.encoding, how: decoded.how },
  });
}
