import { randomUUID } from 'node:crypto';
import type { Db } from '../db';
import { nowIso } from '../time';
import { randomToken, sha256Hex } from './tokens';

/** A phone stays signed in for a tournament weekend and more; every use rotates the token. */
const REFRESH_TTL_MS = 30 * 24 * 60 * 60 * 1000;
/**
 * Two requests from the same phone can race (two tabs, a retry); a token rotated moments ago
 * is still honoured once within this window instead of being treated as theft.
 */
const RACE_GRACE_MS = 10_000;

export async function issueRefreshToken(db: Db, userId: number, userAgent: string, familyId = randomUUID()) {
  const token = randomToken();
  const now = Date.now();
  await db('refresh_tokens').insert({
    user_id: userId,
    token_hash: sha256Hex(token),
    family_id: familyId,
    expires_at: new Date(now + REFRESH_TTL_MS).toISOString(),
    created_at: new Date(now).toISOString(),
    user_agent: userAgent.slice(0, 200),
  });
  return token;
}

export type RotateResult =
  | { ok: true; userId: number; token: string }
  | { ok: false; reason: 'unknown' | 'expired' | 'revoked' | 'reused' };

/**
 * Exchanges a refresh token for a new one. Reuse of an already rotated token (outside the short
 * race window) means it was copied: the whole family is revoked and the person signs in again.
 */
export async function rotateRefreshToken(db: Db, token: string, userAgent: string): Promise<RotateResult> {
  const row = await db('refresh_tokens')
    .where({ token_hash: sha256Hex(token) })
    .first();
  if (!row) return { ok: false, reason: 'unknown' };
  if (row.revoked_at) return { ok: false, reason: 'revoked' };
  if (Date.parse(row.expires_at) <= Date.now()) return { ok: false, reason: 'expired' };
  if (row.rotated_at) {
    if (Date.now() - Date.parse(row.rotated_at) > RACE_GRACE_MS) {
      await db('refresh_tokens')
        .where({ family_id: row.family_id })
        .whereNull('revoked_at')
        .update({ revoked_at: nowIso() });
      return { ok: false, reason: 'reused' };
    }
  } else {
    await db('refresh_tokens').where({ id: row.id }).update({ rotated_at: nowIso() });
  }
  const next = await issueRefreshToken(db, row.user_id, userAgent, row.family_id);
  return { ok: true, userId: row.user_id, token: next };
}

export async function revokeRefreshFamily(db: Db, token: string): Promise<void> {
  const row = await db('refresh_tokens')
    .where({ token_hash: sha256Hex(token) })
    .first();
  if (row)
    await db('refresh_tokens')
      .where({ family_id: row.family_id })
      .whereNull('revoked_at')
      .update({ revoked_at: nowIso() });
}
