import {
  POSITIONS,
  type MoveArcherInput,
  type Position,
  type SwapArchersInput,
} from '../../../src/contract/events';
import type { Db } from '../../db';
import { conflict, notFound } from '../../http/httpError';
import { audit } from '../audit';
import { scoresExist } from '../fieldData';
import { assignedTargetNumbers, ensureJoinCodes } from './joinCodes';
import { requireOpen, type SessionRow } from './sessions';
import { ARCHERS_PER_TARGET } from './targetConflicts';
import { loadLayout, type LayoutEntry } from './targetLayout';

export type TargetPosition = { entryId: number; targetNumber: number; position: Position };

/**
 * Automatic layout: archers are grouped by round (distances and faces) and division, each group
 * starts on a new target, up to four per target in positions A–D (details AB and CD), and targets
 * are numbered from 1 straight through the groups. Within a group archers go in name order, then
 * archers of one club who would share a target are spread over the group's targets where they
 * can be (clubmates on one target score each other's arrows). Pure, so it can be tested without
 * a database.
 */
export function planTargets(
  entries: readonly Pick<LayoutEntry, 'entryId' | 'name' | 'divisionId' | 'setupKey' | 'club'>[],
): TargetPosition[] {
  const groups = new Map<string, (typeof entries)[number][]>();
  const setupOrder: string[] = [];
  for (const e of entries) {
    if (!e.setupKey) continue;
    if (!setupOrder.includes(e.setupKey)) setupOrder.push(e.setupKey);
    const key = `${setupOrder.indexOf(e.setupKey)}|${e.divisionId}`;
    groups.set(key, [...(groups.get(key) ?? []), e]);
  }
  const ordered = [...groups.entries()].sort(([a], [b]) => {
    const [sa, da] = a.split('|').map(Number) as [number, number];
    const [sb, db] = b.split('|').map(Number) as [number, number];
    return sa - sb || da - db;
  });
  const placements: TargetPosition[] = [];
  let nextTarget = 1;
  for (const [, group] of ordered) {
    const archers = [...group].sort((x, y) => x.name.localeCompare(y.name) || x.entryId - y.entryId);
    const targets = Array.from({ length: Math.ceil(archers.length / ARCHERS_PER_TARGET) }, (_, t) =>
      archers.slice(t * ARCHERS_PER_TARGET, (t + 1) * ARCHERS_PER_TARGET),
    );
    spreadClubs(targets);
    targets.forEach((onTarget, t) => {
      [...onTarget]
        .sort((x, y) => x.name.localeCompare(y.name) || x.entryId - y.entryId)
        .forEach((a, i) =>
          placements.push({ entryId: a.entryId, targetNumber: nextTarget + t, position: POSITIONS[i]! }),
        );
    });
    nextTarget += targets.length;
  }
  return placements;
}

/** Pairs of archers of one club on one target (an empty club is no club). */
function clubPairs(onTarget: readonly { club: string }[]): number {
  let pairs = 0;
  onTarget.forEach((a, i) => {
    for (const b of onTarget.slice(i + 1)) if (a.club && a.club === b.club) pairs += 1;
  });
  return pairs;
}

/**
 * Swaps archers between the targets (in place) while a swap leaves fewer clubmates sharing a
 * target; each swap lowers that count, so it ends. Without such pairs nothing moves.
 */
function spreadClubs<T extends { club: string }>(targets: T[][]): void {
  const trySwap = (): boolean => {
    for (const here of targets) {
      for (const [i, a] of here.entries()) {
        if (!here.some((b) => b !== a && a.club && b.club === a.club)) continue;
        for (const there of targets) {
          if (there === here) continue;
          for (const [j, b] of there.entries()) {
            const before = clubPairs(here) + clubPairs(there);
            here[i] = b;
            there[j] = a;
            if (clubPairs(here) + clubPairs(there) < before) return true;
            here[i] = a;
            there[j] = b;
          }
        }
      }
    }
    return false;
  };
  while (trySwap());
}

/** Replaces the session's layout with the automatic one and gives every target a join code. */
export async function assignAutomatically(db: Db, userId: number, session: SessionRow): Promise<number> {
  requireOpen(session);
  if (await scoresExist(db, { sessionId: session.id })) {
    throw conflict(
      'Ends are already scored in this session: laying out every target again would take archers away from their cards. Change places by hand instead.',
    );
  }
  const layout = await loadLayout(db, session);
  const placements = planTargets(layout);
  if (placements.length === 0) {
    throw conflict(
      'No archer shoots in this session yet. Give divisions a round in this session and add entries, then assign targets.',
    );
  }
  await db.transaction(async (trx) => {
    await trx('target_assignments').where({ session_id: session.id }).delete();
    for (const p of placements) {
      await trx('target_assignments').insert({
        session_id: session.id,
        entry_id: p.entryId,
        target_number: p.targetNumber,
        position: p.position,
      });
    }
    await ensureJoinCodes(
      trx,
      session.id,
      placements.map((p) => p.targetNumber),
    );
    await audit(trx, {
      userId,
      eventId: session.event_id,
      action: 'targets.assigned',
      details: { sessionId: session.id, archers: placements.length },
    });
  });
  return placements.length;
}

