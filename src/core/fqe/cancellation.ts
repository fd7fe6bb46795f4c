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
