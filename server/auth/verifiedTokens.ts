import type { AccessClaims } from './tokens';

/** Far more than the phones of a large tournament, each holding one token at a time. */
const DEFAULT_SIZE = 10_000;

/**
 * Remembers the access tokens already verified until they expire, so a phone that syncs every
 * few seconds is not checked again each time (the HMAC check goes through WebCrypto, which
 * costs more than the rest of a small push's handling). A token is a fixed string signed with
 * the server's secret, so its first check stays true until its `exp`; tokens that fail are
 * never kept. The oldest entries go first when it is full.
 */
export function verifiedTokens(
  verify: (token: string) => Promise<AccessClaims>,
  size = DEFAULT_SIZE,
): (token: string) => Promise<AccessClaims> {
  const known = new Map<string, AccessClaims>();
  return async (token) => {
    const now = Math.floor(Date.now() / 1000);
    const hit = known.get(token);
    if (hit && now < hit.expiresAt) return hit;
    known.delete(token);
    const claims = await verify(token);
    known.set(token, claims);
    if (known.size > size) known.delete(known.keys().next().value!);
    return claims;
  };
}
