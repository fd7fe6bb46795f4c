/**
 * The value surface as a table, in long form: one record per grid point with its two state values,
 * V, and the visit count, so it loads straight into a spreadsheet or a data-frame without
 * reshaping, and the never-visited points (visits = 0) can be filtered. A few leading lines starting
 * with "#" describe the table (read them with a comment option, e.g. pandas comment="#"). A
 * spreadsheet that ignores the "#" still splits those lines at its delimiter (comma, semicolon or
 * tab, by locale), so the names in them carry none of those and never start a formula; the rest
 * is RFC 4180: CRLF line ends, fields with a comma, quote, CR, LF, a leading "#" or edge spaces in
 * double quotes with inner quotes doubled. Numbers are written in shortest round-trip form; a
 * non-finite V is an empty field.
 */
import { plainText } from '../../../figures/parts/richText';
import { CAUTION_SHORT } from '../../../pipeline/cautions';
import type { ValueSurface } from '../../../pipeline/estimates';

const CRLF = '\r\n';

/**
 * A label as an RFC 4180 field. A label a spreadsheet would run as a formula (leading =, +, -, @,
 * tab or CR) gets a leading apostrophe first, as the OWASP guidance on CSV injection advises:
 * column names come from the user's own files, and the export must not execute them.
 */
export function csvField(text: string): string {
  const inert = /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
  return /[",\r\n]|^#|^\s|\s$/.test(inert) ? `"${inert.replace(/"/g, '""')}"` : inert;
}

/**
 * A name inside a "#" line, inert however a spreadsheet splits the line: no delimiter, quote or line
 * break (each becomes a space), and a leading apostrophe before =, +, -, @ (OWASP, "CSV Injection").
 */
function commentText(text: string): string {
  const flat = text.replace(/[,;\t\r\n"]+/g, ' ').trim();
  return /^[=+\-@]/.test(flat) ? `'${flat}` : flat;
}

function numberField(v: number): string {
  return Number.isFinite(v) ? String(v) : '';
}

export function surfaceCsv(surface: ValueSurface, valueLabel: string): string {
  const nx = surface.x.length, ny = surface.y.length;
  const lines = [
    `# Value surface ${commentText(plainText(valueLabel))} over ${commentText(surface.xState)} and ${commentText(surface.yState)}: ${nx}×${ny} grid in long form (one row per grid point — ${commentText(surface.yState)} outer and ${commentText(surface.xState)} inner).`,
    '# visits = logged states nearest the grid point (projected onto these two states); 0 = never visited, V there is extrapolated.',
    `# Other states held at: ${surface.heldState.map(numberField).join(' | ')}`,
    `# ${CAUTION_SHORT}`,
    [surface.xState, surface.yState, plainText(valueLabel), 'visits'].map(csvField).join(','),
  ];
  for (let iy = 0; iy < ny; iy++) {
    for (let ix = 0; ix < nx; ix++) {
      const i = iy * nx + ix;
      lines.push(`${numberField(surface.x[ix])},${numberField(surface.y[iy])},${numberField(surface.values[i])},${surface.visits[i]}`);
    }
  }
  return lines.join(CRLF) + CRLF;
}
