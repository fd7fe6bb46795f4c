/**
 * A minimal observable value for React's useSyncExternalStore: get, set, subscribe. The app keeps
 * one of these for the open project document and one for the session around it.
 */
export interface Store<T> {
  get(): T;
  set(next: T | ((current: T) => T)): void;
  subscribe(listener: () => void): () => void;
}

export function createStore<T>(initial: T): Store<T> {
  let value = initial;
  const listeners = new Set<() => void>();
  return {
    get: () => value,
    set(next) {
      const updated = typeof next === 'function' ? (next as (current: T) => T)(value) : next;
      if (Object.is(updated, value)) return;
      value = updated;
      for (const listener of [...listeners]) listener();
    },
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}
