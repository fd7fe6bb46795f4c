/**
 * Turning Node file-system errors into messages a person can act on: the file, what we were doing,
 * and what went wrong in words, with the system's code in brackets for whoever reads a support
 * ticket. Never a stack trace.
 */

import { HostFileError } from '../host/regularFile';

/** A file operation that failed; `message` is ready to show. */
export class FileAccessError extends Error {
  readonly code: string | undefined;
  readonly path: string;

  constructor(message: string, path: string, code?: string) {
    super(message);
    this.name = 'FileAccessError';
    this.path = path;
    this.code = code;
  }
}

// POSIX error names as Node reports them (errno(3), common practice); worded for a user.
const REASONS: Readonly<Record<string, string>> = {
  ENOENT: 'the file or its folder does not exist',
  EACCES: 'permission denied',
  EPERM: 'the operation is not permitted',
  EISDIR: 'it is a folder, not a file',
  ENOTDIR: 'a part of the path is not a folder',
  EEXIST: 'a file of that name already exists',
  ENOSPC: 'the disk is full',
  EDQUOT: 'the disk quota is used up',
  EROFS: 'the disk is read-only',
  EBUSY: 'the file is in use by another program',
  EMFILE: 'too many files are open',
  ENAMETOOLONG: 'the path is too long',
  EIO: 'the disk reported an input/output error',
  EXDEV: 'the temporary file and the target are on different disks',
  ELOOP: 'too many symbolic links',
};

export function errorCode(error: unknown): string | undefined {
  if (typeof error === 'object' && error !== null && 'code' in error && typeof (error as { code: unknown }).code === 'string') {
    return (error as { code: string }).code;
  }
  return undefined;
}

/** e.g. describeFileError(e, 'save', '/p/a.spcritic') → `Could not save "/p/a.spcritic": permission denied (EACCES)`. */
export function describeFileError(error: unknown, action: string, path: string): FileAccessError {
  if (error instanceof FileAccessError) return error;
  const code = errorCode(error);
  // The bounded reader's own reasons (a device, a pipe, too large) are more precise than "the system refused".
  if (error instanceof HostFileError && !(code && code in REASONS)) {
    return new FileAccessError(`Could not ${action} "${path}": ${error.reason}`, path, code);
  }
  const reason = code ? `${REASONS[code] ?? 'the system refused'} (${code})` : firstLine(error);
  return new FileAccessError(`Could not ${action} "${path}": ${reason}`, path, code);
}

function firstLine(error: unknown): string {
  const text = error instanceof Error ? error.message : String(error);
  return text.split('\n')[0] || 'unknown error';
}
