/**
 * A large data file (over STREAMED_FILE_BYTES, so the command line reads it in pieces: the head and
 * first pass, then the records) rewritten at the same length while the import reads it: the host's
 * fstat after the last read (size and modification time, src/host/regularFile.ts) no longer matches
 * the one before the first, and the command stops with the documented status for bad input (exit 1,
 * README "Exit status") and a message naming the data file, "changed while it was read; run again".
 * The rewrite is injected at the import's first yield (the terminal's pace hook), on the real file.
 * The data are the tank-levels sample's log (an invented plant) written over and over.
 */
import { mkdtempSync, readFileSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateProjectFile } from '../../src/cli/evaluateProjectFile';
import { EXIT } from '../../src/cli/exitStatus';
import { STREAMED_FILE_BYTES } from '../../src/core/limits';
import { countingProgress } from '../support/countingProgress';

const sample = join(__dirname, '..', '..', 'sample-projects', 'tank-levels');
let folder = '', project = '', data = '', content = '';

beforeAll(() => {
  folder = mkdtempSync(join(tmpdir(), 'rewritten-import-'));
  const [header, ...rows] = readFileSync(join(sample, 'tank-levels.csv'), 'utf8').trimEnd().split('\n');
  const copies = Math.ceil((STREAMED_FILE_BYTES + 1) / (rows.join('\n').length + 1)) + 1;
  content = `${header}\n${Array.from({ length: copies }, (_, k) => rows.map((row) => `${k + 1}-${row}`).join('\n')).join('\n')}\n`;
  data = join(folder, 'long-log.csv');
  writeFileSync(data, content);
  // An old modification time, so the rewrite moves it even on a file system that keeps whole seconds.
  utimesSync(data, new Date('2026-01-01T00:00:00Z'), new Date('2026-01-01T00:00:00Z'));
  const document = JSON.parse(readFileSync(join(sample, 'tank-levels.spcritic'), 'utf8'));
  document.data = { ...document.data, path: 'long-log.csv', sha256: undefined, rowCount: undefined };
  project = join(folder, 'long-log.spcritic');
  writeFileSync(project, JSON.stringify(document));
});

afterAll(() => rmSync(folder, { recursive: true, force: true }));

/** A terminal whose first yield rewrites the data file: one cost digit changed, the length kept. */
const rewritingAtFirstYield = () => countingProgress((paces) => {
  if (paces === 0) writeFileSync(data, content.replace(/\d(\r?\n)/, (d, end: string) => `${(Number(d[0]) + 1) % 10}${end}`));
});

describe('a data file rewritten while the command line reads it', () => {
  it('is large enough to be read in pieces, and the rewrite keeps its length', () => {
    expect(Buffer.byteLength(content)).toBeGreaterThanOrEqual(STREAMED_FILE_BYTES);
    expect(content.replace(/\d(\r?\n)/, '0$1').length).toBe(content.length);
  });

  it('stops with exit 1 and a message naming the file, before any fit', async () => {
    const { progress, seen } = rewritingAtFirstYield();
    const result = await evaluateProjectFile(project, { resamples: 20 }, undefined, progress);
    expect(seen.paces).toBeGreaterThan(0);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.failure.exitCode).toBe(EXIT.badInput);
    expect(result.failure.message).toContain('long-log.csv');
    expect(result.failure.message).toMatch(/changed while it was read.*run again/);
    expect(seen.fits).toBe(0);
  }, 120_000);
});
