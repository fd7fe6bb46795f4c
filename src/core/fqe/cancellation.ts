/**
 * How a long fit learns it should stop: an AbortSignal-like object or a function, polled at
 * safe points (between blocks of transitions, between iterations).
 */
import { FqeCancelledError } from './fqeErrors';

export type CancellationCheck = { readonly aborted: boolean } | (() => boolean);

export function throwIfCancelled(check: CancellationCheck | undefined): void {
  if (!check) return;
  const cancelled = typeof check === 'function' ? check() : check.aborted;
  if (cancelled) throw new FqeCancelledError();
}

/**
 * A pace() that yields to the event loop once at least intervalMs have passed since the last
 * yield, so that in a worker a stop message can arrive (and queued requests be answered) while a
 * long synchronous computation runs in slices. setTimeout exists in Node, workers and pages alike.
 */
export function createPacer(intervalMs: number, now: () => number = () => performance.now()): () => Promise<void> {
  let last = now();
  return async () => {
    if (now() - last < intervalMs) return;
    await new Promise<void>((resolve) => setTimeout(resolve, 0));
    last = now();
  };
}

/**
 * A long pass written once as a generator that yields between slices (a block of transitions, a
 * few runs): runSteps drives it straight through, runStepsPaced awaits pace() between slices so a
 * host's Ctrl+C or stop message is heard within about a slice plus the pacer's interval.
 */
export type PassSteps<T> = Generator<void, T, void>;

export function runSteps<T>(steps: PassSteps<T>): T {
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}

export async function runStepsPaced<T>(steps: PassSteps<T>, pace: () => Promise<void>): Promise<T> {
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
    await pace();
  }
}

/** How often a paced pass yields to the event loop (ours: well inside the second a user waits after Ctrl+C, and a setTimeout(0) costs about a millisecond, so under 1 % of the time). */
export const PACE_INTERVAL_MS = 100;
