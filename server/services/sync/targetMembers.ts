import type { JoinRequest, Task, TargetPackage } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { HttpError, conflict, forbidden, notFound } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { loadTargetPackage } from './targetPackage';
import { TASK_LABELS, isSingleHolderTask } from './tasks';

/**
 * Joins the signed-in person to a target group with the code printed on its target sheet, or
 * changes their task in it. Holding the code is what entitles a person to keep a card: writers
 * are often not archers of the event (a parent, a club volunteer), so joining grants no event
 * role; the membership alone opens the target's field data to them.
 */
export async function joinTarget(db: Db, userId: number, input: JoinRequest): Promise<TargetPackage> {
  return db.transaction(async (trx) => {
    const code = await trx('join_codes')
      .where({ code: input.code })
      .first('session_id', 'target_number', 'revoked_at');
    if (!code)
      throw notFound(`No target has the join code ${input.code}. Check it against the target sheet.`);
    if (code.revoked_at) {
      throw new HttpError(
        410,
        'join_code_replaced',
        `The join code ${input.code} was replaced. Use the code on the newest target sheet, or ask the organizer.`,
      );
    }
    const sessionId = Number(code.session_id);
    const target = Number(code.target_number);
    const session = await trx('event_sessions')
      .where({ id: sessionId })
      .first('event_id', 'name', 'closed_at');
    if (session.closed_at)
      throw conflict(`The session "${session.name}" is closed, so its targets cannot be joined any more.`);

    if (isSingleHolderTask(input.task)) {
      const holder = await trx('target_members as m')
        .join('users as u', 'u.id', 'm.user_id')
        .where({ 'm.session_id': sessionId, 'm.target_number': target, 'm.task': input.task })
        .whereNot('m.user_id', userId)
        .first('u.display_name');
      if (holder) {
        throw conflict(
          `${TASK_LABELS[input.task]} on target ${target} is already kept by ${holder.display_name}. Choose another task, ask them to leave it on their phone, or ask a judge or the organizer to free it.`,
        );
      }
    }

    const mine = { session_id: sessionId, target_number: target, user_id: userId };
    const existing = await trx('target_members').where(mine).first('id', 'task');
    if (!existing) await trx('target_members').insert({ ...mine, task: input.task, joined_at: nowIso() });
    else if (existing.task !== input.task)
      await trx('target_members').where({ id: existing.id }).update({ task: input.task });
    if (existing?.task !== input.task) {
      await audit(trx, {
        userId,
        eventId: session.event_id,
        action: 'target.joined',
        details: { sessionId, target, task: input.task, before: existing?.task ?? null },
      });
    }
    return loadTargetPackage(trx, sessionId, target, input.task);
  });
}

/** Leaves a target group. Leaving twice is harmless, so a phone can repeat it after a lost answer. */
export async function leaveTarget(
  db: Db,
  userId: number,
  sessionId: number,
  targetNumber: number,
): Promise<void> {
  const session = await db('event_sessions').where({ id: sessionId }).first('event_id');
  if (!session) throw notFound('That session does not exist.');
  const left = await db('target_members')
    .where({ session_id: sessionId, target_number: targetNumber, user_id: userId })
    .delete();
  if (left)
    await audit(db, {
      userId,
      eventId: session.event_id,
      action: 'target.left',
      details: { sessionId, target: targetNumber },
    });
}

/** Whether the person judges or organizes the session's event; refuses a session that does not exist. */
export async function isSessionStaff(db: Db, userId: number, sessionId: number): Promise<boolean> {
  const session = await db('event_sessions').where({ id: sessionId }).first('event_id');
  if (!session) throw notFound('That session does not exist.');
  const role = await db('event_roles')
    .where({ event_id: session.event_id, user_id: userId })
    .whereIn('role', ['organizer', 'judge'])
    .first('id');
  return role !== undefined;
}

/**
 * Who may look at a target: its group, and the event's judges and organizers (who follow it
 * unless they joined with a task). Returns the task to show; refuses everyone else.
 */
export async function targetViewerTask(
  db: Db,
  userId: number,
  sessionId: number,
  targetNumber: number,
): Promise<Task> {
  const staff = await isSessionStaff(db, userId, sessionId);
  const member = await db('target_members')
    .where({ session_id: sessionId, target_number: targetNumber, user_id: userId })
    .first('task');
  if (!member && !staff) {
    throw forbidden(
      `Only the group of target ${targetNumber}, the judges and the organizers can see it. Join it with the code on the target sheet.`,
    );
  }
  const used = await db('target_assignments')
    .where({ session_id: sessionId, target_number: targetNumber })
    .first('id');
  if (!used && !member) throw notFound(`Target ${targetNumber} has no archers in this session.`);
  return (member?.task as Task | undefined) ?? 'follower';
}
