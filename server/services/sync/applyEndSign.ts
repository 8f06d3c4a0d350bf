import { endView, sortEnd } from '../../../src/core';
import type { EndSignArgs } from '../../../src/contract/judging';
import type { SigningKeys } from '../signing/serverKeys';
import { signClaim } from '../signing/signatures';
import { whyNotSignable } from '../judging/endWords';
import { endContentHash, type EndRef } from '../signing/endContent';
import type { Author } from './effects';
import type { FieldBatch } from './fieldBatch';
import { checkArrows, checkJudgeEnd, refuse } from './fieldRules';

/**
 * A judge signs an end whose values are decided (agreed by the writers, settled by the caller or
 * ruled by a judge) with no incident waiting. `args.arrows` is what the judge looked at: if the
 * end changed in between, the signature is refused rather than put on other values. The server
 * signs the end's content hash, the judge and the time with its key (a compact JWS).
 */
export async function applyEndSign(
  batch: FieldBatch,
  args: EndSignArgs,
  by: Author,
  keys: SigningKeys,
): Promise<void> {
  const checked = checkJudgeEnd(batch, args, by.userId, 'sign an end');
  const { placement, endLabel } = checked;
  const current = batch.endSignature(args.sessionId, args.entryId, args.endIndex);
  if (current) refuse(`${endLabel} is already signed by ${current.dto.signedByName}.`);

  const facts = batch.endFacts(args.sessionId, args.entryId, args.endIndex);
  const view = endView(facts);
  if (!view.canSign || !view.arrows) refuse(whyNotSignable(endLabel, facts, view));
  checkArrows(checked, view.arrows, false); // an agreed end must also be whole to be signed
  const seen = sortEnd(args.arrows);
  if (seen.length !== view.arrows.length || seen.some((v, i) => v !== view.arrows![i]))
    refuse(`${endLabel} changed since you looked at it. Look at it again, then sign.`);

  const ref: EndRef = {
    eventId: placement.session.eventId,
    sessionId: args.sessionId,
    entryId: args.entryId,
    endIndex: args.endIndex,
  };
  const hash = endContentHash(ref, view.arrows);
  const jws = await signClaim(keys, {
    typ: 'ringcall-end',
    hash,
    signer: [{ userId: by.userId, name: batch.nameOf(by.userId), role: 'judge' }],
    at: by.at,
    ref: { event: ref.eventId, session: ref.sessionId, entry: ref.entryId, end: ref.endIndex },
  });
  batch.putEndSignature(
    placement,
    {
      session_id: args.sessionId,
      entry_id: args.entryId,
      end_index: args.endIndex,
      arrows_json: JSON.stringify(view.arrows),
      content_hash: hash,
      jws,
      signed_by: by.userId,
      signed_at: by.at,
      mutation_id: by.mutationId,
      superseded_at: null,
      superseded_by_ruling: null,
    },
    batch.nameOf(by.userId),
  );
}
