/**
 * Reading and atomically writing the user's files.
 *
 * An atomic save never leaves a half-written file under the user's name: the new bytes go to a
 * temporary file in the same folder (same file system, so rename is atomic), are fsynced, and the
 * temporary file is renamed over the target; the folder is then fsynced so the rename itself is
 * durable (rename(2) and fsync(2), POSIX.1-2017 — common practice for crash-safe saves). Before the
 * rename, the previous version is copied to `<name>.bak` the same way, so one earlier version
 * always survives.
 *
 * A crash between write and rename leaves the original intact and a temporary file that nothing
 * opens (dot-prefixed, `.spcritic-tmp`); the next save of the same file removes it. Its contents
 * are not lost: the app service writes the recovery copy before every save.
 */
import { randomBytes } from 'node:crypto';
import { basename, dirname, join } from 'node:path';
import { MAX_PROJECT_BYTES } from '../host/regularFile';
import { FileAccessError, describeFileError } from './fileErrors';
import type { FileSystem } from './fileSystem';

const TEMP_SUFFIX = '.spcritic-tmp';
const BACKUP_SUFFIX = '.bak';

export interface FileStore {
  /** A regular file's bytes, at most maxBytes (default: host/regularFile.ts, MAX_DATA_BYTES). */
  readBytes(path: string, maxBytes?: number): Promise<Uint8Array>;
  /** UTF-8 text of a regular file of at most MAX_PROJECT_BYTES (projects, state files). */
  readText(path: string): Promise<string>;
  /**
   * Atomic replace; with `backup`, the previous version (if any) is kept as `<path>.bak`. A
   * symbolic link is written through (the file it names is replaced, the link stays); a read-only
   * file is refused, unchanged.
   */
  writeAtomic(path: string, contents: Uint8Array | string, options: { backup: boolean }): Promise<void>;
}

export function backupPathFor(path: string): string {
  return `${path}${BACKUP_SUFFIX}`;
}

/** `.tank-levels.spcritic.3f9a0c1b2d4e.spcritic-tmp` beside the target. */
export function temporaryPathFor(path: string, token: string): string {
  return join(dirname(path), `.${basename(path)}.${token}${TEMP_SUFFIX}`);
}

/** True for temporary files this store made for `targetName` (a file name, not a path). */
export function isTemporaryFor(fileName: string, targetName: string): boolean {
  return fileName.startsWith(`.${targetName}.`) && fileName.endsWith(TEMP_SUFFIX);
}

export function createFileStore(fs: FileSystem, token: () => string = () => randomBytes(6).toString('hex')): FileStore {
  // Temporary files of saves still in progress in this process: never cleaned up under their feet.
  const inFlight = new Set<string>();

  async function readBytes(path: string, maxBytes?: number): Promise<Uint8Array> {
    try {
      return await fs.readFile(path, maxBytes);
    } catch (e) {
      throw describeFileError(e, 'read', path);
    }
  }

  async function removeStaleTemporaries(path: string): Promise<void> {
    const folder = dirname(path);
    const names = await fs.listFolder(folder);
    for (const name of names.filter((n) => isTemporaryFor(n, basename(path)))) {
      const stale = join(folder, name);
      if (!inFlight.has(stale)) await fs.unlink(stale).catch(() => undefined);
    }
  }

  async function writeSynced(target: string, bytes: Uint8Array, mode: number | null): Promise<void> {
    const temporary = temporaryPathFor(target, token());
    inFlight.add(temporary);
    try {
      await fs.writeNewFileSynced(temporary, bytes, mode ?? undefined);
      await fs.rename(temporary, target);
    } catch (e) {
      await fs.unlink(temporary).catch(() => undefined);
      throw e;
    } finally {
      inFlight.delete(temporary);
    }
  }

  async function writeAtomic(path: string, contents: Uint8Array | string, options: { backup: boolean }): Promise<void> {
    const bytes = typeof contents === 'string' ? new TextEncoder().encode(contents) : contents;
    try {
      const target = await fs.writeTarget(path);
      if ((await fs.writeAccess(target)) === 'readOnly') throw new FileAccessError(`Could not save "${path}": the file is read-only, so it was left unchanged; save under another name, or make it writable first`, path, 'EACCES');
      await removeStaleTemporaries(target);
      const mode = await fs.fileMode(target);
      if (options.backup && mode !== null) await writeSynced(backupPathFor(target), await fs.readFile(target), mode);
      await writeSynced(target, bytes, mode);
      await fs.syncFolder(dirname(target));
    } catch (e) {
      throw describeFileError(e, 'save', path);
    }
  }

  return {
    readBytes,
    readText: async (path) => new TextDecoder('utf-8').decode(await readBytes(path, MAX_PROJECT_BYTES)),
    writeAtomic,
  };
}
