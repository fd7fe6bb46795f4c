/** Read a slice of a store in a component; it re-renders only when the slice changes (Object.is). */
import { useCallback, useSyncExternalStore } from 'react';
import type { Store } from './store';

export function useStore<T, S>(store: Store<T>, select: (value: T) => S): S {
  const read = useCallback(() => select(store.get()), [store, select]);
  return useSyncExternalStore(store.subscribe, read, read);
}
