/**
 * A shown table as text: its cells (header and body rows, as displayed, details closed), then
 * tab-separated lines for the clipboard or RFC 4180 CSV (fields with a comma, quote or line break
 * quoted, quotes doubled; CRLF line ends). Spreadsheet formulas are defused: a cell that starts
 * with = + − @ gets a leading apostrophe when it is not a number (OWASP "CSV injection", common practice).
 */
export function tableCells(table: HTMLTableElement): string[][] {
  return Array.from(table.rows, (row) => Array.from(row.cells, (cell) => cellText(cell)));
}

function cellText(cell: HTMLTableCellElement): string {
  const copy = cell.cloneNode(true) as HTMLElement;
  copy.querySelectorAll('details').forEach((d) => d.remove());
  return plainCellText(copy.textContent ?? '');
}

/**
 * A cell's words for a file or the clipboard: every run of white space one plain space, the no-break
 * spaces that hold a formula or a "%" together on screen (core/formulaText.ts, core/shareText.ts)
 * included (U+00A0 is white space to \s, ECMA-262 §12.2), since nothing wraps in a CSV file and a
 * user searches it for "1/(1 − γ)" as typed.
 */
export function plainCellText(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}

function defused(text: string): string {
  const numeric = /^[−+-]?[\d.,]+(e[−+-]?\d+)?( ?%)?$/i.test(text);
  return /^[=+\-−@]/.test(text) && !numeric ? `'${text}` : text;
}

export function toTabSeparated(rows: readonly string[][]): string {
  return rows.map((r) => r.map((c) => defused(c).replace(/\t/g, ' ')).join('\t')).join('\n');
}

export function toCsv(rows: readonly string[][]): string {
  const field = (c: string) => {
    const t = defused(c);
    return /[",\r\n]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t;
  };
  return rows.map((r) => r.map(field).join(',')).join('\r\n') + '\r\n';
}
