import { ScoringError, type MatchFormat, type MatchState, type ShootOffArrow, type Side } from '../core';
import { matchState } from '../core/matches';
import type { MatchDto, MatchEndArgs, MatchEndSignArgs, MatchShootOffArgs } from '../contract/matches';
import type { OutboxRow } from './db';

/** One end of the match card as the judge's phone shows it: the server's copy or this phone's own change. */
export type CardEnd = {
  a: MatchDto['ends'][number]['a'];
  b: MatchDto['ends'][number]['b'];
  waiting: boolean;
  /** The judge's signature on this end: at the server, waiting on this phone, or none. */
  signature: 'server' | 'waiting' | null;
};

export type MatchCardView = {
  ends: CardEnd[];
  shootOff: Partial<Record<Side, ShootOffArrow>>;
  shootOffWaiting: boolean;
  /** The core's reading of the card with this phone's waiting changes laid over the server's. */
  state: MatchState | null;
  /** The core refused the card as laid over (a waiting change the server will refuse too). */
  problem: string | null;
  signed: 'server' | 'waiting' | null;
};

/** This phone's changes to one match, oldest first; rejected rows are never laid over. */
export const matchRowsOf = (rows: readonly OutboxRow[], matchId: number) =>
  rows
    .filter((r) => r.kind.startsWith('match.') && 'matchId' in r.args && r.args.matchId === matchId)
    .sort((x, y) => x.seq - y.seq);

/**
 * The match card on the judge's phone: pending outbox rows laid over the server's copy (like the
 * pad's ends), so what is on screen is what is stored, offline too. Read by the core's matchState.
 */
export function matchCard(match: MatchDto, format: MatchFormat, rows: readonly OutboxRow[]): MatchCardView {
  const ends: CardEnd[] = match.ends.map((e) => ({
    a: e.a,
    b: e.b,
    waiting: false,
    signature: e.signed ? 'server' : null,
  }));
  const shootOff: Partial<Record<Side, ShootOffArrow>> = { ...match.shootOff };
  let shootOffWaiting = false;
  let signed: MatchCardView['signed'] = match.signedAt ? 'server' : null;
  const mine = matchRowsOf(rows, match.id);
  // This phone's last judge's change to each end: a delivered signature followed by a correction is gone.
  const lastOnEnd = new Map<number, OutboxRow>();
  for (const row of mine)
    if ((row.kind === 'match.end' || row.kind === 'match.endSign') && 'endIndex' in row.args)
      lastOnEnd.set(row.args.endIndex, row);
  for (const row of mine) {
    // A delivered change counts until the server's copy shows it: the copy may be from before it
    // arrived (it is asked for again once the change is delivered).
    const pending = row.status === 'pending';
    if (!pending && row.status !== 'applied') continue;
    if (row.kind === 'match.end') {
      const args = row.args as MatchEndArgs;
      // The judge's end replaces the end, signature and all (a correction waits for a new one).
      if (pending || args.endIndex >= match.ends.length)
        ends[args.endIndex] = { a: args.a, b: args.b, waiting: pending, signature: null };
    } else if (row.kind === 'match.endSign') {
      const { endIndex } = row.args as MatchEndSignArgs;
      const end = ends[endIndex];
      if (end && !end.signature && (pending || lastOnEnd.get(endIndex) === row))
        end.signature = pending ? 'waiting' : 'server';
    } else if (row.kind === 'match.shootoff') {
      if (!pending && match.shootOff.a && match.shootOff.b) continue;
      const args = row.args as MatchShootOffArgs;
      shootOff.a = args.a;
      shootOff.b = args.b;
      shootOffWaiting = pending;
    } else if (row.kind === 'match.sign' && !signed) signed = pending ? 'waiting' : 'server';
  }
  const filled = ends.filter(Boolean);
  let state: MatchState | null = null;
  let problem: string | null = null;
  try {
    state = matchState(format, { ends: filled, shootOff });
  } catch (error) {
    if (!(error instanceof ScoringError)) throw error;
    problem = error.message;
  }
  return { ends: filled, shootOff, shootOffWaiting, state, problem, signed };
}
