import type { CardSignArgs } from '../../../src/contract/judging';
import type { SigningKeys } from '../signing/serverKeys';
import { signClaim } from '../signing/signatures';
import { listInWords } from '../judging/endWords';
import { canonicalJson } from '../../../src/core';
import { contentHash } from '../signing/contentHash';
import { nowIso } from '../../time';
import { cardContent, cardTotalsOf, paperWords, type CardFacts } from '../signing/cardContent';
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

/**
 * A judge records an archer's countersignature made on the paper card, for an archer without an
 * account (who cannot sign on a phone), with a photo of that paper card from the same event.
 * Returns the photo's SHA-256, which the signature covers.
 */
function checkPaper(
  batch: FieldBatch,
  placement: Placement,
  args: CardSignArgs & { paper: { photoId: number } },
  userId: number,
): string {
  const name = placement.archerName;
  const eventId = placement.session.eventId;
  if (args.role !== 'archer') refuse('Only the archer’s countersignature can be recorded from paper.');
  if (!batch.isJudge(userId, eventId))
    refuse('Only a judge of the event can record a countersignature made on paper.');
  if (placement.archerUserId !== null)
    refuse(`${name} has an account and countersigns on their own phone, not on paper.`);
  const sha256 = batch.photoSha256(args.paper.photoId);
  if (sha256 === undefined || batch.photoEvent(args.paper.photoId) !== eventId)
    refuse('The photo of the paper card is not one of this event’s photos. Take the photo again.');
  return sha256;
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
 * The session may be closed: cards are signed at the end of the round. A judge may record the
 * archer's countersignature made on paper (`args.paper`) for an archer without an account.
 */
export async function applyCardSign(
  batch: FieldBatch,
  args: CardSignArgs,
  by: Author,
  keys: SigningKeys,
): Promise<void> {
  const placement = findPlacement(batch, args);
  const name = placement.archerName;
  const paperPhoto = args.paper
    ? checkPaper(batch, placement, { ...args, paper: args.paper }, by.userId)
    : undefined;
  if (!args.paper) checkSigner(placement, args.role, by.userId);
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

  const { session } = placement;
  const card: CardFacts = {
    eventId: session.eventId,
    sessionId: args.sessionId,
    entryId: args.entryId,
    event: session.event,
    session: { name: session.name, startsAt: session.startsAt },
    archer: { name, club: placement.club, division: placement.divisionName },
    place: { targetNumber: placement.targetNumber, position: placement.position },
    round,
    ends,
  };
  const signer = batch.nameOf(by.userId);
  const paper = paperPhoto === undefined ? undefined : { recordedBy: signer, photoSha256: paperPhoto };
  const content = cardContent(card, paper);
  const hash = contentHash(content);
  // The server's clock is the signing time; the phone's is kept beside it.
  const signedAt = nowIso();
  const jws = await signClaim(keys, {
    typ: 'ringcall-card',
    hash,
    signer: [{ userId: by.userId, name: paper ? name : signer, role: args.role }],
    at: signedAt,
    phoneAt: by.at,
    ...(paper ? { countersigned: paperWords(signer) } : {}),
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
      content_json: canonicalJson(content),
      jws,
      signed_at: signedAt,
      phone_at: by.at,
      on_paper: !!paper,
      photo_id: args.paper?.photoId ?? null,
      mutation_id: by.mutationId,
      superseded_at: null,
      superseded_by_ruling: null,
    },
    signer,
  );
}
