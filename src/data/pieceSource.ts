/**
 * A data file read in pieces instead of held whole: the host (the command line, src/host) opens the
 * file and the import pulls bytes from it by position, so a 1 GB log never sits in memory beside
 * the columns and transitions built from it. The length is fixed when the file is opened; reads
 * past it are not made, so a log still being appended to is read as it was at that moment.
 */
import { importProblem, type ImportProblem } from './importProblem';

export interface PieceSource {
  /** The file's length in bytes when it was opened. */
  readonly byteLength: number;
  /** Copy up to `length` bytes from file offset `position` into `into` at `offset`; the count copied (0 at the end of the file). */
  read(into: Uint8Array, offset: number, length: number, position: number): number;
  /**
   * False where the file is no longer as it was opened: its size or modification time differs from the
   * host's fstat(2) before the first read. Asked after the last read, it catches most rewrites, also one
   * at the same length between the first pass and the records (a file whose system keeps times to the
   * second may hide one made within the same second). A host that cannot tell leaves it out.
   */
  unchangedSinceOpened?(): boolean;
}

export function isPieceSource(source: unknown): source is PieceSource {
  return typeof source === 'object' && source !== null && typeof (source as PieceSource).read === 'function';
}

/**
 * A file read in pieces that could not be read as it was first measured: it ended early, it held
 * more records than its first pass counted, or the system refused a read (`reason` says which,
 * never the file's content). The import turns it into a 'file-changed' problem.
 */
export class PieceReadError extends Error {
  constructor(readonly reason: string) {
    super(reason);
    this.name = 'PieceReadError';
  }
}

/** The problem a PieceReadError becomes, naming the file. */
export function pieceReadProblem(fileName: string, error: PieceReadError): ImportProblem {
  return importProblem('file-changed', fileName, `the file could not be read to its end: ${error.reason}; read it again`);
}

export const CHANGED_WHILE_READ = 'the file changed while it was read (is a program still writing it?)';

/** The problem of a file whose size or modification time moved while it was read (PieceSource.unchangedSinceOpened), naming the file. */
export function changedWhileReadProblem(fileName: string): ImportProblem {
  return importProblem('file-changed', fileName, `${CHANGED_WHILE_READ}; run again once it is written`);
}

/** Fill into[offset, offset + length) from file offset `position`, reading until done; throws PieceReadError when the file ends first or a read fails. */
export function readFully(source: PieceSource, into: Uint8Array, offset: number, length: number, position: number): void {
  let done = 0;
  while (done < length) {
    let n: number;
    try {
      n = source.read(into, offset + done, length - done, position + done);
    } catch (e) {
      const reason = (e as { reason?: unknown } | null)?.reason; // a host’s error may carry the part of its message after the file name
      throw new PieceReadError(typeof reason === 'string' ? reason : e instanceof Error ? e.message.split('\n')[0] : String(e));
    }
    if (n <= 0) throw new PieceReadError(CHANGED_WHILE_READ);
    done += n;
  }
}

/** The whole file in one array (for what only the whole-file reader does: other encodings, a header longer than the window). */
export function readWhole(source: PieceSource): Uint8Array {
  const bytes = new Uint8Array(source.byteLength);
  readFully(source, bytes, 0, source.byteLength, 0);
  return bytes;
}
