/**
 * Which delimiter and decimal mark a file uses. European exports write "1,5;2,5", others
 * "1.5,2.5" or tab-separated text; the first rows decide unless the user chose.
 *
 * Delimiter: the candidate that splits the sampled records into the same number (> 1) of fields
 * most consistently, preferring more fields on ties. Decimal mark: "," only when cells such as
 * 12,5 outnumber cells such as 12.5 in the sample (common practice for locale sniffing).
 */
import Papa from 'papaparse';
import type { DecimalMark } from './numericCell';

export type Delimiter = ',' | ';' | '\t';
export const DELIMITERS: readonly Delimiter[] = [',', ';', '\t'];
const SAMPLE_RECORDS = 50;

export interface Dialect {
  delimiter: Delimiter;
  decimalMark: DecimalMark;
  delimiterDetected: boolean;
  decimalMarkDetected: boolean;
}

/** The first records of `text` split with `delimiter` (RFC 4180 quoting), blank lines dropped. */
export function sampleRecords(text: string, delimiter: Delimiter, records = SAMPLE_RECORDS): string[][] {
  const parsed = Papa.parse<string[]>(text, { delimiter, preview: records, skipEmptyLines: true });
  return parsed.data;
}

/**
 * True when `text`, the head of a longer text, decides the dialect as the whole would: it holds
 * one record past the sample for every delimiter resolveDialect may try, so each sampled record
 * ended before the head did (a record cut by the head's end is always the last one parsed).
 */
export function headHoldsSample(text: string, delimiter: Delimiter | 'auto'): boolean {
  const tried = delimiter === 'auto' ? DELIMITERS : [delimiter];
  return tried.every((d) => sampleRecords(text, d, SAMPLE_RECORDS + 1).length > SAMPLE_RECORDS);
}

export function detectDelimiter(text: string): Delimiter {
  let best: Delimiter = ',';
  let bestScore = -Infinity;
  for (const delimiter of DELIMITERS) {
    const rows = sampleRecords(text, delimiter);
    if (rows.length === 0) continue;
    const headerFields = rows[0].length;
    const agreeing = rows.filter((row) => row.length === headerFields).length / rows.length;
    // Agreement with the header dominates; the field count breaks ties between consistent splits.
    const score = headerFields > 1 ? agreeing * 1000 + headerFields : -1;
    if (score > bestScore) {
      bestScore = score;
      best = delimiter;
    }
  }
  return best;
}

const DOT_DECIMAL = /^[+-]?\d*\.\d+(?:[eE][+-]?\d+)?$/;
const COMMA_DECIMAL = /^[+-]?\d*,\d+(?:[eE][+-]?\d+)?$/;

export function detectDecimalMark(rows: readonly string[][]): DecimalMark {
  let dots = 0;
  let commas = 0;
  for (const row of rows.slice(1)) {
    for (const cell of row) {
      const trimmed = cell.trim();
      if (DOT_DECIMAL.test(trimmed)) dots++;
      else if (COMMA_DECIMAL.test(trimmed)) commas++;
    }
  }
  return commas > dots ? ',' : '.';
}

/** The dialect to read `text` with: the user's choices where given, detection elsewhere. */
export function resolveDialect(text: string, delimiter: Delimiter | 'auto', decimalMark: DecimalMark | 'auto'): Dialect {
  const chosenDelimiter = delimiter === 'auto' ? detectDelimiter(text) : delimiter;
  const chosenDecimal = decimalMark === 'auto' ? detectDecimalMark(sampleRecords(text, chosenDelimiter)) : decimalMark;
  return {
    delimiter: chosenDelimiter,
    decimalMark: chosenDecimal,
    delimiterDetected: delimiter === 'auto',
    decimalMarkDetected: decimalMark === 'auto',
  };
}
