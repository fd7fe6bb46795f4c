/**
 * The first look at a data file: its header and a few rows, read with the dialect the project's
 * CSV settings ask for (or detect), so the user can give each column a role before importing.
 */
import Papa from 'papaparse';
import { failure, success, type Result } from '../../../core/result';
import { resolveDialect } from '../../../data/csvDialect';
import { sourceText } from '../../../data/sourceText';
import type { CsvSettings } from '../../../project/schema';
import type { DataInspection } from '../../../shared/workerMessages';

const PREVIEW_ROWS = 5;

export function inspectData(bytes: Uint8Array, fileName: string, csv: CsvSettings): Result<DataInspection> {
  const decoded = sourceText(bytes);
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
