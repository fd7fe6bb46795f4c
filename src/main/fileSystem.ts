/**
 * The few file-system operations the file store, recovery store and recent list need, behind an
 * interface so a test can stand in for the disk (e.g. stop between write and rename, as a crash
 * would) and the real implementation stays a thin layer over node:fs/promises.
 */
import { constants } from 'node:fs';
import { access, lstat, mkdir, open, readdir, realpath, rename, stat, unlink } from 'node:fs/promises';
import { MAX_DATA_BYTES, readRegularFile } from '../host/regularFile';

/** Whether a file can be written: it does not exist yet, or exists and may be written, or is read-only. */
export type WriteAccess = 'missing' | 'writable' | 'readOnly';

export interface FileSystem {
  /** A regular file's bytes, at most maxBytes (host/regularFile.ts: devices, pipes and folders are refused). */
  readFile(path: string, maxBytes?: number): Promise<Uint8Array>;
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
  /**
   * The file a write to `path` should replace: `path` itself, or — when it is a symbolic link — the
   * file the link finally names (realpath(3)), so a save writes through the link and keeps it.
   * Throws ENOENT-coded errors for a link to nothing.
   */
  writeTarget(path: string): Promise<string>;
  /** readOnly: no write permission bit at all, or access(2) refuses writing. */
  writeAccess(path: string): Promise<WriteAccess>;
}

export const nodeFileSystem: FileSystem = {
  readFile: (path, maxBytes = MAX_DATA_BYTES) => readRegularFile(path, { maxBytes, what: 'file' }),
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
  async writeTarget(path) {
    try {
      if (!(await lstat(path)).isSymbolicLink()) return path;
    } catch (e) {
      if ((e as { code?: string }).code === 'ENOENT') return path;
      throw e;
    }
    return realpath(path);
  },
  async writeAccess(path) {
    try {
      // No write bit for anyone is a read-only file whoever we are (root passes access(2) regardless).
      if (((await stat(path)).mode & 0o222) === 0) return 'readOnly';
      await access(path, constants.W_OK);
      return 'writable';
    } catch (e) {
      const code = (e as { code?: string }).code;
      if (code === 'ENOENT') return 'missing';
      if (code === 'EACCES' || code === 'EPERM' || code === 'EROFS') return 'readOnly';
      throw e;
    }
  },
};
