/**
 * Undo and redo over immutable snapshots of the project document. Consecutive edits that carry the
 * same coalescing key (typing into one field) merge into one step, so one undo takes back the
 * whole value rather than one keystroke. The history keeps at most HISTORY_LIMIT steps.
 */
export interface HistoryStep<T> {
  readonly state: T;
  /** What the step did, for "Undo <label>". */
  readonly label: string;
}

export interface EditHistory<T> {
  readonly past: readonly HistoryStep<T>[];
  readonly present: T;
  /** Label of the edit that produced present (null after load, undo or redo). */
  readonly presentLabel: string | null;
  readonly future: readonly HistoryStep<T>[];
  /** Coalescing key of the last edit; a different key (or none) starts a new step. */
  readonly lastKey: string | null;
}

export const HISTORY_LIMIT = 200;

export function createHistory<T>(present: T): EditHistory<T> {
  return { past: [], present, presentLabel: null, future: [], lastKey: null };
}

export function applyEdit<T>(history: EditHistory<T>, next: T, label: string, coalesceKey: string | null = null): EditHistory<T> {
  if (Object.is(next, history.present)) return history;
  if (coalesceKey !== null && coalesceKey === history.lastKey && history.past.length > 0) {
    return { ...history, present: next, future: [], presentLabel: label };
  }
  const past = [...history.past, { state: history.present, label }].slice(-HISTORY_LIMIT);
  return { past, present: next, presentLabel: label, future: [], lastKey: coalesceKey };
}

export function undo<T>(history: EditHistory<T>): EditHistory<T> {
  const step = history.past[history.past.length - 1];
  if (!step) return history;
  return {
    past: history.past.slice(0, -1),
    present: step.state,
    presentLabel: null,
    future: [{ state: history.present, label: step.label }, ...history.future],
    lastKey: null,
  };
}

export function redo<T>(history: EditHistory<T>): EditHistory<T> {
  const step = history.future[0];
  if (!step) return history;
  return {
    past: [...history.past, { state: history.present, label: step.label }],
    present: step.state,
    presentLabel: step.label,
    future: history.future.slice(1),
    lastKey: null,
  };
}

/** End coalescing (e.g. a field lost focus): the next edit starts a new step even with the same key. */
export function closeStep<T>(history: EditHistory<T>): EditHistory<T> {
  return history.lastKey === null ? history : { ...history, lastKey: null };
}

/** Apply f to every snapshot (facts that are not edits, such as the data file's fingerprint after a save). */
export function mapHistory<T>(history: EditHistory<T>, f: (state: T) => T): EditHistory<T> {
  const mapStep = (step: HistoryStep<T>): HistoryStep<T> => ({ ...step, state: f(step.state) });
  return { ...history, past: history.past.map(mapStep), present: f(history.present), future: history.future.map(mapStep) };
}

export function undoLabel<T>(history: EditHistory<T>): string | null {
  return history.past[history.past.length - 1]?.label ?? null;
}

export function redoLabel<T>(history: EditHistory<T>): string | null {
  return history.future[0]?.label ?? null;
}
