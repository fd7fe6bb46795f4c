import { chmod, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { FileAccessError, describeFileError } from '../../src/main/fileErrors';
import { backupPathFor, createFileStore, isTemporaryFor } from '../../src/main/fileStore';
import { nodeFileSystem, type FileSystem } from '../../src/main/fileSystem';

// The issue text is the spec for these rules: temp file in the same folder, fsync, rename, a backup
// of the previous version; a crash between write and rename leaves the original intact.
describe('atomic file store', () => {
  let folder: string;
  beforeEach(async () => {
    folder = await mkdtemp(join(tmpdir(), 'spc-store-'));
  });
  afterEach(async () => {
    await chmod(folder, 0o755).catch(() => undefined);
    await rm(folder, { recursive: true, force: true });
  });

  it('writes a new file and reads it back as text and bytes', async () => {
    const store = createFileStore(nodeFileSystem);
    const path = join(folder, 'plant.spcritic');
    await store.writeAtomic(path, 'first ✓\n', { backup: true });
    expect(await store.readText(path)).toBe('first ✓\n');
    expect(Array.from(await store.readBytes(path)).slice(0, 5)).toEqual([102, 105, 114, 115, 116]);
    expect(await readdir(folder)).toEqual(['plant.spcritic']); // no backup of a file that did not exist, no temp left
  });

  it('keeps the previous version as <name>.bak on each save', async () => {
    const store = createFileStore(nodeFileSystem);
    const path = join(folder, 'plant.spcritic');
    await store.writeAtomic(path, 'version 1', { backup: true });
    await store.writeAtomic(path, 'version 2', { backup: true });
    await store.writeAtomic(path, 'version 3', { backup: true });
    expect(backupPathFor(path)).toBe(`${path}.bak`);
    expect(await readFile(path, 'utf8')).toBe('version 3');
    expect(await readFile(`${path}.bak`, 'utf8')).toBe('version 2');
    expect((await readdir(folder)).sort()).toEqual(['plant.spcritic', 'plant.spcritic.bak']);
  });

  it('keeps the file mode of the file it replaces', async () => {
    const store = createFileStore(nodeFileSystem);
    const path = join(folder, 'plant.spcritic');
    await writeFile(path, 'old');
    await chmod(path, 0o640);
    await store.writeAtomic(path, 'new', { backup: false });
    expect((await nodeFileSystem.fileMode(path))! & 0o777).toBe(0o640);
  });

  it('a crash between write and rename leaves the original intact; the next save removes the temp file', async () => {
    const path = join(folder, 'plant.spcritic');
    await writeFile(path, 'the saved original');
    // The process "dies" at rename: the promise never settles, so no clean-up code runs.
    const crashing: FileSystem = { ...nodeFileSystem, rename: () => new Promise<void>(() => undefined) };
    void createFileStore(crashing).writeAtomic(path, 'half-way work', { backup: false });
    await waitFor(async () => (await readdir(folder)).some((n) => isTemporaryFor(n, 'plant.spcritic')));
    const names = await readdir(folder);
    const temporary = names.find((n) => isTemporaryFor(n, 'plant.spcritic'))!;
    expect(await readFile(path, 'utf8')).toBe('the saved original');
    expect(await readFile(join(folder, temporary), 'utf8')).toBe('half-way work'); // fsynced before the rename
    expect(temporary.startsWith('.')).toBe(true); // hidden, and no program opens *.spcritic-tmp

    // "Next start": a new store reads the original, and its first save of the file removes the leftover.
    const next = createFileStore(nodeFileSystem);
    expect(await next.readText(path)).toBe('the saved original');
    await next.writeAtomic(path, 'saved after restart', { backup: true });
    expect((await readdir(folder)).sort()).toEqual(['plant.spcritic', 'plant.spcritic.bak']);
    expect(await readFile(`${path}.bak`, 'utf8')).toBe('the saved original');
  });

  it('a failed rename removes its temp file, leaves the original, and names file and cause', async () => {
    const path = join(folder, 'plant.spcritic');
    await writeFile(path, 'original');
    const failing: FileSystem = { ...nodeFileSystem, rename: async () => { throw Object.assign(new Error('EXDEV: cross-device link not permitted'), { code: 'EXDEV' }); } };
    const error = await createFileStore(failing).writeAtomic(path, 'new', { backup: false }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(FileAccessError);
    expect((error as Error).message).toBe(`Could not save "${path}": the temporary file and the target are on different disks (EXDEV)`);
    expect(await readdir(folder)).toEqual(['plant.spcritic']);
    expect(await readFile(path, 'utf8')).toBe('original');
  });

  it('reports a folder without write permission as EACCES, naming the file', async () => {
    if (process.getuid?.() === 0) return; // root ignores permission bits
    await chmod(folder, 0o555);
    const path = join(folder, 'plant.spcritic');
    await expect(createFileStore(nodeFileSystem).writeAtomic(path, 'x', { backup: false })).rejects.toThrow(`Could not save "${path}": permission denied (EACCES)`);
  });

  it('reports a missing file as ENOENT on read, without a stack trace in the message', async () => {
    const path = join(folder, 'nowhere.csv');
    const error = (await createFileStore(nodeFileSystem).readBytes(path).catch((e: unknown) => e)) as FileAccessError;
    expect(error.message).toBe(`Could not read "${path}": the file or its folder does not exist (ENOENT)`);
    expect(error.code).toBe('ENOENT');
    expect(error.message).not.toMatch(/\n\s+at /);
  });

  it('describes an error without a code by its first line', () => {
    expect(describeFileError(new Error('disk on fire\n    at somewhere'), 'read', '/x').message).toBe('Could not read "/x": disk on fire');
  });
});

async function waitFor(condition: () => Promise<boolean>): Promise<void> {
  for (let i = 0; i < 200; i++) {
    if (await condition()) return;
    await new Promise((r) => setTimeout(r, 10));
  }
  throw new Error('condition not reached');
}