async function findLayoutEntry(db: Db, session: SessionRow, entryId: number): Promise<LayoutEntry> {
  const entry = (await loadLayout(db, session)).find((e) => e.entryId === entryId);
  if (!entry) throw notFound('That archer is not entered in this event.');
  return entry;
}

const spot = (targetNumber: number, position: string) => `${targetNumber}${position}`;

/** Puts one archer on a target and position. A taken position is refused: swap the two archers instead. */
export async function moveArcher(
  db: Db,
  userId: number,
  session: SessionRow,
  input: MoveArcherInput,
): Promise<void> {
  requireOpen(session);
  const entry = await findLayoutEntry(db, session, input.entryId);
  if (!entry.round)
    throw conflict(
      `${entry.name}'s division, ${entry.divisionName}, has no round in this session. Give it a round first.`,
    );
  if (entry.targetNumber === input.targetNumber && entry.position === input.position) return;
  await db.transaction(async (trx) => {
    const holder = await trx('target_assignments')
      .join('entries', 'entries.id', 'target_assignments.entry_id')
      .where({
        'target_assignments.session_id': session.id,
        'target_assignments.target_number': input.targetNumber,
        'target_assignments.position': input.position,
      })
      .first('entries.name', 'entries.id');
    if (holder) {
      throw conflict(
        `Target ${spot(input.targetNumber, input.position)} is taken by ${holder.name}. Swap the two archers instead, or move ${holder.name} first.`,
      );
    }
    const existing = await trx('target_assignments')
      .where({ session_id: session.id, entry_id: input.entryId })
      .first('id');
    if (existing)
      await trx('target_assignments')
        .where({ id: existing.id })
        .update({ target_number: input.targetNumber, position: input.position });
    else
      await trx('target_assignments').insert({
        session_id: session.id,
        entry_id: input.entryId,
        target_number: input.targetNumber,
        position: input.position,
      });
    await ensureJoinCodes(trx, session.id, [input.targetNumber]);
    await audit(trx, {
      userId,
      eventId: session.event_id,
      action: 'targets.moved',
      details: {
        sessionId: session.id,
        entryId: input.entryId,
        from: entry.targetNumber ? spot(entry.targetNumber, entry.position!) : null,
        to: spot(input.targetNumber, input.position),
      },
    });
  });
}

/** Swaps two archers' places in one transaction, so the one-archer-per-position rule is never broken. */
export async function swapArchers(
  db: Db,
  userId: number,
  session: SessionRow,
  input: SwapArchersInput,
): Promise<void> {
  requireOpen(session);
  const layout = await loadLayout(db, session);
  const first = layout.find((e) => e.entryId === input.entryId);
  const second = layout.find((e) => e.entryId === input.otherEntryId);
  if (!first || !second) throw notFound('One of those archers is not entered in this event.');
  for (const e of [first, second]) {
    if (e.targetNumber === null)
      throw conflict(`${e.name} has no target in this session yet. Move them to a free position instead.`);
  }
  await db.transaction(async (trx) => {
    // Delete both rows, then insert them swapped: no moment holds two archers in one position.
    await trx('target_assignments')
      .where({ session_id: session.id })
      .whereIn('entry_id', [first.entryId, second.entryId])
      .delete();
    await trx('target_assignments').insert([
      {
        session_id: session.id,
        entry_id: first.entryId,
        target_number: second.targetNumber,
        position: second.position,
      },
      {
        session_id: session.id,
        entry_id: second.entryId,
        target_number: first.targetNumber,
        position: first.position,
      },
    ]);
    await audit(trx, {
      userId,
      eventId: session.event_id,
      action: 'targets.swapped',
      details: {
        sessionId: session.id,
        entries: [first.entryId, second.entryId],
        places: [spot(first.targetNumber!, first.position!), spot(second.targetNumber!, second.position!)],
      },
    });
  });
}

/** Takes one archer off their target (they then show as having no target). */
export async function unassignArcher(
  db: Db,
  userId: number,
  session: SessionRow,
  entryId: number,
): Promise<void> {
  requireOpen(session);
  const removed = await db('target_assignments')
    .where({ session_id: session.id, entry_id: entryId })
    .delete();
  if (!removed) throw notFound('That archer has no target in this session.');
  await audit(db, {
    userId,
    eventId: session.event_id,
    action: 'targets.unassigned',
    details: { sessionId: session.id, entryId },
  });
}

/** Codes for every target that has archers but no code (for sessions laid out by hand). */
export async function createMissingJoinCodes(db: Db, userId: number, session: SessionRow): Promise<number> {
  const created = await ensureJoinCodes(db, session.id, await assignedTargetNumbers(db, session.id));
  if (created)
    await audit(db, {
      userId,
      eventId: session.event_id,
      action: 'join_codes.created',
      details: { sessionId: session.id, created },
    });
  return created;
}
