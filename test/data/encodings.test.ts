/**
 * Files exported in other text encodings are read, and the encoding is named. The fixtures in
 * test/fixtures/encodings/ hold one small semicolon CSV with a decimal comma and the non-ASCII
 * header "temp_°C", written by Python's own codecs (cp1252, utf-16-le/be, utf-8) — an encoder
 * independent of the decoders under test.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { importDataset } from '../../src/data/importDataset';
import { sourceBytes } from '../../src/data/sourceBytes';
import { sourceText } from '../../src/data/sourceText';
import type { ColumnRoles } from '../../src/project/schema';

const folder = resolve(__dirname, '../fixtures/encodings');
const roles: ColumnRoles = {
  states: [{ column: 'temp_°C', unit: '°C' }], actions: [{ column: 'valve_%', unit: '%' }],
  reward: { kind: 'column', column: 'cost', sense: 'cost' }, nextState: { kind: 'nextRow' }, episode: { kind: 'column', column: 'run' },
};
const csv = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' } as const;

describe('sourceText detects and names the encoding', () => {
  it.each([
    ['windows-1252.csv', 'Windows-1252', 'detected'],
    ['utf-16le-bom.csv', 'UTF-16LE', 'byte-order mark'],
    ['utf-16be-bom.csv', 'UTF-16BE', 'byte-order mark'],
    ['utf-16le.csv', 'UTF-16LE', 'detected'],
    ['utf-8-bom.csv', 'UTF-8', 'byte-order mark'],
  ])('%s → %s (%s), header intact', (file, encoding, how) => {
    const read = sourceText(new Uint8Array(readFileSync(resolve(folder, file))));
    expect(read.ok && read.encoding).toBe(encoding);
    expect(read.ok && read.how).toBe(how);
    expect(read.ok && read.text.split(/\r?\n/)[0]).toBe('run;temp_°C;valve_%;cost');
  });

  it.each(['windows-1252.csv', 'utf-16le-bom.csv', 'utf-16be-bom.csv', 'utf-16le.csv'])('%s imports with the same numbers as UTF-8', (file) => {
    const result = importDataset(new Uint8Array(readFileSync(resolve(folder, file))), file, csv, roles);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.transitions.count).toBe(10); // 2 runs × 6 rows − 1 per run
    expect(result.value.summary.columns.find((c) => c.name === 'temp_°C')?.max).toBeCloseTo(23.5, 12);
    expect(result.value.episodeReport.some((line) => /^Text encoding: (Windows-1252|UTF-16LE|UTF-16BE) /.test(line))).toBe(true);
  });

  it('a zero byte in a file that is not UTF-16 is refused with its position', () => {
    const read = sourceText(Uint8Array.of(0x61, 0x2c, 0x62, 0x0a, 0x31, 0x00, 0x32, 0x0a));
    expect(read.ok).toBe(false);
    expect(!read.ok && read.reason).toContain('zero byte at byte 6');
  });

  it('a zero byte in an otherwise ASCII file is refused wherever it falls in a 32-bit word, and plain ASCII passes as it is', () => {
    const text = 'a,b\n1,2\n3,4\n5,6\n';
    const plain = new TextEncoder().encode(text);
    expect(sourceBytes(plain)).toMatchObject({ ok: true, bytes: plain, encoding: 'UTF-8' });
    for (let at = 4; at < plain.length - 1; at++) {
      const bytes = plain.slice();
      bytes[at] = 0;
      const read = sourceBytes(bytes);
      expect(read.ok).toBe(false);
      expect(!read.ok && read.reason).toContain(`zero byte at byte ${at + 1}`);
    }
  });
});
