import type { MatchDto } from '../contract/matches';
import type { LocalDb, OutboxRow } from './db';

/** What one waiting match change is: the match named by its archers ("Match: A v B, end 2"). */
function describeMatch(row: OutboxRow, match: string): string {
  if (row.kind === 'match.endSign' && 'endIndex' in row.args)
    return `Your signature on end ${row.args.endIndex + 1} of the match ${match}`;
  if ('endIndex' in row.args) return `Match: ${match}, end ${row.args.endIndex + 1}`;
  if (row.kind === 'match.sign') return `Your signature on the match ${match}`;
  if (row.kind === 'match.countersign') return `Your countersignature on the match ${match}`;
  if (row.kind === 'match.firstShooter') return `Match: ${match}, who shoots first`;
  return `Match: ${match}, shoot-off arrows`;
}

/** What one waiting change is, in the words of the person who made it. */
function describe(
  row: OutboxRow,
  nameOf: (sessionId: number, entryId: number) => string,
  matchOf: (matchId: number) => string,
): string {
  if ('matchId' in row.args) return describeMatch(row, matchOf(row.args.matchId));
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
/** A match's archers ("A v B") from elsewhere on the phone (a bracket looked at), when no joined match has them. */
export type MatchLookup = (matchId: number) => string | undefined;

/** A match as its archers, "A v B": both lines' names, or the one known. */
export function matchInWords(match: MatchDto): string {
  const line = (side: 'a' | 'b') =>
    match.sides[side]?.archers.map((a) => a.name).join(', ') ?? 'to be decided';
  return `${line('a')} v ${line('b')}`;
}

/**
 * A person's changes the server has not accepted yet, one line per end or signature (many taps
 * on one end are one line), in the order they were made.
 */
export async function waitingInWords(
  db: LocalDb,
  userId: number,
  otherNames: NameLookup = () => undefined,
  otherMatches: MatchLookup = () => undefined,
): Promise<string[]> {
  const [rows, targets, matches] = await db.transaction('r', db.outbox, db.targets, db.matchPads, () =>
    Promise.all([
      db.outbox
        .where('status')
        .equals('pending')
        .filter((r) => r.userId === userId)
        .sortBy('seq'),
      db.targets.where('userId').equals(userId).toArray(),
      db.matchPads.where('userId').equals(userId).toArray(),
    ]),
  );
  const matchOf = (matchId: number) => {
    const joined = matches.find((m) => m.matchId === matchId);
    return (joined && matchInWords(joined.match)) ?? otherMatches(matchId) ?? `number ${matchId}`;
  };
  const nameOf = (sessionId: number, entryId: number) =>
    targets
      .filter((t) => t.session.id === sessionId)
      .flatMap((t) => t.archers)
      .find((a) => a.entryId === entryId)?.name ??
    otherNames(sessionId, entryId) ??
    'an archer';
  return [...new Set(rows.map((r) => describe(r, nameOf, matchOf)))];
}
