import type { ChangeDto } from '../../../src/contract/sync';
import type { Db } from '../../db';

/** The key of a practice change in the `changes` log: the session's id, or `id:end` for one end. */
export const practiceEndKey = (sessionId: string, index: number) => `${sessionId}:${index}`;

/** A practice session as the server holds it: its account, and whether it is a tombstone. */
export type StoredPractice = {
  user_id: number;
  session_json: string;
  deleted_at: string | null;
  deleted_by_client: string | null;
  revived_at: string | null;
};

/** The practice session on the server, deleted or not; undefined when it never reached it. */
export async function storedPractice(db: Db, sessionId: string): Promise<StoredPractice | undefined> {
  return (await db('practice_sessions')
    .where({ id: sessionId })
    .first('user_id', 'session_json', 'deleted_at', 'deleted_by_client', 'revived_at')) as
    StoredPractice | undefined;
}

type PracticeChange = Omit<
  Extract<ChangeDto, { type: 'practice' | 'practice-end' | 'practice-del' }>,
  'version'
>;

/**
 * Appends a practice change for its person's next pull, in place of the earlier change of the same
 * record (the log keeps one per setup and per end, so a pull from 0 stays small); with
 * `wholeSession`, every earlier change of the session goes (a deletion leaves nothing of it).
 * Practice belongs to no event: it is pulled by `user_id` alone.
 */
export async function writePracticeChange(
  trx: Db,
  userId: number,
  key: string,
  change: PracticeChange,
  { wholeSession = false } = {},
): Promise<void> {
  const earlier = trx('changes').where({ user_id: userId });
  if (wholeSession)
    await earlier
      .where((w) => w.where({ practice_id: key }).orWhere('practice_id', 'like', `${key}:%`))
      .delete();
  else await earlier.where({ practice_id: key }).delete();
  await trx('changes').insert({
    event_id: 0,
    session_id: 0,
    target_number: 0,
    user_id: userId,
    practice_id: key,
    type: change.type,
    record_json: JSON.stringify(change.record),
  });
}
