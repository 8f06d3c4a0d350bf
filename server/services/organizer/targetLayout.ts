import type {
  BowStyleName,
  Position,
  Target,
  TargetListArcher,
  TargetList,
  UnassignedEntry,
} from '../../../src/contract/events';
import { canonicalJson, type RoundDefinition } from '../../../src/core';
import type { LinkAddress } from '../../../src/contract/linkAddress';
import type { Db } from '../../db';
import { activeJoinCodes, toJoinCode } from './joinCodes';
import { parseRound, sessionDivisions, type SessionRow } from './sessions';
import { findConflicts, type PlacedArcher } from './targetConflicts';
import { facesAreOwn, facesPerTarget } from './targetFaces';
import { roundFaces } from './sessionRounds';

export type LayoutEntry = {
  entryId: number;
  name: string;
  club: string;
  divisionId: number;
  divisionName: string;
  bowStyle: BowStyleName;
  round: RoundDefinition | null;
  /** Distances and faces as canonical JSON: archers with the same key can share a target. */
  setupKey: string | null;
  targetNumber: number | null;
  position: Position | null;
};

/** Same distances, faces and ends: the archers can stand on one target. */
export const setupKeyOf = (round: RoundDefinition): string =>
  canonicalJson(
    round.distances.map((d) => ({
      distanceM: d.distanceM,
      faceId: d.faceId,
      arrows: d.arrows,
      arrowsPerEnd: d.arrowsPerEnd,
    })),
  );

/** Every entry of the event with its round in this session (if its division shoots) and its place (if any). */
export async function loadLayout(db: Db, session: SessionRow): Promise<LayoutEntry[]> {
  const rounds = new Map(
    (await sessionDivisions(db, [session.id])).map((r) => [r.division_id, parseRound(r.round_json)]),
  );
  const entries = await db('entries')
    .join('divisions', 'divisions.id', 'entries.division_id')
    .leftJoin('target_assignments', function () {
      this.on('target_assignments.entry_id', '=', 'entries.id').andOnVal(
        'target_assignments.session_id',
        '=',
        session.id,
      );
    })
    .where('entries.event_id', session.event_id)
    .orderBy([{ column: 'divisions.id' }, { column: 'entries.name' }, { column: 'entries.id' }])
    .select(
      'entries.id',
      'entries.name',
      'entries.club',
      'entries.division_id',
      'divisions.name as division_name',
      'divisions.bow_style',
      'target_assignments.target_number',
      'target_assignments.position',
    );
  return entries.map((e) => {
    const round = rounds.get(e.division_id) ?? null;
    return {
      entryId: e.id,
      name: e.name,
      club: e.club,
      divisionId: e.division_id,
      divisionName: e.division_name,
      bowStyle: e.bow_style,
      round,
      setupKey: round ? setupKeyOf(round) : null,
      targetNumber:
        e.target_number === null || e.target_number === undefined ? null : Number(e.target_number),
      position: (e.position as Position | null) ?? null,
    };
  });
}

export const placed = (layout: LayoutEntry[]) => layout.filter((e) => e.targetNumber !== null);

/** Targets with their archers in position order, join codes, faces to hang, and every conflict in words. */
export async function loadTargetList(db: Db, session: SessionRow, link: LinkAddress): Promise<TargetList> {
  const layout = await loadLayout(db, session);
  const onTargets = placed(layout).sort(
    (a, b) => a.targetNumber! - b.targetNumber! || a.position!.localeCompare(b.position!),
  );
  const codes = await activeJoinCodes(db, session.id);

  const targets: Target[] = [];
  for (const entry of onTargets) {
    let target = targets[targets.length - 1];
    if (!target || target.targetNumber !== entry.targetNumber) {
      const code = codes.get(entry.targetNumber!);
      target = {
        targetNumber: entry.targetNumber!,
        archers: [],
        facesPerTarget: 1,
        faceUse: 'shared',
        joinCode: code ? await toJoinCode(code, link.url) : null,
      };
      targets.push(target);
    }
    const archer: TargetListArcher = {
      entryId: entry.entryId,
      position: entry.position!,
      name: entry.name,
      club: entry.club,
      divisionId: entry.divisionId,
      divisionName: entry.divisionName,
      bowStyle: entry.bowStyle,
      roundName: entry.round?.name ?? null,
      faces: entry.round ? roundFaces(entry.round) : [],
    };
    target.archers.push(archer);
  }
  for (const target of targets) {
    const rounds = onTargets
      .filter((e) => e.targetNumber === target.targetNumber && e.round)
      .map((e) => e.round!);
    target.facesPerTarget = facesPerTarget(rounds, target.archers.length);
    target.faceUse = facesAreOwn(rounds) ? 'one-per-archer' : 'shared';
  }

  const waiting = layout.filter((e) => e.targetNumber === null && e.round);
  const unassigned: UnassignedEntry[] = waiting.map((e) => ({
    entryId: e.entryId,
    name: e.name,
    divisionName: e.divisionName,
    roundName: e.round!.name,
  }));
  const conflicts = findConflicts(
    onTargets.map((e): PlacedArcher => ({
      entryId: e.entryId,
      name: e.name,
      divisionName: e.divisionName,
      targetNumber: e.targetNumber!,
      position: e.position!,
      setupKey: e.setupKey,
      roundName: e.round?.name ?? null,
    })),
    waiting.map((e) => ({ entryId: e.entryId, name: e.name, divisionName: e.divisionName })),
  );
  return {
    session: { id: session.id, name: session.name, startsAt: session.starts_at, closedAt: session.closed_at },
    targets,
    unassigned,
    conflicts,
    linkAddress: link,
  };
}
