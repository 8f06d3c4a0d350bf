import type { LocalDb, OutboxRow } from './db';

/** What one waiting change is, in the words of the person who made it. */
function describe(row: OutboxRow, nameOf: (sessionId: number, entryId: number) => string): string {
  if ('matchId' in row.args) {
    const match = `match ${row.args.matchId}`;
    if ('endIndex' in row.args) return `End ${row.args.endIndex + 1} of ${match}`;
    return row.kind === 'match.sign' ? `Your signature on ${match}` : `The shoot-off arrows of ${match}`;
  }
  // Practice changes are about no archer of an event: one line for the whole log.
  if (!('entryId' in row.args)) return 'Your practice log';
  const name = nameOf(row.args.sessionId, row.args.entryId);
  if (row.kind === 'card.sign') return `Your signature on ${name}'s card`;
  if ('arrowIndex' in row.args) return `Your shoot-off arrow ${row.args.arrowIndex + 1} of ${name}`;
  const end = 'endIndex' in row.args ? `end ${row.args.endIndex + 1} of ${name}` : name;
  if (row.kind === 'end.settle') return `Your call on ${end}`;
  if (row.kind === 'end.rule') return `Your ruling on ${end}`;
  if (row.kind === 'end.sign') return `Your signature on ${end}`;
  return end.charAt(0).toUpperCase() + end.slice(1);
}

/** An archer's name from elsewhere on the phone (a card looked at), when no joined target has it. */
export type NameLookup = (sessionId: number, entryId: number) => string | undefined;

/**
 * A person's changes the server has not accepted yet, one line per end or signature (many taps
 * on one end are one line), in the order they were made.
 */
export async function waitingInWords(
  db: LocalDb,
  userId: number,
  otherNames: NameLookup = () => undefined,
): Promise<string[]> {
  const [rows, targets] = await db.transaction('r', db.outbox, db.targets, () =>
    Promise.all([
      db.outbox
        .where('status')
        .equals('pending')
        .filter((r) => r.userId === userId)
        .sortBy('seq'),
      db.targets.where('userId').equals(userId).toArray(),
    ]),
  );
  const nameOf = (sessionId: number, entryId: number) =>
    targets
      .filter((t) => t.session.id === sessionId)
      .flatMap((t) => t.archers)
      .find((a) => a.entryId === entryId)?.name ??
    otherNames(sessionId, entryId) ??
    'an archer';
  return [...new Set(rows.map((r) => describe(r, nameOf)))];
}
