import type { EventRole } from '../../src/contract/auth';
import type { Db } from '../db';
import { randomToken, sha256Hex } from '../auth/tokens';
import { nowIso } from '../time';

/** A password link is short-lived: it is a key to the account. */
const TTL_MS = { verify: 7 * 24 * 3600 * 1000, invite: 30 * 24 * 3600 * 1000, reset: 3600 * 1000 } as const;

export type EmailTokenPurpose = keyof typeof TTL_MS;

export type EmailTokenRow = {
  id: number;
  purpose: EmailTokenPurpose;
  email: string;
  event_id: number | null;
  role: EventRole | null;
  /** A password link sent because someone signed up under an unconfirmed account: the name they typed. */
  display_name: string | null;
  used_at: string | null;
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
    displayName?: string;
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
    display_name: input.displayName ?? null,
    expires_at: new Date(Date.now() + TTL_MS[input.purpose]).toISOString(),
    created_at: nowIso(),
  });
  return token;
}

/**
 * Finds a token of the given purpose: only an unused, unexpired one, unless `evenUsed` (an
 * invitation already taken up is answered again).
 */
export async function findEmailToken(
  db: Db,
  token: string,
  purpose: EmailTokenPurpose,
  { evenUsed = false } = {},
): Promise<EmailTokenRow | undefined> {
  const query = db('email_tokens').where({ token_hash: sha256Hex(token), purpose });
  if (!evenUsed) query.whereNull('used_at').where('expires_at', '>', nowIso());
  return (await query.first()) as EmailTokenRow | undefined;
}

export async function markEmailTokenUsed(db: Db, id: number): Promise<void> {
  await db('email_tokens').where({ id }).update({ used_at: nowIso() });
}

/** Marks the token used unless it already was; false when another request took it first. */
export async function useEmailTokenOnce(db: Db, id: number): Promise<boolean> {
  return (await db('email_tokens').where({ id }).whereNull('used_at').update({ used_at: nowIso() })) === 1;
}

/** Every unused link of this purpose to the address stops working (one password reset ends the others). */
export async function markAllUsed(db: Db, email: string, purpose: EmailTokenPurpose): Promise<void> {
  await db('email_tokens').where({ email, purpose }).whereNull('used_at').update({ used_at: nowIso() });
}
