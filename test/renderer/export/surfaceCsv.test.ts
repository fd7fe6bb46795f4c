import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { CAUTION_SHORT } from '../../../src/pipeline/cautions';
import { csvField, surfaceCsv } from '../../../src/renderer/src/export/surfaceCsv';
import { bowlSurface } from '../../figures/syntheticPlotData';

describe('surfaceCsv (long form, RFC 4180)', () => {
  const surface = bowlSurface(4, 3);
  const csv = surfaceCsv(surface, 'V^{π}(s), discounted cost (kWh)'); // the app's axis markup (plotLabels.valueLabel)

  it('parses with an independent CSV reader (papaparse) into one record per grid point', () => {
    const parsed = Papa.parse<string[]>(csv, { comments: '#', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const [header, ...rows] = parsed.data;
    expect(header).toEqual(['tank level', 'inflow', 'Vπ(s), discounted cost (kWh)', 'visits']); // plain text: no markup braces in a CSV
    expect(rows).toHaveLength(12);
    // y outer, x inner: record 5 is (x[1], y[1]).
    expect(rows[5].map(Number)).toEqual([surface.x[1], surface.y[1], surface.values[5], surface.visits[5]]);
    rows.forEach((r, i) => expect(Number(r[2])).toBe(surface.values[i])); // shortest round-trip numbers
  });

  it('ends every line with CRLF and starts with # comment lines that carry the caution', () => {
    expect(csv.endsWith('\r\n')).toBe(true);
    expect(csv.split('\r\n').slice(0, 4).every((l) => l.startsWith('# '))).toBe(true);
    expect(csv).toContain(CAUTION_SHORT);
    expect(csv.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
  });

  it('quotes fields with commas, quotes, line breaks, a leading # or edge spaces (RFC 4180 §2.6–2.7)', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a, b')).toBe('"a, b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField('#1')).toBe('"#1"');
    expect(csvField(' pad')).toBe('" pad"');
    const odd = surfaceCsv({ ...surface, xState: 'level "A", m' }, 'V');
    const header = Papa.parse<string[]>(odd, { comments: '#' }).data[0];
    expect(header[0]).toBe('level "A", m');
  });

  it('defuses labels a spreadsheet would run as formulas (OWASP, "CSV Injection")', () => {
    expect(csvField('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(csvField('+level')).toBe("'+level");
    expect(csvField('-cost')).toBe("'-cost");
    expect(csvField('@sum')).toBe("'@sum");
    expect(csvField('level_m')).toBe('level_m');
  });

  it('no line, the "#" ones included, gives a formula cell however a spreadsheet splits it (OWASP, "CSV Injection")', () => {
    const hostile = surfaceCsv({ ...surface, xState: 'a,=cmd|\' /C calc\'!A0', yState: '@SUM(1;2)\t-2+3' }, '+V, "=1"');
    for (const delimiter of [',', ';', '\t']) {
      const cells = Papa.parse<string[]>(hostile, { delimiter, skipEmptyLines: true }).data.flat();
      for (const cell of cells.filter((c) => !Number.isFinite(Number(c)))) expect(cell.trim()).not.toMatch(/^[=+\-@]/); // numbers such as -1 are data
    }
    const header = Papa.parse<string[]>(hostile, { comments: '#' }).data[0];
    expect(header.slice(0, 2)).toEqual(["a,=cmd|' /C calc'!A0", "'@SUM(1;2)\t-2+3"]);
  });

  it('writes a non-finite value as an empty field', () => {
    const values = surface.values.slice();
    values[0] = NaN;
    const rows = Papa.parse<string[]>(surfaceCsv({ ...surface, values }, 'V'), { comments: '#', skipEmptyLines: true }).data;
    expect(rows[1][2]).toBe('');
  });
});
