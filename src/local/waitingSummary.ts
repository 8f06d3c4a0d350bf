import type { OutboxRow } from './db';

/** What waits to sync, counted as a person thinks of it, with the exact number of changes. */
export type WaitingSummary = {
  changes: number;
  ends: number;
  signatures: number;
  shootOffArrows: number;
  /** Practice sessions with a setup or deletion waiting and no end of theirs waiting. */
  practiceSessions: number;
};

/**
 * Counts waiting changes as ends and signatures: every tap of a writer is a change, but the
 * person entered one end per archer, so "24 waiting" for one end of four archers reads as lost work.
 */
export function summarizeWaiting(rows: readonly Pick<OutboxRow, 'kind' | 'endKey'>[]): WaitingSummary {
  const ends = new Set<string>();
  let signatures = 0;
  // A re-recorded shoot-off arrow replaces the earlier one: count arrows, not changes.
  const shootOffArrows = new Set<string>();
  // A practice session's setup or deletion is no end of its own: the session counts only when
  // none of its ends wait (a session just started, or deleted). Keys: practice:<session>[:<end>].
  const practiceSessions = new Set<string>();
  for (const row of rows) {
    if (['end.sign', 'card.sign', 'match.sign', 'match.endSign'].includes(row.kind)) signatures += 1;
    else if (row.kind === 'shootoff.record' || row.kind === 'match.shootoff') shootOffArrows.add(row.endKey);
    else if (row.kind === 'practice.session' || row.kind === 'practice.delete')
      practiceSessions.add(row.endKey);
    else ends.add(row.endKey);
  }
  for (const end of ends)
    if (end.startsWith('practice:')) practiceSessions.delete(end.split(':', 2).join(':'));
  return {
    changes: rows.length,
    ends: ends.size,
    signatures,
    shootOffArrows: shootOffArrows.size,
    practiceSessions: practiceSessions.size,
  };
}

const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** "4 ends", "1 end and 2 signatures", for the badge and the sync line. */
export function waitingWords(summary: WaitingSummary): string {
  const parts = [
    summary.ends > 0 ? count(summary.ends, 'end', 'ends') : '',
    summary.signatures > 0 ? count(summary.signatures, 'signature', 'signatures') : '',
    summary.shootOffArrows > 0 ? count(summary.shootOffArrows, 'shoot-off arrow', 'shoot-off arrows') : '',
    summary.practiceSessions > 0
      ? count(summary.practiceSessions, 'practice session', 'practice sessions')
      : '',
  ].filter(Boolean);
  return parts.length > 1 ? `${parts.slice(0, -1).join(', ')} and ${parts.at(-1)}` : (parts[0] ?? '');
}

/** The exact count, for the details: "24 changes". */
export const changesWords = (summary: WaitingSummary) => count(summary.changes, 'change', 'changes');
