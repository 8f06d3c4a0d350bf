import type { Conflict } from '../../../src/contract/events';

/** Most archers one target takes: positions A–D. */
export const ARCHERS_PER_TARGET = 4;

export type PlacedArcher = {
  entryId: number;
  name: string;
  divisionName: string;
  targetNumber: number;
  position: string;
  /** Same key = same distances and faces, so the archers can share a target. Null: no round in this session. */
  setupKey: string | null;
  roundName: string | null;
};

export type WaitingArcher = { entryId: number; name: string; divisionName: string };

const list = (names: string[]) =>
  names.length <= 1 ? names.join('') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;

/**
 * Everything wrong with a session's target layout, in words an organizer can act on. Nothing is
 * fixed here: the organizer decides. Pure, so every kind can be tested with made-up layouts
 * (the database itself refuses two archers in one position).
 */
export function findConflicts(
  placed: readonly PlacedArcher[],
  waiting: readonly WaitingArcher[],
): Conflict[] {
  const conflicts: Conflict[] = [];
  const byTarget = new Map<number, PlacedArcher[]>();
  for (const a of placed) byTarget.set(a.targetNumber, [...(byTarget.get(a.targetNumber) ?? []), a]);

  for (const [targetNumber, archers] of [...byTarget.entries()].sort((x, y) => x[0] - y[0])) {
    const byPosition = new Map<string, PlacedArcher[]>();
    for (const a of archers) byPosition.set(a.position, [...(byPosition.get(a.position) ?? []), a]);
    for (const [position, here] of byPosition) {
      if (here.length > 1) {
        conflicts.push({
          kind: 'position-taken',
          targetNumber,
          entryIds: here.map((a) => a.entryId),
          message: `Target ${targetNumber}${position} holds ${here.length} archers: ${list(here.map((a) => a.name))}. Move all but one of them.`,
        });
      }
    }
    if (archers.length > ARCHERS_PER_TARGET) {
      conflicts.push({
        kind: 'too-many',
        targetNumber,
        entryIds: archers.map((a) => a.entryId),
        message: `Target ${targetNumber} has ${archers.length} archers; a target takes at most ${ARCHERS_PER_TARGET}. Move ${archers.length - ARCHERS_PER_TARGET} of them to another target.`,
      });
    }
    const setups = new Map<string, PlacedArcher[]>();
    for (const a of archers) if (a.setupKey) setups.set(a.setupKey, [...(setups.get(a.setupKey) ?? []), a]);
    if (setups.size > 1) {
      const parts = [...setups.values()].map(
        (group) => `${list(group.map((a) => a.name))} (${group[0]!.roundName})`,
      );
      conflicts.push({
        kind: 'mixed-rounds',
        targetNumber,
        entryIds: archers.filter((a) => a.setupKey).map((a) => a.entryId),
        message: `Target ${targetNumber} mixes rounds or faces: ${parts.join('; ')}. Archers on one target shoot the same distances at the same face.`,
      });
    }
    for (const a of archers) {
      if (!a.setupKey) {
        conflicts.push({
          kind: 'no-round',
          targetNumber,
          entryIds: [a.entryId],
          message: `${a.name} is on target ${targetNumber}${a.position}, but ${a.divisionName} has no round in this session. Give the division a round, or take the archer off the target.`,
        });
      }
    }
  }
  for (const a of waiting) {
    conflicts.push({
      kind: 'unassigned',
      targetNumber: null,
      entryIds: [a.entryId],
      message: `${a.name} (${a.divisionName}) has no target yet.`,
    });
  }
  return conflicts;
}
