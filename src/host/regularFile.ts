/**
 * Reading a user's file on the Node side (the command line and the app's main process), safely:
 *   - only a regular file is read: a device (/dev/zero, /dev/urandom), a pipe or FIFO, a socket or
 *     a folder is refused by its kind, before a byte is read;
 *   - the open never blocks (O_NONBLOCK: opening a FIFO with no writer would otherwise wait forever),
 *     and the kind is taken from the opened handle (fstat), so the file cannot be swapped between
 *     the check and the read;
 *   - at most `maxBytes` are read, in pieces, whatever the file claims (files under /proc report size
 *     0 and still have content), and a file larger than that is refused by its size.
 * Messages name the file and what is wrong, never its content (open(2), fstat(2), POSIX.1-2017).
 *
 * openRegularFile makes the same checks and leaves the file open, for a reader that takes it in
 * pieces by position (pread(2)) instead of holding it whole: the command line's import of a large
 * log (src/data/pieceSource.ts). Its length is the size fstat reported when it was opened, and it can
 * say whether the file is still as it was then (size and modification time, fstat again).
 */
import { constants, fstatSync, readSync } from 'node:fs';
import { open, type FileHandle } from 'node:fs/promises';

/** Size limits (choices): a project is a few kilobytes; a CSV log of 10 million rows × 10 columns is ~1 GB. */
export const MAX_PROJECT_BYTES = 16 * 1024 * 1024;
export const MAX_DATA_BYTES = 1024 * 1024 * 1024;

/**
 * A file that is not read: `message` is ready to show ("Cannot read the data file …: it is a
 * device, not a regular file"), `reason` is the part after the colon, `code` the system's code.
 */
export class HostFileError extends Error {
  constructor(readonly what: string, readonly path: string, readonly reason: string, readonly code?: string) {
    super(`Cannot read the ${what} ${path}: ${reason}`);
    this.name = 'HostFileError';
  }
}

const PIECE = 4 * 1024 * 1024;

export interface RegularFileOptions {
  /** Refuse files larger than this many bytes. */
  maxBytes: number;
  /** What the file is, for messages: "project file", "data file". */
  what: string;
}

export async function readRegularFile(path: string, options: RegularFileOptions): Promise<Uint8Array> {
  const file = await openRegularFile(path, options);
  try {
    return await file.readAll();
  } finally {
    await file.close();
  }
}

/** A regular file left open after the checks above: read it whole, or in pieces by position; close it when done. */
export interface RegularFile {
  /** The size fstat reported when the file was opened. */
  readonly byteLength: number;
  /** Every byte up to EOF, refusing more than maxBytes (the size may be 0 or out of date). */
  readAll(): Promise<Uint8Array>;
  /** Up to `length` bytes from file offset `position` into `into` at `offset`, synchronously; the count read (0 at EOF). A refused read throws a HostFileError. */
  read(into: Uint8Array, offset: number, length: number, position: number): number;
  /** False where the file's size or modification time now differs from when it was opened, or fstat now fails (a rewrite at the same length moves the time). */
  unchangedSinceOpened(): boolean;
  close(): Promise<void>;
}

export async function openRegularFile(path: string, options: RegularFileOptions): Promise<RegularFile> {
  let handle: FileHandle;
  try {
    handle = await open(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
  } catch (e) {
    throw new HostFileError(options.what, path, reasonOf(e), codeOf(e));
  }
  try {
    const stats = await handle.stat();
    if (!stats.isFile()) throw new HostFileError(options.what, path, `it is ${kindOf(stats)}, not a regular file`, 'ENOTREGULAR');
    if (stats.size > options.maxBytes) throw tooLarge(path, options, stats.size);
    const opened = contentStamp(handle.fd); // before the first read
    return {
      byteLength: stats.size,
      readAll: () => readAll(handle, path, options, stats.size),
      read: (into, offset, length, position) => {
        try {
          return readSync(handle.fd, into, offset, length, position);
        } catch (e) {
          throw new HostFileError(options.what, path, reasonOf(e), codeOf(e));
        }
      },
      unchangedSinceOpened: () => {
        try {
          return contentStamp(handle.fd) === opened;
        } catch {
          return false;
        }
      },
      close: () => handle.close().catch(() => undefined),
    };
  } catch (e) {
    await handle.close().catch(() => undefined);
    throw e;
  }
}

/** What a rewrite changes: the size and the modification time to the nanosecond the file system keeps (fstat(2) st_size, st_mtim). */
function contentStamp(fd: number): string {
  const stats = fstatSync(fd, { bigint: true });
  return `${stats.size}:${stats.mtimeNs}`;
}

/** Every byte up to EOF, refusing more than maxBytes (the size may be 0 or out of date). */
async function readAll(handle: FileHandle, path: string, options: RegularFileOptions, sizeHint: number): Promise<Uint8Array> {
  let buffer = new Uint8Array(Math.min(options.maxBytes, sizeHint) + 1);
  let length = 0;
  for (;;) {
    if (length === buffer.length) {
      if (length > options.maxBytes) throw tooLarge(path, options, length);
      const larger = new Uint8Array(Math.min(options.maxBytes + 1, Math.max(2 * buffer.length, PIECE)));
      larger.set(buffer);
      buffer = larger;
    }
    const { bytesRead } = await handle.read(buffer, length, Math.min(PIECE, buffer.length - length), null).catch((e: unknown) => {
      throw new HostFileError(options.what, path, reasonOf(e), codeOf(e));
    });
    if (bytesRead === 0) break;
    length += bytesRead;
  }
  if (length > options.maxBytes) throw tooLarge(path, options, length);
  return length === buffer.length ? buffer : buffer.subarray(0, length);
}

function tooLarge(path: string, options: RegularFileOptions, size: number): HostFileError {
  const mib = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(bytes < 10 * 1024 * 1024 ? 1 : 0)} MiB`;
  return new HostFileError(options.what, path, `it is larger than ${mib(options.maxBytes)} (${mib(size)}), the most a ${options.what} may be`, 'EFBIG');
}

function kindOf(stats: { isDirectory(): boolean; isFIFO(): boolean; isSocket(): boolean; isCharacterDevice(): boolean; isBlockDevice(): boolean }): string {
  if (stats.isDirectory()) return 'a folder';
  if (stats.isFIFO()) return 'a pipe (FIFO)';
  if (stats.isSocket()) return 'a socket';
  if (stats.isCharacterDevice() || stats.isBlockDevice()) return 'a device';
  return 'not a file';
}

// POSIX error names as Node reports them (errno(3)), worded for a user.
const REASONS: Readonly<Record<string, string>> = {
  ENOENT: 'no such file', EACCES: 'permission denied', EPERM: 'the operation is not permitted',
  EISDIR: 'it is a folder, not a file', ENOTDIR: 'a part of the path is not a folder', ELOOP: 'too many symbolic links',
  ENAMETOOLONG: 'the path is too long', EMFILE: 'too many files are open', EIO: 'the disk reported an input/output error',
  ENXIO: 'no such device', EAGAIN: 'the file is busy',
};

export function codeOf(error: unknown): string | undefined {
  const code = (error as { code?: unknown } | null)?.code;
  return typeof code === 'string' ? code : undefined;
}

export function reasonOf(error: unknown): string {
  const code = codeOf(error);
  if (code) return `${REASONS[code] ?? 'the system refused'} (${code})`;
  return error instanceof Error ? error.message.split('\n')[0] : String(error);
}
