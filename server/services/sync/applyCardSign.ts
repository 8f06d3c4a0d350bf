import type { CardSignArgs } from '../../../src/contract/judging';
import type { SigningKeys } from '../../signing/serverKeys';
import { signClaim } from '../../signing/signatures';
import { listInWords } from '../judging/endWords';
import { cardContentHash, cardTotalsOf, type CardFacts } from '../signing/cardContent';
import type { Author } from './effects';
import type { FieldBatch } from './fieldBatch';
import type { Placement } from './fieldPlacements';
import { findPlacement, refuse, roundOf } from './fieldRules';

const ROLE_WORDS = { archer: 'the archer', scorer: 'the scorer' } as const;

/** Who may sign a card in a role: the entry's own account as archer, a writer of the target as scorer. */
function checkSigner(placement: Placement, role: CardSignArgs['role'], userId: number): void {
  const name = placement.archerName;
  if (role === 'archer') {
    if (placement.archerUserId !== userId)
      refuse(
        `Only ${name} can countersign this card as the archer, signed in with the e-mail address on the entry list.`,
      );
    return;
  }
  const task = placement.tasks.get(userId);
  if (task !== 'writer1' && task !== 'writer2')
    refuse(
      `Only writer 1 or writer 2 of target ${placement.targetNumber} can sign ${name}'s card as scorer.`,
    );
  if (placement.archerUserId === userId)
    refuse('You cannot sign your own card as scorer; the other writer signs it.');
}

/** Ends (1-based) in words, at most eight of them. */
function endsInWords(indexes: number[]): string {
  const shown = indexes.slice(0, 8).map((i) => String(i + 1));
  if (indexes.length > 8) shown.push(`${indexes.length - 8} more`);
  return `${indexes.length === 1 ? 'end' : 'ends'} ${listInWords(shown)}`;
}

/**
 * The archer (or the writer who kept the card, as scorer) signs the whole card once a judge has
 * signed every end of it, naming the total they saw. With both signatures the card is final.
 * The session may be closed: cards are signed at the end of the round.
 */
export async function applyCardSign(
  batch: FieldBatch,
  args: CardSignArgs,
  by: Author,
  keys: SigningKeys,
): Promise<void> {
  const placement = findPlacement(batch, args);
  const name = placement.archerName;
  checkSigner(placement, args.role, by.userId);
  const round = roundOf(placement);
  const current = batch.cardSignature(args.sessionId, args.entryId, args.role);
  if (current) refuse(`${name}'s card is already signed by ${ROLE_WORDS[args.role]} (${current.dto.name}).`);

  const ends: CardFacts['ends'] = placement.ends.map((end) => {
    const signed = batch.endSignature(args.sessionId, args.entryId, end.index);
    return signed && { arrows: signed.dto.arrows, hash: signed.row.content_hash };
  });
  const unsigned = ends.flatMap((e, i) => (e ? [] : [i]));
  if (unsigned.length > 0)
    refuse(
      `${unsigned.length} of the ${ends.length} ends on ${name}'s card ${unsigned.length === 1 ? 'is' : 'are'} not signed yet (${endsInWords(unsigned)}). A judge signs each end first.`,
    );
  const totals = cardTotalsOf(round, ends);
  if (args.total !== totals.total)
    refuse(
      `${name}'s card adds up to ${totals.total}, not ${args.total}. Look at the card again, then sign.`,
    );

  const card: CardFacts = {
    eventId: placement.session.eventId,
    sessionId: args.sessionId,
    entryId: args.entryId,
    archerName: name,
    divisionName: placement.divisionName,
    round,
    ends,
  };
  const hash = cardContentHash(card);
  const jws = await signClaim(keys, {
    typ: 'ringcall-card',
    hash,
    signer: [{ userId: by.userId, name: batch.nameOf(by.userId), role: args.role }],
    at: by.at,
    ref: { event: card.eventId, session: card.sessionId, entry: card.entryId },
    totals,
  });
  batch.putCardSignature(
    placement,
    {
      session_id: args.sessionId,
      entry_id: args.entryId,
      role: args.role,
      user_id: by.userId,
      content_hash: hash,
      jws,
      signed_at: by.at,
      mutation_id: by.mutationId,
      superseded_at: null,
      superseded_by_ruling: null,
    },
    batch.nameOf(by.userId),
  );
}
