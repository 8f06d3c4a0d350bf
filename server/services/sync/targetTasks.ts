import type { SetMemberTaskInput, TargetMember } from '../../../src/contract/targetTasks';
import type { Task } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { notFound } from '../../http/httpError';
import { audit } from '../audit';
import type { SessionRow } from '../organizer/sessions';
import { TASK_ORDER, isSingleHolderTask } from './tasks';

/** The people who joined a target with its code, writers first. */
export async function targetMembers(
  db: Db,
  sessionId: number,
  targetNumber: number,
): Promise<TargetMember[]> {
  const rows = (await db('target_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.session_id': sessionId, 'm.target_number': targetNumber })
    .select('m.user_id', 'u.display_name', 'm.task', 'm.joined_at')) as {
    user_id: number;
    display_name: string;
    task: Task;
    joined_at: string;
  }[];
  return rows
    .map((r) => ({ userId: r.user_id, name: r.display_name, task: r.task, joinedAt: r.joined_at }))
    .sort((a, b) => TASK_ORDER[a.task] - TASK_ORDER[b.task] || a.name.localeCompare(b.name));
}

/**
 * An organizer or judge frees a task (`none`: the person leaves the group) or gives a member of
 * the group a task; a writer's or caller's task someone else kept passes to this person, and the
 * one who kept it follows the target from then on. Their phone is refused from then on if it
 * still writes with the old task, and says why.
 */
export async function setMemberTask(
  db: Db,
  staffId: number,
  session: SessionRow,
  targetNumber: number,
  memberId: number,
  input: SetMemberTaskInput,
): Promise<TargetMember[]> {
  await db.transaction(async (trx) => {
    const where = { session_id: session.id, target_number: targetNumber };
    const member = await trx('target_members')
      .where({ ...where, user_id: memberId })
      .first('id', 'task');
    if (!member) throw notFound(`That person is not in the group of target ${targetNumber}.`);
    if (input.task === 'none') {
      await trx('target_members').where({ id: member.id }).delete();
    } else {
      if (isSingleHolderTask(input.task))
        await trx('target_members')
          .where({ ...where, task: input.task })
          .whereNot('user_id', memberId)
          .update({ task: 'follower' });
      await trx('target_members').where({ id: member.id }).update({ task: input.task });
    }
    await audit(trx, {
      userId: staffId,
      eventId: session.event_id,
      action: 'target.task_set',
      details: {
        sessionId: session.id,
        target: targetNumber,
        member: memberId,
        before: member.task,
        task: input.task,
      },
    });
  });
  return targetMembers(db, session.id, targetNumber);
}
