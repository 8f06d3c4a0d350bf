import {
  rulesForEnd,
  validateEnd,
  writerLock,
  type ArrowValue,
  type RoundDefinition,
  type RoundEnd,
} from '../../../src/core';
import type { Task } from '../../../src/contract/sync';
import type { FieldBatch } from './fieldBatch';
import type { FieldSession, Placement } from './fieldPlacements';
import { holdIfClosed } from './lateArrival';
import { taskInSentence } from './tasks';

/**
 * A mutation that breaks a rule. It is stored as rejected with this message, which the phone
 * shows to the person, so the message says what happened and what to do.
 */
export class Refusal extends Error {
  constructor(reason: string) {
    super(reason);
    this.name = 'Refusal';
  }
}

export function refuse(reason: string): never {
  throw new Refusal(reason);
}

/** The end a mutation is about, checked up to the point where its own rules take over. */
export type CheckedEnd = {
  placement: Placement;
  end: RoundEnd;
  /** "End 3 of Ada Fletcher", to start a sentence. */
  endLabel: string;
};

/** The session and the archer's place in it: the first checks of every field mutation. */
export function findPlacement(
  batch: FieldBatch,
  where: { sessionId: number; entryId: number },
  check?: (session: FieldSession) => void,
): Placement {
  const session =
    batch.session(where.sessionId) ??
    refuse('This session no longer exists, so the change cannot be kept. Ask the organizer.');
  check?.(session);
  return (
    batch.placement(session, where.entryId) ??
    refuse(
      `This archer has no target in the session "${session.name}" any more. Ask the organizer where they shoot now.`,
    )
  );
}

/** The archer's round in the session (refused when their division has none). */
export function roundOf(placement: Placement): RoundDefinition {
  return (
    placement.round ??
    refuse(
      `${placement.archerName}'s division has no round in the session "${placement.session.name}". Ask the organizer.`,
    )
  );
}

function endOf(placement: Placement, endIndex: number): CheckedEnd {
  const round = roundOf(placement);
  const end =
    placement.ends[endIndex] ??
    refuse(
      `${placement.archerName} shoots the ${round.name}, which has ${placement.ends.length} ends; there is no end ${endIndex + 1}.`,
    );
  return { placement, end, endLabel: `End ${endIndex + 1} of ${placement.archerName}` };
}

/**
 * The checks every writer's and caller's mutation shares: the session exists, the archer is on a
 * target in it, the person `userId` keeps `task` on that target, and the end is one of the
 * archer's round. When the session is closed, the change is then held for a judge (LateArrival);
 * whether the end may still change is `refuseIfLocked`.
 */
export function checkEnd(
  batch: FieldBatch,
  where: { sessionId: number; entryId: number; endIndex: number },
  userId: number,
  task: Task,
  doing: string,
): CheckedEnd {
  const placement = findPlacement(batch, where);
  const { targetNumber: target } = placement;
  const held = placement.tasks.get(userId);
  if (!held)
    refuse(`You are not in the group of target ${target}. Join it with the code on the target sheet.`);
  if (held !== task)
    refuse(`Only ${taskInSentence(task)} of target ${target} can ${doing}; you are ${taskInSentence(held)}.`);
  const checked = endOf(placement, where.endIndex);
  // A closed session does not refuse the person's values: they are held for a judge.
  holdIfClosed(batch, placement);
  return checked;
}

/**
 * The checks of a judge's mutation: the session exists, the person `userId` is a judge of its
 * event, the archer is on a target, the end is one of their round. Judges may still act in a
 * closed session: closing stops the writers, and judges finish the rulings and signatures after it.
 */
export function checkJudgeEnd(
  batch: FieldBatch,
  where: { sessionId: number; entryId: number; endIndex: number },
  userId: number,
  doing: string,
): CheckedEnd {
  const placement = findPlacement(batch, where, (session) => {
    if (!batch.isJudge(userId, session.eventId)) refuse(`Only a judge of this event can ${doing}.`);
  });
  return endOf(placement, where.endIndex);
}

/**
 * A writer's or caller's change to an end they may no longer change is refused (core
 * `writerLock`, the pad's own lock): once signed the end is fixed, once ruled only a judge
 * changes its values (WA Book 3), and a closed session's ends no longer change (a writer's value
 * that arrives after closing is held for a judge by `checkEnd` before this is asked).
 */
export function refuseIfLocked(batch: FieldBatch, checked: CheckedEnd, endIndex: number): void {
  const { placement, endLabel } = checked;
  const judged = batch.judged(placement.session.id, placement.entryId, endIndex);
  const lock = writerLock({
    signed: judged === 'signed',
    ruled: judged === 'ruled',
    // A late value a judge accepts is applied as if the session were still open (lateValues.ts).
    sessionClosed: placement.session.closed && !batch.acceptingLate,
  });
  if (lock === 'signed') refuse(`${endLabel} is signed. Ask a judge to correct it.`);
  if (lock === 'ruled')
    refuse(`A judge has ruled on ${endLabel.replace(/^End/, 'end')}. Only a judge can change it now.`);
  if (lock === 'closed')
    refuse(
      `The session "${placement.session.name}" is closed, so its ends can no longer change. Ask a judge.`,
    );
}

/** Checks arrow values against the archer's face, bow style and venue (core rules, as on the phone). */
export function checkArrows(checked: CheckedEnd, arrows: readonly ArrowValue[], allowPartial: boolean): void {
  const { placement, end, endLabel } = checked;
  const result = validateEnd(
    arrows,
    rulesForEnd(placement.round!, end, placement.bowStyle, { allowPartial }),
  );
  if (!result.ok) refuse(`${endLabel}: ${result.problems.join(' ')}`);
}
