// The viewer's cursor time for the few parts of the page that need it (the note form's "at the cursor"), kept
// outside React state so that scrubbing re-renders only the viewer and those parts, not the whole page.
import { useSyncExternalStore } from 'react';

export interface CursorStore {
  get(): number | null;
  set(t: number | null): void;
  subscribe(listener: () => void): () => void;
}

export function createCursorStore(initial: number | null): CursorStore {
  let value = initial;
  const listeners = new Set<() => void>();
  return {
    get: () => value,
    set: (t) => {
      if (t === value) return;
      value = t;
      for (const l of listeners) l();
    },
    subscribe: (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
  };
}

export function useCursorTime(store: CursorStore): number | null {
  return useSyncExternalStore(store.subscribe, store.get, store.get);
}
