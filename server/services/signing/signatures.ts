import { CompactSign, compactVerify } from 'jose';
import type { SigningKeys } from './serverKeys';

export type SignerRole = 'judge' | 'archer' | 'scorer';

export type SignedClaim = {
  /** 'ringcall-end' for a judge's signature on an end, 'ringcall-card' for a signature on a card. */
  typ: 'ringcall-end' | 'ringcall-card';
  /** Hash of the canonical content (see contentHash and server/services/signing). */
  hash: string;
  /** Who signed, and when: `at` is the server's clock (cards) or the signing phone's (ends). */
  signer: { userId: number; name: string; role: SignerRole }[];
  at: string;
  /** The signing phone's own clock, kept beside the server's time (cards). */
  phoneAt?: string;
  /** "countersigned on paper, recorded by judge …" for a countersignature a judge recorded. */
  countersigned?: string;
  /** Where the content lives, so a verifier can recompute its hash. */
  ref: Record<string, number>;
  /** A card's totals as signed, so a verification page can show them even when the card changed. */
  totals?: { total: number; tens: number; xs: number; hits: number };
};

/** A compact JWS by the server's key over the claim: binds who, when and the content's hash. */
export async function signClaim(keys: SigningKeys, claim: SignedClaim): Promise<string> {
  return new CompactSign(new TextEncoder().encode(JSON.stringify(claim)))
    .setProtectedHeader({ alg: keys.alg, kid: keys.kid, typ: claim.typ })
    .sign(keys.privateKey);
}

/** A token that is not one of this server's signatures, or not a readable claim. */
export class NotOurSignature extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'NotOurSignature';
  }
}

const isClaim = (c: unknown): c is SignedClaim => {
  const x = c as SignedClaim;
  return (
    !!x &&
    typeof x === 'object' &&
    (x.typ === 'ringcall-end' || x.typ === 'ringcall-card') &&
    typeof x.hash === 'string' &&
    typeof x.at === 'string' &&
    Array.isArray(x.signer) &&
    !!x.ref &&
    typeof x.ref === 'object' &&
    Object.values(x.ref).every((v) => Number.isInteger(v))
  );
};

/**
 * Checks the server's signature (ES256 only: the algorithm is allow-listed, never taken from the
 * token) and returns the claim; throws NotOurSignature for anything else.
 */
export async function verifyClaim(keys: SigningKeys, jws: string): Promise<SignedClaim> {
  let verified: Awaited<ReturnType<typeof compactVerify>>;
  try {
    verified = await compactVerify(jws, keys.publicKey, { algorithms: [keys.alg] });
  } catch {
    throw new NotOurSignature('it does not match this server’s key.');
  }
  let claim: unknown;
  try {
    claim = JSON.parse(new TextDecoder().decode(verified.payload));
  } catch {
    throw new NotOurSignature('the signed content is not readable.');
  }
  if (!isClaim(claim) || verified.protectedHeader.typ !== claim.typ)
    throw new NotOurSignature('the signed content is not a Ringcall signature.');
  return claim;
}
