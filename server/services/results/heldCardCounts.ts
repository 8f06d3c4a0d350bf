import type { RoundDefinition } from '../../../src/core';
import type { Db } from '../../db';
import { loadEndRecords } from '../judging/endRecords';
import { countCard, type CardCounts } from './cardCounts';

/** A card the standings need: where the archer shoots now and the round of their division. */
export type WantedCard = {
  sessionId: number;
  entryId: number;
  targetNumber: number;
  roundJson: string;
  round: RoundDefinition;
};

type Held = { counts: CardCounts; targetNumber: number; roundJson: string };

export const cardKey = (sessionId: number, entryId: number) => `${sessionId}:${entryId}`;

/**
 * One event's card counts, kept between computations of its standings so that one signed end
 * costs the reading of one target's cards, not of every arrow of the event. What changed is read
 * from the change log: every write, settlement, ruling, signature, card signature and late-value
 * decision adds a row naming its session and target. A card is read again when its target has a
 * row newer than the last one read, when the archer moved to another target, or when the round
 * of their division changed. Refreshes run one after another, so a slower one never stores
 * counts older than the version a quicker one already recorded.
 */
export function heldCardCounts() {
  const held = new Map<string, Held>();
  let seenVersion = 0;
  let queue: Promise<unknown> = Promise.resolve();

  async function refresh(db: Db, eventId: number, wanted: WantedCard[]): Promise<Map<string, CardCounts>> {
    // The log is read before the cards: a change landing in between is read again next time.
    const changed = (await db('changes')
      .where({ event_id: eventId })
      .where('version', '>', seenVersion)
      .groupBy('session_id', 'target_number')
      .select('session_id', 'target_number')
      .max({ v: 'version' })) as { session_id: number; target_number: number; v: number }[];
    const dirty = new Set(changed.map((c) => `${c.session_id}:${c.target_number}`));
    const stale = wanted.filter((card) => {
      const h = held.get(cardKey(card.sessionId, card.entryId));
      return (
        !h ||
        h.targetNumber !== card.targetNumber ||
        h.roundJson !== card.roundJson ||
        dirty.has(`${card.sessionId}:${card.targetNumber}`)
      );
    });
    const bySession = new Map<number, WantedCard[]>();
    for (const card of stale) {
      const cards = bySession.get(card.sessionId) ?? [];
      cards.push(card);
      bySession.set(card.sessionId, cards);
    }
    for (const [sessionId, cards] of bySession) {
      const records = await loadEndRecords(
        db,
        sessionId,
        cards.map((c) => c.entryId),
      );
      for (const card of cards) {
        held.set(cardKey(sessionId, card.entryId), {
          counts: countCard(card.round, records, card.entryId),
          targetNumber: card.targetNumber,
          roundJson: card.roundJson,
        });
      }
    }
    seenVersion = Math.max(seenVersion, ...changed.map((c) => c.v));
    // Cards no longer wanted (an archer taken off the field) are dropped, so memory follows the field.
    const counts = new Map<string, CardCounts>();
    for (const card of wanted) {
      const key = cardKey(card.sessionId, card.entryId);
      counts.set(key, held.get(key)!.counts);
    }
    for (const key of held.keys()) if (!counts.has(key)) held.delete(key);
    return counts;
  }

  return {
    counts(db: Db, eventId: number, wanted: WantedCard[]): Promise<Map<string, CardCounts>> {
      const next = queue.then(() => refresh(db, eventId, wanted));
      queue = next.catch(() => undefined);
      return next;
    },
  };
}
export type HeldCardCounts = ReturnType<typeof heldCardCounts>;
