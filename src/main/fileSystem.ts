/**
 * The few file-system operations the file store, recovery store and recent list need, behind an
 * interface so a test can stand in for the disk (e.g. stop between write and rename, as a crash
 * would) and the real implementation stays a thin layer over node:fs/promises.
 */
import { mkdir, open, readdir, readFile, rename, stat, unlink } from 'node:fs/promises';

export interface FileSystem {
  readFile(path: string): Promise<Uint8Array>;
  /** Create `path` (failing if it exists), write all bytes, fsync, close. */
  writeNewFileSynced(path: string, bytes: Uint8Array, mode?: number): Promise<void>;
  /** Replace `to` by `from` in one step (POSIX rename(2) is atomic within one file system). */
  rename(from: string, to: string): Promise<void>;
  unlink(path: string): Promise<void>;
  /** fsync a folder so a rename in it survives power loss; a no-op where the OS cannot (Windows). */
  syncFolder(path: string): Promise<void>;
  /** Names (not paths) in a folder; [] when the folder does not exist. */
  listFolder(path: string): Promise<string[]>;
  /** Permission bits of a file, or null when it does not exist. */
  fileMode(path: string): Promise<number | null>;
  makeFolder(path: string): Promise<void>;
}

export const nodeFileSystem: FileSystem = {
  readFile: async (path) => new Uint8Array(await readFile(path)),
  async writeNewFileSynced(path, bytes, mode) {
    const handle = await open(path, 'wx', mode ?? 0o666);
    try {
      await handle.writeFile(bytes);
      await handle.sync();
    } finally {
      await handle.close();
    }
  },
  rename: (from, to) => rename(from, to),
  unlink: (path) => unlink(path),
  async syncFolder(path) {
    try {
      const handle = await open(path, 'r');
      try {
        await handle.sync();
      } finally {
        await handle.close();
      }
    } catch {
      // Windows cannot open or fsync a directory (EISDIR/EPERM); NTFS journals the rename itself.
    }
  },
  async listFolder(path) {
    try {
      return await readdir(path);
    } catch (e) {
      if ((e as { code?: string }).code === 'ENOENT') return [];
      throw e;
    }
  },
  async fileMode(path) {
    try {
      return (await stat(path)).mode & 0o7777;
    } catch (e) {
      if ((e as { code?: string }).code === 'ENOENT') return null;
      throw e;
    }
  },
  makeFolder: async (path) => {
    await mkdir(path, { recursive: true });
  },
};
