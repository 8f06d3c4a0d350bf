import { endRules, validateEnd, type ArrowValue, type RoundEnd } from '../../../src/core';
import type { Task } from '../../../src/contract/sync';
import type { FieldBatch, Placement } from './fieldBatch';
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

function refuse(reason: string): never {
  throw new Refusal(reason);
}

/** The end a mutation is about, checked up to the point where its own rules take over. */
export type CheckedEnd = {
  placement: Placement;
  end: RoundEnd;
  /** "End 3 of Ada Fletcher", to start a sentence. */
  endLabel: string;
};

/**
 * The checks every field mutation shares: the session exists and is open, the archer is on a
 * target in it, the person keeps `task` on that target, and the end is one of the archer's round.
 */
export function checkEnd(
  batch: FieldBatch,
  where: { sessionId: number; entryId: number; endIndex: number },
  task: Task,
  doing: string,
): CheckedEnd {
  const session =
    batch.session(where.sessionId) ??
    refuse('This session no longer exists, so the change cannot be kept. Ask the organizer.');
  const placement =
    batch.placement(session, where.entryId) ??
    refuse(
      `This archer has no target in the session "${session.name}" any more. Ask the organizer where they shoot now.`,
    );
  const target = placement.targetNumber;
  if (session.closed)
    refuse(`The session "${session.name}" is closed, so its ends can no longer change. Ask a judge.`);

  const held = placement.task;
  if (!held)
    refuse(`You are not in the group of target ${target}. Join it with the code on the target sheet.`);
  if (held !== task)
    refuse(`Only ${taskInSentence(task)} of target ${target} can ${doing}; you are ${taskInSentence(held)}.`);

  const round =
    placement.round ??
    refuse(
      `${placement.archerName}'s division has no round in the session "${session.name}". Ask the organizer.`,
    );
  const end =
    placement.ends[where.endIndex] ??
    refuse(
      `${placement.archerName} shoots the ${round.name}, which has ${placement.ends.length} ends; there is no end ${where.endIndex + 1}.`,
    );
  return { placement, end, endLabel: `End ${where.endIndex + 1} of ${placement.archerName}` };
}

/** Checks arrow values against the archer's face, bow style and venue (core rules, as on the phone). */
export function checkArrows(checked: CheckedEnd, arrows: readonly ArrowValue[], allowPartial: boolean): void {
  const { placement, end, endLabel } = checked;
  const rules = endRules(placement.round!, end.distanceIndex, placement.bowStyle, { allowPartial });
  // A hand-built round's last end of a distance can be shorter than its arrows per end.
  const result = validateEnd(arrows, { ...rules, arrowsPerEnd: end.arrows });
  if (!result.ok) refuse(`${endLabel}: ${result.problems.join(' ')}`);
}
