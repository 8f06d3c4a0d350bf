import { useEffect, useState } from 'react';
import { liveQuery } from 'dexie';

/**
 * What a query over the phone's database answers, read again whenever its tables change.
 * Dexie's liveQuery directly rather than dexie-react-hooks: sharing that package with the pad
 * would split it into a chunk of its own, and the pad's first load would grow by a file.
 * `key` names what the query depends on; undefined until the first answer.
 */
export function useStored<T>(query: () => Promise<T>, key: string): T | undefined {
  const [answer, setAnswer] = useState<{ key: string; value: T }>();
  useEffect(() => {
    const subscription = liveQuery(query).subscribe({
      next: (value) => setAnswer({ key, value }),
      error: (error: unknown) => console.error('Reading practice from this phone failed', error),
    });
    return () => subscription.unsubscribe();
    // The query is a new function each render; `key` says when it means something else.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);
  return answer?.key === key ? answer.value : undefined;
}
