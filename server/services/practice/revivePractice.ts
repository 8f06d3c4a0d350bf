import type {
  PracticeEndDto,
  PracticeSessionDto,
  PulledPracticeSession,
} from '../../../src/contract/practice';
import type { Db } from '../../db';
import type { Author } from '../sync/effects';
import { practiceEndKey, writePracticeChange, type StoredPractice } from './practiceStore';

/** The setup as phones pull it: with the time another phone's change brought the session back. */
export const pulledSetup = (setup: PracticeSessionDto, revivedAt: string | null): PulledPracticeSession => ({
  ...setup,
  ...(revivedAt ? { revivedAt } : {}),
});

/**
 * Brings a deleted session back, whole, because a change to it arrived after the deletion (a
 * phone that had not heard of it kept adding to it: no data is lost). Every end the server kept
 * with the tombstone goes to the person's phones again, the deleting one too; the change itself
 * is applied after this. Inside the push's transaction and logged with it, so a change pushed
 * again is a duplicate and revives nothing twice. Answers the session's `revived_at`: unchanged
 * when the deleting phone itself sent it (its Undo), else the change's time.
 */
export async function revivePractice(
  trx: Db,
  sessionId: string,
  stored: StoredPractice,
  by: Author,
  clientId: string,
): Promise<string | null> {
  const revivedAt = stored.deleted_by_client === clientId ? stored.revived_at : by.at;
  await trx('practice_sessions')
    .where({ id: sessionId })
    .update({ deleted_at: null, deleted_by_client: null, revived_at: revivedAt, updated_at: by.at });
  // In place of the deletion's change (same key): a phone that pulled it takes the session again.
  await writePracticeChange(trx, by.userId, sessionId, {
    type: 'practice',
    record: pulledSetup(JSON.parse(stored.session_json) as PracticeSessionDto, revivedAt),
  });
  const ends = (await trx('practice_ends')
    .where({ session_id: sessionId })
    .orderBy('end_index')
    .select('end_index', 'end_json')) as { end_index: number; end_json: string }[];
  for (const end of ends)
    await writePracticeChange(trx, by.userId, practiceEndKey(sessionId, end.end_index), {
      type: 'practice-end',
      record: JSON.parse(end.end_json) as PracticeEndDto,
    });
  return revivedAt;
}
