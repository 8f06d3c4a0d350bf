import type { SessionPackages, Task } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { forbidden } from '../../http/httpError';
import { isSessionStaff } from './targetMembers';
import { loadTargetPackage } from './targetPackage';

/**
 * Every target of a session that has archers, as the packages the phones keep, for the event's
 * judges and organizers: the judge desk loads a session in one request rather than one a target.
 * Each package has the person's task on that target ('follower' where they hold none).
 */
export async function loadSessionPackages(
  db: Db,
  userId: number,
  sessionId: number,
): Promise<SessionPackages> {
  if (!(await isSessionStaff(db, userId, sessionId)))
    throw forbidden("Only the event's judges and organizers can load all of a session's targets.");
  const numbers = (await db('target_assignments')
    .where({ session_id: sessionId })
    .distinct('target_number')
    .orderBy('target_number')) as { target_number: number }[];
  const joined = (await db('target_members')
    .where({ session_id: sessionId, user_id: userId })
    .select('target_number', 'task')) as { target_number: number; task: Task }[];
  const tasks = new Map(joined.map((m) => [Number(m.target_number), m.task]));
  const targets = [];
  for (const { target_number } of numbers) {
    const n = Number(target_number);
    targets.push(await loadTargetPackage(db, sessionId, n, tasks.get(n) ?? 'follower'));
  }
  return { targets };
}
