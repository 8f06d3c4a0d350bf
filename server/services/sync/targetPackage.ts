import type { Task, TargetPackage } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { notFound } from '../../http/httpError';
import { targetArchers } from './targetArchers';
import { TASK_ORDER } from './tasks';

/** Everything a phone needs to score a target offline: event, session, the group, the archers and their rounds. */
export async function loadTargetPackage(
  db: Db,
  sessionId: number,
  targetNumber: number,
  task: Task,
): Promise<TargetPackage> {
  const session = await db('event_sessions as s')
    .join('events as ev', 'ev.id', 's.event_id')
    .where('s.id', sessionId)
    .first(
      's.id',
      's.name',
      's.starts_at',
      's.closed_at',
      'ev.id as event_id',
      'ev.name as event_name',
      'ev.venue',
    );
  if (!session) throw notFound('That session does not exist.');
  const members = (await db('target_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.session_id': sessionId, 'm.target_number': targetNumber })
    .select('m.user_id', 'u.display_name', 'm.task')) as {
    user_id: number;
    display_name: string;
    task: Task;
  }[];
  members.sort(
    (a, b) => TASK_ORDER[a.task] - TASK_ORDER[b.task] || a.display_name.localeCompare(b.display_name),
  );
  return {
    event: { id: session.event_id, name: session.event_name, venue: session.venue },
    session: { id: session.id, name: session.name, startsAt: session.starts_at, closed: !!session.closed_at },
    targetNumber,
    task,
    members: members.map((m) => ({ userId: m.user_id, name: m.display_name, task: m.task })),
    archers: await targetArchers(db, sessionId, targetNumber),
  };
}
