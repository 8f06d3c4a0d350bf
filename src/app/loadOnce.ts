import type { ReactPromise } from 'react';

/**
 * A promise that says, once settled, how it ended, in the fields React's `use` reads: a screen
 * whose code has already loaded is then drawn at once. (React.lazy waits a turn even then, and
 * shows its fallback; React holds back the content that replaces a fallback for up to 300 ms.)
 */
export type Settling<T> = Promise<T> & ReactPromise<T>;

/** The same promise, its fields written as it settles. */
type Marked<T> = Promise<T> & { status?: 'fulfilled' | 'rejected'; value?: T; reason?: unknown };

/** Runs `load` the first time it is asked for; every later call hands back the same promise. */
export function loadOnce<T>(load: () => Promise<T>): () => Settling<T> {
  let loading: Settling<T> | undefined;
  return () => {
    if (loading) return loading;
    const started: Marked<T> = load();
    started.then(
      (value) => {
        started.status = 'fulfilled';
        started.value = value;
      },
      (reason: unknown) => {
        started.status = 'rejected';
        started.reason = reason;
      },
    );
    loading = started as Settling<T>;
    return loading;
  };
}
