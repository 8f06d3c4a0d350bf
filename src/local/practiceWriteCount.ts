import type { Middleware, DBCore } from 'dexie';

const PRACTICE_TABLES: readonly string[] = ['practiceSessions', 'practiceEnds'];

/**
 * Counts the read-write transactions this page opens over the practice tables, as each is
 * created. A write that builds on rows this page remembers (writtenSessions) is sure no other
 * such write of this page came in between only if the count moved by its own transaction alone:
 * IndexedDB runs overlapping transactions in the order they were created.
 */
export function practiceWriteCounter(count: () => void): Middleware<DBCore> {
  return {
    stack: 'dbcore',
    name: 'practiceWriteCount',
    create: (down) => ({
      ...down,
      transaction: (stores, mode, options) => {
        if (mode === 'readwrite' && stores.some((s) => PRACTICE_TABLES.includes(s))) count();
        return down.transaction(stores, mode, options);
      },
    }),
  };
}
