import type { PracticeMutation } from '../../../src/contract/sync';
import type { Db } from '../../db';
import type { Author } from '../sync/effects';
import { practiceEndKey, storedPractice, writePracticeChange } from './practiceStore';
import { pulledSetup, revivePractice } from './revivePractice';

/**
 * A change to the person's own practice log from the phone's outbox (`practice.session`,
 * `practice.end`, `practice.delete`), applied inside the push's transaction. Each one replaces
 * what it is about (the setup, one end), so the same change again changes nothing, and the sync
 * log answers a change pushed again without applying it. A session is its account's alone: a
 * change to another account's session is refused, with nothing stored. A deleted session is kept
 * as a tombstone: a change arriving after the deletion brings it back whole (revivePractice).
 */
export async function applyPracticeChange(
  trx: Db,
  m: PracticeMutation,
  by: Author,
  clientId: string,
): Promise<string | null> {
  if (by.transcribedBy)
    return `Practice counts only from its archer’s own phone, so ${by.transcribedBy.name} cannot bring it in from a file; the archer’s phone sends it when they sign in.`;
  const sessionId = m.kind === 'practice.session' ? m.args.id : m.args.sessionId;
  const stored = await storedPractice(trx, sessionId);
  if (stored && stored.user_id !== by.userId)
    return 'This practice session belongs to another account. Sign in as its archer to change it.';

  if (m.kind === 'practice.delete') {
    // Not on the server (never sent) or deleted already: nothing to do.
    if (!stored || stored.deleted_at) return null;
    await trx('practice_sessions')
      .where({ id: sessionId })
      .update({ deleted_at: by.at, deleted_by_client: clientId, updated_at: by.at });
    await writePracticeChange(
      trx,
      by.userId,
      sessionId,
      { type: 'practice-del', record: { sessionId } },
      { wholeSession: true },
    );
    return null;
  }
  if (m.kind === 'practice.end' && !stored)
    return 'This practice session is not on your account (its start never reached it), so its end was not kept.';
  const revivedAt = stored?.deleted_at
    ? await revivePractice(trx, sessionId, stored, by, clientId)
    : (stored?.revived_at ?? null);

  if (m.kind === 'practice.session') {
    const row = {
      id: m.args.id,
      user_id: by.userId,
      started_at: m.args.startedAt,
      session_json: JSON.stringify(m.args),
      updated_at: by.at,
    };
    await trx('practice_sessions')
      .insert(row)
      .onConflict('id')
      .merge(['started_at', 'session_json', 'updated_at']);
    await writePracticeChange(trx, by.userId, m.args.id, {
      type: 'practice',
      record: pulledSetup(m.args, revivedAt),
    });
    return null;
  }
  const where = { session_id: sessionId, end_index: m.args.index };
  // No arrows: the archer took the end's last arrow back.
  if (m.args.arrows.length === 0) await trx('practice_ends').where(where).delete();
  else
    await trx('practice_ends')
      .insert({ ...where, end_json: JSON.stringify(m.args) })
      .onConflict(['session_id', 'end_index'])
      .merge(['end_json']);
  await writePracticeChange(trx, by.userId, practiceEndKey(sessionId, m.args.index), {
    type: 'practice-end',
    record: m.args,
  });
  return null;
}
