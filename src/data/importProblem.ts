/**
 * Problems from importing a data file carry a kind as well as where and what, so the UI can
 * group them (all cells that are not numbers, all ragged rows) and tests can assert what went
 * wrong without matching whole sentences.
 */
import type { Problem } from '../core/result';

export type ImportProblemKind =
  // the file as a whole
  | 'not-utf8' | 'file-changed' | 'header-too-long' | 'empty-file' | 'blank-header' | 'header-only' | 'no-usable-rows' | 'no-transitions' | 'more-problems'
  // naming in the header and the column roles
  | 'missing-column' | 'duplicate-column' | 'next-state-count' | 'expression-syntax' | 'expression-unknown-column'
  | 'derived-name-clash'
  // one row or one cell
  | 'blank-line' | 'ragged-row' | 'quote' | 'empty-cell' | 'not-a-number' | 'not-finite' | 'bad-flag'
  | 'empty-episode' | 'bad-timestamp' | 'invalid-date' | 'timestamp-backwards' | 'reward-not-finite' | 'reward-outside-declared'
  // a time window or a range of runs left out that cannot be used; the closing hint of an import stopped by bad rows
  | 'bad-time-window' | 'bad-run-range' | 'bad-rows'
  // warnings
  | 'unused-duplicate-column' | 'constant-state' | 'rows-excluded' | 'actions-outside-bounds'
  | 'few-transitions' | 'too-few-transitions';

export interface ImportProblem extends Problem {
  readonly kind: ImportProblemKind;
  /** For 'bad-rows': how many rows cannot be used (the problems listed may be fewer). */
  readonly rows?: number;
}

export function importProblem(kind: ImportProblemKind, where: string, message: string): ImportProblem {
  return { kind, where, message };
}
