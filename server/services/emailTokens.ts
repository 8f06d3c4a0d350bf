import type { EventRole } from '../../src/contract/auth';
import type { Db } from '../db';
import { randomToken, sha256Hex } from '../auth/tokens';
import { nowIso } from '../time';

const TTL_MS = { verify: 7 * 24 * 3600 * 1000, invite: 30 * 24 * 3600 * 1000 } as const;

export type EmailTokenPurpose = keyof typeof TTL_MS;

export type EmailTokenRow = {
  id: number;
  purpose: EmailTokenPurpose;
  email: string;
  event_id: number | null;
  role: EventRole | null;
};

/** Creates a single-use link token; only its hash is stored. */
export async function createEmailToken(
  db: Db,
  input: {
    purpose: EmailTokenPurpose;
    email: string;
    eventId?: number;
    role?: EventRole;
    createdBy?: number;
  },
): Promise<string> {
  const token = randomToken();
  await db('email_tokens').insert({
    token_hash: sha256Hex(token),
    purpose: input.purpose,
    email: input.email,
    event_id: input.eventId ?? null,
    role: input.role ?? null,
    created_by: input.createdBy ?? null,
    expires_at: new Date(Date.now() + TTL_MS[input.purpose]).toISOString(),
    created_at: nowIso(),
  });
  return token;
}

/** Finds an unused, unexpired token of the given purpose. */
export async function findEmailToken(
  db: Db,
  token: string,
  purpose: EmailTokenPurpose,
): Promise<EmailTokenRow | undefined> {
  const row = await db('email_tokens')
    .where({ token_hash: sha256Hex(token), purpose })
    .whereNull('used_at')
    .where('expires_at', '>', nowIso())
    .first();
  return row as EmailTokenRow | undefined;
}

export async function markEmailTokenUsed(db: Db, id: number): Promise<void> {
  await db('email_tokens').where({ id }).update({ used_at: nowIso() });
}
