import { endView, sortEnd, type ArrowValue } from '../../../src/core';
import type { VerifyResult } from '../../../src/contract/judging';
import type { Db } from '../../db';
import { HttpError } from '../../http/httpError';
import type { SigningKeys } from './serverKeys';
import { NotOurSignature, verifyClaim, type SignedClaim } from './signatures';
import { readCard, type StoredCard } from '../judging/cardData';
import { endFactsOf } from '../judging/endRecords';
import { contentHash } from './contentHash';
import { cardChanges } from './cardChanges';
import { cardContent, paperWords, type CardContent } from './cardContent';
import { endContentHash } from './endContent';

/** Longer than any signature this server makes (a card's is well under 1,000 characters). */
const MAX_TOKEN = 4000;

const notOurs = (why: string): VerifyResult => ({
  signatureValid: false,
  message: `This is not a valid signature of this Ringcall server: ${why} It may be damaged or made elsewhere. Scan the QR code on the card again, or ask the event's judges.`,
});

const sameArrows = (a: readonly ArrowValue[] | undefined, b: readonly ArrowValue[] | undefined) => {
  if (!a || !b) return false;
  const x = sortEnd(a);
  const y = sortEnd(b);
  return x.length === y.length && x.every((v, i) => v === y[i]);
};

/**
 * Whether the records under a signed end still decide what its signature holds (writers, caller
 * or judge), and the signature row still hashes to what was signed. After signing, writers and
 * callers are refused and a ruling supersedes the signature, so any difference is a change made
 * outside Ringcall.
 */
function endIntact(card: StoredCard, endIndex: number): boolean {
  const end = card.ends[endIndex];
  const signature = end?.stored.signature;
  if (!end || !signature) return false;
  const ref = { eventId: card.event.id, sessionId: card.session.id, entryId: card.archer.entryId, endIndex };
  const fromRecords = endView(endFactsOf(end.stored, { signed: false }));
  return (
    endContentHash(ref, signature.arrows) === signature.contentHash &&
    sameArrows(fromRecords.arrows, signature.arrows)
  );
}

/** The card a signature's reference names, if this server still holds it in that event. */
async function findCard(db: Db, ref: SignedClaim['ref']): Promise<StoredCard | undefined> {
  if (ref.session === undefined || ref.entry === undefined) return undefined;
  try {
    const card = await readCard(db, ref.session, ref.entry);
    return card.event.id === ref.event ? card : undefined;
  } catch (error) {
    if (error instanceof HttpError) return undefined;
    throw error;
  }
}

/**
 * `GET /api/verify?sig=…`: checks a signature made by this server (ES256 with its own key only)
 * and recomputes the signed content's hash from the database as it is now. A token that is not
 * ours, or damaged, answers signatureValid false; a card or end that changed after signing
 * answers unchanged false.
 */
