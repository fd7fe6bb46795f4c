/**
 * openProject with a data file the host left open to be read in pieces (the command line's route
 * for a large log, pipeline/openProject.ts OpenDataFile) gives what the same bytes read whole give:
 * the same fingerprint (checked against Node's own SHA-256, and taken without a read of its own), transitions and import report, and the
 * file is closed after the import, also when the file ends early ('file-changed') or a stop request ends it;
 * a file rewritten at the same length between the first read and the records is refused once the host
 * says so (PieceSource.unchangedSinceOpened, asked after the last read).
 * The log is the tank-levels sample's written three times over (run labels made distinct per copy),
 * over 2 MiB, so its records are read through the window (data/csvTable.ts).
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { MAX_HEADER_BYTES } from '../../src/data/csvHeader';
import { CANCELLED_PROBLEM } from '../../src/pipeline/cancelledProblem';
import { openProject, type OpenDataFile } from '../../src/pipeline/openProject';

const sample = join(__dirname, '..', '..', 'sample-projects', 'tank-levels');
const [header, ...rows] = readFileSync(join(sample, 'tank-levels.csv'), 'utf8').trimEnd().split('\n');
const bytes = new TextEncoder().encode(`${header}\n${[1, 2, 3].map((k) => rows.map((row) => `${k}-${row}`).join('\n')).join('\n')}\n`);
const document = JSON.parse(readFileSync(join(sample, 'tank-levels.spcritic'), 'utf8'));
const projectText = JSON.stringify({ ...document, data: { ...document.data, path: 'long-log.csv', sha256: undefined, rowCount: undefined } });

function openFile(length = bytes.length): OpenDataFile & { closed: number; bytesRead: number } {
  const file = {
    byteLength: length, closed: 0, bytesRead: 0,
    read: (into: Uint8Array, offset: number, count: number, position: number) => {
      const n = Math.max(0, Math.min(count, 1 << 20, bytes.length - position));
      into.set(bytes.subarray(position, position + n), offset);
      file.bytesRead += n;
      return n;
    },
    close: async () => { file.closed++; },
  };
  return file;
}

describe('openProject on a data file read in pieces', () => {
  it('fingerprint, transitions and report as when the file is read whole; the file is closed', async () => {
    expect(bytes.length).toBeGreaterThan(2 * 1024 * 1024 + 4096);
    const file = openFile();
    const pieces = await openProject(projectText, 'long-log.spcritic', async () => file);
    const whole = await openProject(projectText, 'long-log.spcritic', async () => bytes.slice());
    if (!pieces.ok || !whole.ok) throw new Error('the log should open');
    expect(file.closed).toBe(1);
    expect(pieces.value.fingerprint).toBe(createHash('sha256').update(bytes).digest('hex'));
    expect(pieces.value.fingerprint).toBe(whole.value.fingerprint);
    // The fingerprint rides on the import's reads: the head, the first pass and the records' pass, no third pass of its own.
    expect(file.bytesRead).toBeLessThanOrEqual(2 * bytes.length + 2 * MAX_HEADER_BYTES);
    expect(pieces.value.imported.rowCount).toBe(3 * rows.length);
    expect(pieces.value.dataset).toEqual(whole.value.dataset);
    expect(pieces.value.imported.episodeReport).toEqual(whole.value.imported.episodeReport);
    expect(pieces.value.imported.summary).toEqual(whole.value.imported.summary);
    expect(pieces.value.warnings).toEqual(whole.value.warnings);
  });

  it('a stop request during the pieces ends the import as cancelled, within a few yields, and closes the file', async () => {
    const file = openFile();
    let paces = 0;
    const opened = await openProject(projectText, 'long-log.spcritic', async () => file, { cancel: () => paces >= 3, pace: async () => { paces++; } });
    expect(opened.ok).toBe(false);
    if (!opened.ok) expect(opened.problems).toEqual([CANCELLED_PROBLEM]);
    expect(paces).toBe(3);
    expect(file.closed).toBe(1);
  });

  it('a file that ends before its length is refused naming the data path, and still closed', async () => {
    const file = openFile(bytes.length + 10);
    const opened = await openProject(projectText, 'long-log.spcritic', async () => file);
    expect(opened.ok).toBe(false);
    if (!opened.ok) expect(opened.problems[0]).toMatchObject({ kind: 'file-changed', where: 'long-log.csv' });
    expect(file.closed).toBe(1);
  });

  it('a file rewritten at the same length after its first read is refused naming the data path, "run again", and closed', async () => {
    // The rewrite keeps every line's length and the CSV well formed (run labels 1- become 7-), so the passes alone cannot tell.
    const rewritten = new TextEncoder().encode(new TextDecoder().decode(bytes).replaceAll('\n1-', '\n7-'));
    expect(rewritten.length).toBe(bytes.length);
    let reads = 0;
    const file = openFile();
    const read = file.read;
    const stamp = () => (reads > 1 ? 'rewritten' : 'as opened'); // what the host's fstat would say
    const injected = {
      ...file,
      read: (into: Uint8Array, offset: number, count: number, position: number) => {
        if (++reads === 1) return read(into, offset, count, position);
        const n = Math.max(0, Math.min(count, 1 << 20, rewritten.length - position));
        into.set(rewritten.subarray(position, position + n), offset);
        return n;
      },
      unchangedSinceOpened: () => stamp() === 'as opened',
    };
    const opened = await openProject(projectText, 'long-log.spcritic', async () => injected);
    expect(reads).toBeGreaterThan(1);
    expect(opened.ok).toBe(false);
    if (!opened.ok) {
      expect(opened.problems).toHaveLength(1);
      expect(opened.problems[0]).toMatchObject({ kind: 'file-changed', where: 'long-log.csv' });
      expect(opened.problems[0].message).toMatch(/changed while it was read.*run again/);
    }
    expect(file.closed).toBe(1);
    // The same rewrite from a host that cannot tell (no unchangedSinceOpened) opens: what the check adds.
    reads = 0;
    const { unchangedSinceOpened: _, ...blind } = injected;
    expect((await openProject(projectText, 'long-log.spcritic', async () => blind)).ok).toBe(true);
  });
});
