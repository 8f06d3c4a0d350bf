import { endsOfRound, type RoundDefinition } from '../../../src/core';
import type { CardToSign } from '../../../src/contract/myCards';
import type { Db } from '../../db';

type Row = Omit<CardToSign, 'signedEnds' | 'totalEnds' | 'ready'> & { roundJson: string };

/**
 * The cards a person must sign as scorer: those of the archers on every target where they keep
 * writer 1 or writer 2 (the same rule `card.sign` applies), never their own, until a scorer has
 * signed. Ready ones first: every end signed by a judge.
 */
export async function cardsToSign(db: Db, userId: number): Promise<CardToSign[]> {
  const rows = (await db('target_members as tm')
    .join('target_assignments as ta', (j) =>
      j.on('ta.session_id', 'tm.session_id').andOn('ta.target_number', 'tm.target_number'),
    )
    .join('entries as e', 'e.id', 'ta.entry_id')
    .join('event_sessions as s', 's.id', 'ta.session_id')
    .join('events as ev', 'ev.id', 's.event_id')
    .join('session_divisions as sd', (j) =>
      j.on('sd.session_id', 'ta.session_id').andOn('sd.division_id', 'e.division_id'),
    )
    .where('tm.user_id', userId)
    .whereIn('tm.task', ['writer1', 'writer2'])
    .where((q) => q.whereNull('e.user_id').orWhereNot('e.user_id', userId))
    .whereNotExists(function signedByScorer() {
      this.from('card_signatures as c')
        .where('c.session_id', db.ref('ta.session_id'))
        .where('c.entry_id', db.ref('ta.entry_id'))
        .where('c.role', 'scorer')
        .whereNull('c.superseded_at');
    })
    .orderBy([{ column: 's.starts_at' }, { column: 'ta.target_number' }, { column: 'ta.position' }])
    .select(
      'ta.entry_id as entryId',
      'ta.session_id as sessionId',
      'ev.name as eventName',
      's.name as sessionName',
      'e.name as archerName',
      'ta.target_number as targetNumber',
      'ta.position as position',
      'sd.round_json as roundJson',
    )) as Row[];
  if (rows.length === 0) return [];

  const signed = (await db('end_signatures')
    .whereIn('session_id', [...new Set(rows.map((r) => r.sessionId))])
    .whereIn(
      'entry_id',
      rows.map((r) => r.entryId),
    )
    .whereNull('superseded_at')
    .groupBy('session_id', 'entry_id')
    .select('session_id', 'entry_id')
    .countDistinct({ n: 'end_index' })) as { session_id: number; entry_id: number; n: number | string }[];
  const signedOf = (r: Row) =>
    Number(signed.find((s) => s.session_id === r.sessionId && s.entry_id === r.entryId)?.n ?? 0);

  const cards = rows.map(({ roundJson, ...card }): CardToSign => {
    const totalEnds = endsOfRound(JSON.parse(roundJson) as RoundDefinition).length;
    const signedEnds = signedOf({ roundJson, ...card });
    return { ...card, signedEnds, totalEnds, ready: signedEnds >= totalEnds };
  });
  return [...cards.filter((c) => c.ready), ...cards.filter((c) => !c.ready)];
}
