import type { Side } from '../core';
import type { MatchDto, MatchFirstShooterArgs } from '../contract/matches';
import type { OutboxRow } from './db';

/**
 * Who shoots first in an alternating match as this phone shows it: its latest choice not yet at
 * the server; else the server's; else its delivered choice the server's copy does not show yet
 * (the copy may be from before it arrived). A refused choice is never laid over.
 */
export function chosenFirstShooter(
  match: MatchDto,
  rows: readonly OutboxRow[],
): { side: Side; waiting: boolean } | null {
  const choices = rows
    .filter((r) => r.kind === 'match.firstShooter' && (r.args as MatchFirstShooterArgs).matchId === match.id)
    .sort((x, y) => x.seq - y.seq);
  const last = (status: OutboxRow['status']) =>
    (choices.filter((r) => r.status === status).at(-1)?.args as MatchFirstShooterArgs | undefined)?.side;
  const pending = last('pending');
  if (pending) return { side: pending, waiting: true };
  const side = match.firstShooter ?? last('applied');
  return side ? { side, waiting: false } : null;
}
