/**
 * Bytes handed over to the import (csvTable.ts) import exactly as the bytes themselves do, and the
 * holder is emptied, so the host keeps no reference to the file once its records are read.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { importDataset, type HandedBytes } from '../../src/data/importDataset';
import { parseProjectText } from '../../src/project/projectFile';

const folder = resolve(__dirname, '../../sample-projects/tank-levels');
const loaded = parseProjectText(readFileSync(resolve(folder, 'tank-levels.spcritic'), 'utf8'), 'tank-levels.spcritic');
if (!loaded.ok) throw new Error('sample project does not load');
const { data, columns } = loaded.value.document;
const read = () => new Uint8Array(readFileSync(resolve(folder, data.path)));

describe('handed bytes', () => {
  it('import as the bytes do, and leave the holder empty', () => {
    const handed: HandedBytes = { bytes: read() };
    const viaHolder = importDataset(handed, data.path, data.csv, columns);
    expect(handed.bytes).toBeNull();
    expect(viaHolder).toEqual(importDataset(read(), data.path, data.csv, columns));
  });

  it('cannot be imported twice (a host bug, said at once)', () => {
    const handed: HandedBytes = { bytes: read() };
    importDataset(handed, data.path, data.csv, columns);
    expect(() => importDataset(handed, data.path, data.csv, columns)).toThrow(/taken already/);
  });
});
