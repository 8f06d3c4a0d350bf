import { useCallback, useSyncExternalStore } from 'react';
import { liveQuery, type Subscription } from 'dexie';

/*
 * What a query over the phone's database answers, read again whenever its tables change, and
 * shared by every screen that asks under the same key: the practice log and progress read a
 * year's 300 sessions once, and the screen a tap opens draws at once from the answer the one it
 * leaves already holds (no second read, no empty first frame). Dexie's liveQuery directly rather
 * than dexie-react-hooks: sharing that package with the pad would split it into a chunk of its
 * own, and the pad's first load would grow by a file.
 */

interface Shared {
  answer?: { value: unknown };
  listeners: Set<() => void>;
  subscription?: Subscription;
  drop?: ReturnType<typeof setTimeout>;
}

const shared = new Map<string, Shared>();

/** How long a query no screen shows goes on being watched: the screen opened next takes it over. */
export const STORED_KEPT_MS = 3000;

/**
 * Watches `query` under `key` (one watch per key, however many listeners); `listener` is called
 * with each new answer. The returned function stops listening; the watch ends STORED_KEPT_MS
 * after its last listener left.
 */
export function watchStored(key: string, query: () => Promise<unknown>, listener: () => void): () => void {
  let entry = shared.get(key);
  if (!entry) {
    const created: Shared = { listeners: new Set() };
    shared.set(key, created);
    created.subscription = liveQuery(query).subscribe({
      next: (value) => {
        created.answer = { value };
        for (const l of created.listeners) l();
      },
      error: (error: unknown) => console.error('Reading practice from this phone failed', error),
    });
    entry = created;
  }
  const watched = entry;
  clearTimeout(watched.drop);
  watched.listeners.add(listener);
  return () => {
    watched.listeners.delete(listener);
    if (watched.listeners.size > 0) return;
    watched.drop = setTimeout(() => {
      watched.subscription?.unsubscribe();
      shared.delete(key);
    }, STORED_KEPT_MS);
  };
}

/** The latest answer watched under `key`; undefined before the first. */
export const storedAnswer = (key: string): { value: unknown } | undefined => shared.get(key)?.answer;

/**
 * The answer of `query`, undefined until the first. `key` names the query and what it depends on
 * (the same key, the same query: screens share it).
 */
export function useStored<T>(query: () => Promise<T>, key: string): T | undefined {
  // The query is a new function each render; `key` says when it means something else.
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const subscribe = useCallback((listener: () => void) => watchStored(key, query, listener), [key]);
  return useSyncExternalStore(subscribe, () => storedAnswer(key))?.value as T | undefined;
}
