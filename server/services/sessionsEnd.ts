import type { Db } from '../db';
import { nowIso } from '../time';
import { noteSignInsEnded } from '../auth/signInsEnded';

/**
 * Ends every sign-in of the account at once: its refresh tokens are revoked, and raising
 * `session_version` makes the access tokens still running (up to 15 minutes) refused too.
 */
export async function endAllSessions(db: Db, userId: number): Promise<void> {
  await db('users').where({ id: userId }).increment('session_version', 1);
  noteSignInsEnded();
  await db('refresh_tokens')
    .where({ user_id: userId })
    .whereNull('revoked_at')
    .update({ revoked_at: nowIso() });
}
