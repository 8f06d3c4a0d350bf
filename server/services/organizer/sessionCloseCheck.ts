import { endView, endsOfRound, type RoundDefinition } from '../../../src/core';
import type { CloseCheck, CloseCheckTarget } from '../../../src/contract/lateValues';
import type { Db } from '../../db';
import { loadEndRecords } from '../judging/endRecords';
import type { SessionRow } from './sessions';

/**
 * What the server does not hold yet for each target of a session, asked before it is closed:
 * ends not entered whole by both writers (their values may still be on a phone), ends not agreed
 * (mismatch, dispute, a mark for a judge), decided ends not signed, and late values waiting.
 * Only targets with something missing are listed.
 */
export async function sessionCloseCheck(db: Db, session: SessionRow): Promise<CloseCheck> {
  const archers = (await db('target_assignments as ta')
    .join('entries as e', 'e.id', 'ta.entry_id')
    .join('session_divisions as sd', (j) =>
      j.on('sd.session_id', 'ta.session_id').andOn('sd.division_id', 'e.division_id'),
    )
    .where('ta.session_id', session.id)
    .select('ta.entry_id', 'ta.target_number', 'sd.round_json')) as {
    entry_id: number;
    target_number: number;
    round_json: string;
  }[];
  const stored = await loadEndRecords(
    db,
    session.id,
    archers.map((a) => a.entry_id),
  );
  const late = (await db('late_values')
    .where({ session_id: session.id, status: 'waiting' })
    .groupBy('target_number')
    .select('target_number', db.raw('count(*) as n'))) as { target_number: number; n: number }[];

  const targets = new Map<number, CloseCheckTarget>();
  const of = (targetNumber: number) => {
    let t = targets.get(targetNumber);
    if (!t) {
      t = { targetNumber, notEntered: 0, notAgreed: 0, notSigned: 0, lateValues: 0 };
      targets.set(targetNumber, t);
    }
    return t;
  };
  let totalEnds = 0;
  for (const archer of archers) {
    for (const end of endsOfRound(JSON.parse(archer.round_json) as RoundDefinition)) {
      totalEnds += 1;
      const view = endView(stored.facts(archer.entry_id, end.index));
      if (view.state === 'signed') continue;
      const t = of(archer.target_number);
      const whole = (arrows: readonly unknown[] | undefined) => (arrows?.length ?? 0) === end.arrows;
      if (view.state === 'open' || view.state === 'entered' || (view.arrows && !whole(view.arrows)))
        t.notEntered += 1;
      else if (!view.canSign) t.notAgreed += 1;
      else t.notSigned += 1;
    }
  }
  for (const l of late) of(l.target_number).lateValues = Number(l.n);
  return {
    sessionId: session.id,
    totalEnds,
    targets: [...targets.values()]
      .filter((t) => t.notEntered + t.notAgreed + t.notSigned + t.lateValues > 0)
      .sort((a, b) => a.targetNumber - b.targetNumber),
  };
}
