import {
  cardTotals,
  endView,
  endsOfRound,
  roundMaxScore,
  rulingSteps,
  type RoundDefinition,
} from '../../../src/core';
import type { Position } from '../../../src/contract/events';
import type { CardState, CardView, SessionCardItem, SessionCards } from '../../../src/contract/judging';
import type { Db } from '../../db';
import type { SessionRow } from '../organizer/sessions';
import { isFinal, type CardData, type cardRelation } from './cardData';
import { endFactsOf, loadEndRecords } from './endRecords';

type Relation = Awaited<ReturnType<typeof cardRelation>>;

const cardState = (archer: boolean, scorer: boolean): CardState =>
  archer && scorer ? 'final' : archer || scorer ? 'countersigned' : 'running';

/** An archer's card as the archer, a writer of the target or staff see it. */
export function cardView(card: CardData, relation: Relation): CardView {
  const totals = cardTotals(
    card.round,
    card.ends.map((e) => e.view.arrows),
  );
  const signedEnds = card.ends.filter((e) => e.stored.signature).length;
  const allSigned = signedEnds === card.ends.length;

  // The role the requester could sign in: their own card as archer, a card they kept as scorer.
  const writer = relation.task === 'writer1' || relation.task === 'writer2';
  const role: 'archer' | 'scorer' | null =
    relation.archer && !card.signatures.archer
      ? 'archer'
      : writer && !relation.archer && !card.signatures.scorer
        ? 'scorer'
        : null;
  const unsigned = card.ends.length - signedEnds;
  const countersignNote =
    role && !allSigned
      ? `A judge still has to sign ${unsigned} of the ${card.ends.length} ends before the card can be signed.`
      : undefined;

  const signatures = (['archer', 'scorer'] as const).flatMap((r) => {
    const s = card.signatures[r];
    return s
      ? [
          {
            role: r,
            name: s.name,
            at: s.signed_at,
            phoneAt: s.phone_at,
            ...(s.onPaper ? { onPaper: s.onPaper } : {}),
            jws: s.jws,
          },
        ]
      : [];
  });
  return {
    event: { id: card.event.id, name: card.event.name },
    session: { id: card.session.id, name: card.session.name, closed: card.session.closed },
    archer: {
      entryId: card.archer.entryId,
      name: card.archer.name,
      club: card.archer.club,
      division: card.archer.division,
      targetNumber: card.archer.targetNumber,
      position: card.archer.position,
    },
    round: { id: card.round.id, name: card.round.name, maxScore: roundMaxScore(card.round) },
    ends: card.ends.map((e, i) => {
      const tallied = totals.ends[i]!;
      const signature = e.stored.signature;
      return {
        endIndex: e.endIndex,
        distanceIndex: e.distanceIndex,
        state: e.view.state,
        arrows: tallied.values ?? null,
        total: tallied.total ?? null,
        runningTotal: tallied.runningTotal ?? null,
        ...(signature ? { signedBy: signature.signedByName, signedAt: signature.signedAt } : {}),
        ...(e.stored.transcribedBy ? { transcribedBy: e.stored.transcribedBy } : {}),
        rulings: rulingSteps(endFactsOf(e.stored), e.stored.rulings ?? []).map(({ ruling, before }) => ({
          judgedByName: ruling.judgedByName,
          judgedAt: ruling.judgedAt,
          reason: ruling.reason,
          photoId: ruling.photoId,
          arrows: ruling.arrows,
          before,
        })),
      };
    }),
    totals: { total: totals.total, tens: totals.tens, xs: totals.xs, hits: totals.hits },
    signedEnds,
    totalEnds: card.ends.length,
    signatures,
    state: cardState(!!card.signatures.archer, !!card.signatures.scorer),
    final: isFinal(card),
    canCountersign: allSigned ? role : null,
    canRecordPaperCountersign:
      relation.judge && allSigned && card.archer.userId === null && !card.signatures.archer,
    ...(countersignNote ? { countersignNote } : {}),
  };
}

/** Where every card of a session stands: for organizers and judges to see what is missing. */
export async function sessionCards(db: Db, session: SessionRow): Promise<SessionCards> {
  const archers = (await db('target_assignments as ta')
    .join('entries as e', 'e.id', 'ta.entry_id')
    .join('divisions as d', 'd.id', 'e.division_id')
    .join('session_divisions as sd', (j) =>
      j.on('sd.session_id', 'ta.session_id').andOn('sd.division_id', 'e.division_id'),
    )
    .where('ta.session_id', session.id)
    .orderBy([{ column: 'ta.target_number' }, { column: 'ta.position' }])
    .select(
      'ta.entry_id',
      'ta.target_number',
      'ta.position',
      'e.name',
      'e.user_id',
      'd.name as division',
      'sd.round_json',
    )) as {
    user_id: number | null;
    entry_id: number;
    target_number: number;
    position: Position;
    name: string;
    division: string;
    round_json: string;
  }[];
  const entryIds = archers.map((a) => a.entry_id);
  const stored = await loadEndRecords(db, session.id, entryIds);
  const signed = (await db('card_signatures')
    .where({ session_id: session.id })
    .whereIn('entry_id', entryIds)
    .whereNull('superseded_at')
    .select('entry_id', 'role')) as { entry_id: number; role: 'archer' | 'scorer' }[];
  const mailed = (await db('card_mailings')
    .where({ session_id: session.id, status: 'sent' })
    .whereIn('entry_id', entryIds)
    .groupBy('entry_id')
    .select('entry_id')
    .max({ at: 'at' })) as { entry_id: number; at: string }[];

  const cards: SessionCardItem[] = archers.map((a) => {
    const round = JSON.parse(a.round_json) as RoundDefinition;
    const ends = endsOfRound(round);
    const views = ends.map((end) => endView(stored.facts(a.entry_id, end.index)));
    const archerSigned = signed.some((s) => s.entry_id === a.entry_id && s.role === 'archer');
    const scorerSigned = signed.some((s) => s.entry_id === a.entry_id && s.role === 'scorer');
    const signedEnds = views.filter((v) => v.state === 'signed').length;
    return {
      entryId: a.entry_id,
      name: a.name,
      division: a.division,
      targetNumber: a.target_number,
      position: a.position,
      signedEnds,
      endsWithValues: views.filter((v) => v.arrows).length,
      totalEnds: ends.length,
      total: cardTotals(
        round,
        views.map((v) => v.arrows),
      ).total,
      archerSigned,
      scorerSigned,
      final: archerSigned && scorerSigned,
      mailedAt: mailed.find((m) => m.entry_id === a.entry_id)?.at ?? null,
      needsPaperCountersign: a.user_id === null && !archerSigned && signedEnds === ends.length,
    };
  });
  return { sessionId: session.id, cards };
}