export async function verifySignature(db: Db, keys: SigningKeys, token: string): Promise<VerifyResult> {
  if (token.length > MAX_TOKEN) return notOurs('it is far longer than any signature Ringcall makes.');
  let claim: SignedClaim;
  try {
    claim = await verifyClaim(keys, token);
  } catch (error) {
    if (error instanceof NotOurSignature) return notOurs(error.message);
    throw error;
  }
  const kind: 'card' | 'end' = claim.typ === 'ringcall-card' ? 'card' : 'end';
  const { event, session, entry, end } = claim.ref;
  const claimed = claim.signer.map((s) => ({ name: s.name, role: s.role }));
  const base = {
    signatureValid: true as const,
    kind,
    signedAt: claim.at,
    ...(claim.totals ? { totals: claim.totals } : {}),
  };

  const card = await findCard(db, claim.ref);
  if (!card) {
    const stored = event === undefined ? undefined : await db('events').where({ id: event }).first('name');
    return {
      ...base,
      unchanged: false,
      superseded: false,
      message: `The signature is genuine, but the ${kind} it belongs to is no longer in this server's records. Ask the event's organizers.`,
      event: (stored?.name as string | undefined) ?? '',
      archer: '',
      division: '',
      signers: claimed,
    };
  }
  const about = { event: card.event.name, archer: card.archer.name, division: card.archer.division };

  if (kind === 'card') {
    const row = (await db('card_signatures')
      .where({ session_id: session, entry_id: entry, jws: token })
      .first('content_json', 'superseded_at', 'phone_at')) as
      { content_json: string | null; superseded_at: string | null; phone_at: string | null } | undefined;
    // The card as signed is stored with the signature: checked against the signed hash, then
    // compared with the card as it is now (which may have no target any more).
    const signed = row?.content_json ? (JSON.parse(row.content_json) as CardContent) : undefined;
    const storedIntact = !!signed && contentHash(signed) === claim.hash;
    const changes = signed && storedIntact ? cardChanges(signed, cardContent(card.facts)) : [];
    const everyEndIntact = card.ends.every((e) => endIntact(card, e.endIndex));
    const unchanged = storedIntact && changes.length === 0 && everyEndIntact;
    const superseded = !!row?.superseded_at;
    const cardSigners = (await db('card_signatures as c')
      .join('users as u', 'u.id', 'c.user_id')
      .where({ 'c.session_id': session, 'c.entry_id': entry, 'c.content_hash': claim.hash })
      .orderBy('c.id')
      .select('u.display_name as name', 'c.role', 'c.on_paper')) as {
      name: string;
      role: string;
      on_paper: number | boolean;
    }[];
    const judges = [...new Set(card.ends.flatMap((e) => e.stored.signature?.signedByName ?? []))];
    return {
      ...base,
      ...(signed && storedIntact
        ? { event: signed.event.name, archer: signed.archer.name, division: signed.archer.division }
        : about),
      unchanged,
      superseded,
      message:
        verdict('card', unchanged, superseded, !!row, storedIntact || !row) +
        (card.archer.targetNumber === null
          ? ' The archer has no target in this session any more; the card is checked as it was signed.'
          : ''),
      ...(changes.length > 0 ? { changes } : {}),
      ...(claim.phoneAt ? { phoneAt: claim.phoneAt } : {}),
      ...(claim.countersigned ? { countersigned: claim.countersigned } : {}),
      signers: [
        ...(cardSigners.length > 0
          ? cardSigners.map((s) =>
              s.on_paper
                ? { name: signed?.archer.name ?? card.archer.name, role: `${s.role}, ${paperWords(s.name)}` }
                : { name: s.name, role: s.role },
            )
          : claimed),
        ...judges.map((name) => ({ name, role: 'judge' })),
      ],
    };
  }

  const row = await db('end_signatures')
    .where({ session_id: session, entry_id: entry, end_index: end ?? -1, jws: token })
    .first();
  const current = end === undefined ? undefined : card.ends[end];
  const arrows = current?.view.arrows;
  const ref = {
    eventId: card.event.id,
    sessionId: card.session.id,
    entryId: card.archer.entryId,
    endIndex: end,
  };
  const unchanged =
    !!current &&
    !!arrows &&
    end !== undefined &&
    endContentHash({ ...ref, endIndex: end }, arrows) === claim.hash &&
    (!current.stored.signature || endIntact(card, end));
  const superseded = !!row?.superseded_at;
  return {
    ...base,
    ...about,
    unchanged,
    superseded,
    message: verdict(`end ${end === undefined ? '' : end + 1}`.trim(), unchanged, superseded, !!row),
    signers: claimed,
  };
}

function verdict(
  what: string,
  unchanged: boolean,
  superseded: boolean,
  onRecord: boolean,
  storedIntact = true,
): string {
  if (superseded)
    return `A judge corrected this ${what} after it was signed, so this signature no longer counts. Ask the event's judges for the corrected card.`;
  if (!onRecord)
    return `The signature is genuine, but this server no longer holds it for this ${what}. Ask the event's judges.`;
  if (!storedIntact)
    return `The signature is genuine, but this server's copy of what was signed has been altered. Ask the event's judges.`;
  return unchanged
    ? `This ${what} is unchanged since it was signed.`
    : `This ${what} was changed after it was signed. Ask the event's judges.`;
}
