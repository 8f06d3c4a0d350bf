/** Chromium's trace of IndexedDB commits, read the same way for the pad's tap and the practice plot's. */
export type TraceEvent = { name: string; ph: string; ts: number; dur?: number; args?: { txn_id?: number } };
export type Trace = { traceEvents: TraceEvent[] };

/** The trace categories commitTimes reads. */
export const COMMIT_TRACE_CATEGORIES = ['IndexedDB', 'blink.user_timing'];

/**
 * For each tap, when IndexedDB committed its write, from Chromium's own trace (ms): the tap starts
 * where the page's measure `name` starts; the write's transaction is the one whose complete event
 * the page was handling when the measure ended; the commit is the database's "complete" for it.
 * The page hears of a commit only after the frame the tap paints, which Chromium runs first.
 */
export function commitTimes({ traceEvents: events }: Trace, name: string): number[] {
  const measure = (ph: string) => events.filter((e) => e.name === name && e.ph === ph);
  const completes = events.filter((e) => e.name === 'IDBTransaction::onComplete');
  const commits = new Map(
    events
      .filter((e) => e.name === 'Transaction::CommitPhaseTwo.TransactionCompleteCallbacks')
      .map((e) => [e.args?.txn_id, e.ts]),
  );
  const ends = measure('e');
  return measure('b').flatMap((begin, i) => {
    const end = ends[i]!.ts;
    const heard = completes.filter((c) => c.ts <= end && end <= c.ts + (c.dur ?? 0)).at(-1);
    const committedAt = commits.get(heard?.args?.txn_id);
    return committedAt === undefined ? [] : [(committedAt - begin.ts) / 1000];
  });
}
