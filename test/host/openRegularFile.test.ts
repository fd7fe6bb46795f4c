/**
 * openRegularFile: the checks of readRegularFile (a folder is refused by its kind, a missing file
 * by the system's code), then reads by position (pread(2), POSIX.1-2017) that return the file's
 * bytes at any offset, 0 at the end, and readAll that returns the same bytes as readRegularFile;
 * and whether the file is still as it was opened (fstat(2) size and modification time, st_mtim).
 */
import { mkdtempSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { HostFileError, openRegularFile, readRegularFile } from '../../src/host/regularFile';

const folder = mkdtempSync(join(tmpdir(), 'open-regular-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const options = { maxBytes: 1 << 20, what: 'data file' };

describe('openRegularFile', () => {
  it('reads pieces by position and the whole file, and closes', async () => {
    const path = join(folder, 'log.csv');
    const content = Buffer.from('a,b\n1,2\n3,4\n'.repeat(1000));
    writeFileSync(path, content);
    const file = await openRegularFile(path, options);
    expect(file.byteLength).toBe(content.length);
    const piece = new Uint8Array(10);
    expect(file.read(piece, 2, 8, 4)).toBe(8);
    expect(Buffer.from(piece.subarray(2)).equals(content.subarray(4, 12))).toBe(true);
    expect(file.read(piece, 0, 10, content.length)).toBe(0);
    expect(Buffer.from(await file.readAll()).equals(content)).toBe(true);
    await file.close();
    expect(Buffer.from(await readRegularFile(path, options)).equals(content)).toBe(true);
  });

  it('refuses a folder by its kind and a missing file by its code, naming the file', async () => {
    await expect(openRegularFile(folder, options)).rejects.toMatchObject({ code: 'ENOTREGULAR', reason: 'it is a folder, not a regular file' });
    const missing = openRegularFile(join(folder, 'none.csv'), options);
    await expect(missing).rejects.toBeInstanceOf(HostFileError);
    await expect(missing).rejects.toMatchObject({ code: 'ENOENT' });
  });

  it('says a file rewritten at the same length after it was opened is no longer as it was', async () => {
    const path = join(folder, 'rewritten.csv');
    writeFileSync(path, 'a,b\n1,2\n');
    // An old modification time, so the rewrite below moves it even where the file system keeps whole seconds.
    utimesSync(path, new Date('2026-01-01T00:00:00Z'), new Date('2026-01-01T00:00:00Z'));
    const file = await openRegularFile(path, options);
    const piece = new Uint8Array(4);
    file.read(piece, 0, 4, 0);
    expect(file.unchangedSinceOpened()).toBe(true); // reading changes nothing
    writeFileSync(path, 'a,b\n9,9\n'); // same length, other bytes
    expect(file.read(piece, 0, 4, 4)).toBe(4);
    expect(new TextDecoder().decode(piece)).toBe('9,9\n'); // the open handle reads the new bytes: only the stamp tells
    expect(file.unchangedSinceOpened()).toBe(false);
    await file.close();
    expect(file.unchangedSinceOpened()).toBe(false); // fstat on a closed handle fails: not vouched for
  });
});
