import { describe, expect, it } from 'vitest';
import { SignJWT } from 'jose';
import { signAccessToken, verifyAccessToken } from '../../server/auth/tokens';

const secret = new TextEncoder().encode('a test secret that is long enough for HS256 use');

/** A token exactly like the server's, with one claim changed. */
async function tokenWith(claims: { iss?: string; aud?: string; sub?: string }) {
  const now = Math.floor(Date.now() / 1000);
  return new SignJWT({})
    .setProtectedHeader({ alg: 'HS256', typ: 'JWT' })
    .setSubject(claims.sub ?? '7')
    .setIssuer(claims.iss ?? 'ringcall')
    .setAudience(claims.aud ?? 'ringcall-api')
    .setIssuedAt(now)
    .setExpirationTime(now + 600)
    .sign(secret);
}

describe('access token claims', () => {
  it('accepts the server’s own token', async () => {
    const { token } = await signAccessToken(secret, 7);
    await expect(verifyAccessToken(secret, token)).resolves.toMatchObject({ userId: 7 });
    await expect(verifyAccessToken(secret, await tokenWith({}))).resolves.toMatchObject({ userId: 7 });
  });

  // A token signed with the same secret for another purpose (another audience) must not open the API.
  it('refuses a token made for another audience', async () => {
    await expect(verifyAccessToken(secret, await tokenWith({ aud: 'ringcall-mail' }))).rejects.toThrow();
  });

  it('refuses a token from another issuer', async () => {
    await expect(verifyAccessToken(secret, await tokenWith({ iss: 'someone-else' }))).rejects.toThrow();
  });

  it('refuses a token whose subject is not a person’s id', async () => {
    await expect(verifyAccessToken(secret, await tokenWith({ sub: 'admin' }))).rejects.toThrow();
    await expect(verifyAccessToken(secret, await tokenWith({ sub: '0' }))).rejects.toThrow();
  });
});
