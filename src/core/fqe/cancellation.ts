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
