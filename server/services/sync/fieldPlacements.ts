import { endsOfRound, type RoundDefinition, type RoundEnd } from '../../../src/core';
import type { BowStyleName, Position } from '../../../src/contract/events';
import type { Task } from '../../../src/contract/sync';
import type { Db } from '../../db';

export type FieldSession = {
  id: number;
  eventId: number;
  name: string;
  closed: boolean;
  /** What a card signature names of the session and its event (see cardContent). */
  startsAt: string;
  event: { name: string; startsOn: string; endsOn: string };
};

/** Where an archer shoots in a session, what, and the task of each pushing person on that target. */
export type Placement = {
  session: FieldSession;
  entryId: number;
  archerName: string;
  /** The account linked to the entry (the archer who countersigns), if any. */
  archerUserId: number | null;
  divisionName: string;
  club: string;
  targetNumber: number;
  position: Position;
  bowStyle: BowStyleName;
  /** Null when the archer's division has no round in the session. */
  round: RoundDefinition | null;
  ends: RoundEnd[];
  /** The task of each pushing person in the group of the archer's target, by user id (shared by the target's archers). */
  tasks: Map<number, Task>;
};

// Rounds are stored as JSON snapshots; the same few strings come back on every push.
const rounds = new Map<string, { round: RoundDefinition; ends: RoundEnd[] }>();
function parseRound(json: string): { round: RoundDefinition; ends: RoundEnd[] } {
  let parsed = rounds.get(json);
  if (!parsed) {
    const round = JSON.parse(json) as RoundDefinition;
    parsed = { round, ends: endsOfRound(round) };
    if (rounds.size > 200) rounds.clear();
    rounds.set(json, parsed);
  }
  return parsed;
}

type PlacementRow = {
  session_id: number;
  event_id: number;
  session_name: string;
  closed_at: string | null;
  starts_at: string;
  event_name: string;
  starts_on: string;
  ends_on: string;
  entry_id: number | null;
  target_number: number | null;
  position: Position | null;
  club: string | null;
  archer_name: string | null;
  archer_user_id: number | null;
  division_name: string | null;
  bow_style: BowStyleName | null;
  round_json: string | null;
};

/**
 * The sessions named, where each named archer shoots in them (with the round), and the task of
 * each of the people `userIds` on those targets: two queries, whatever the number of pushes.
 * Placements are keyed `sessionId:entryId`; an archer without a target in a session has none.
 */
export async function loadPlacements(
  trx: Db,
  sessionIds: readonly number[],
  entryIds: readonly number[],
  userIds: readonly number[],
): Promise<{ sessions: Map<number, FieldSession>; placements: Map<string, Placement> }> {
  const rows = (await trx('event_sessions as s')
    .join('events as ev', 'ev.id', 's.event_id')
    .leftJoin('target_assignments as ta', (j) =>
      j.on('ta.session_id', 's.id').andOnIn('ta.entry_id', [...entryIds]),
    )
    .leftJoin('entries as e', 'e.id', 'ta.entry_id')
    .leftJoin('divisions as d', 'd.id', 'e.division_id')
    .leftJoin('session_divisions as sd', (j) =>
      j.on('sd.session_id', 's.id').andOn('sd.division_id', 'e.division_id'),
    )
    .whereIn('s.id', sessionIds)
    .select(
      's.id as session_id',
      's.event_id',
      's.name as session_name',
      's.closed_at',
      's.starts_at',
      'ev.name as event_name',
      'ev.starts_on',
      'ev.ends_on',
      'ta.entry_id',
      'ta.target_number',
      'ta.position',
      'e.club',
      'e.name as archer_name',
      'e.user_id as archer_user_id',
      'd.name as division_name',
      'd.bow_style',
      'sd.round_json',
    )) as PlacementRow[];
  // Asked apart rather than joined: each person is in few groups, and one join per person and
  // archer would probe every pair.
  const members = (await trx('target_members')
    .whereIn('session_id', sessionIds)
    .whereIn('user_id', userIds)
    .select('session_id', 'target_number', 'user_id', 'task')) as {
    session_id: number;
    target_number: number;
    user_id: number;
    task: Task;
  }[];

  const groups = new Map<string, Map<number, Task>>();
  const groupOf = (sessionId: number, target: number) => {
    const key = `${sessionId}:${target}`;
    let group = groups.get(key);
    if (!group) groups.set(key, (group = new Map()));
    return group;
  };
  for (const m of members) groupOf(m.session_id, m.target_number).set(m.user_id, m.task);

  const sessions = new Map<number, FieldSession>();
  const placements = new Map<string, Placement>();
  for (const r of rows) {
    let session = sessions.get(r.session_id);
    if (!session) {
      session = {
        id: r.session_id,
        eventId: r.event_id,
        name: r.session_name,
        closed: !!r.closed_at,
        startsAt: r.starts_at,
        event: { name: r.event_name, startsOn: r.starts_on, endsOn: r.ends_on },
      };
      sessions.set(session.id, session);
    }
    if (r.entry_id === null) continue;
    const parsed = r.round_json ? parseRound(r.round_json) : null;
    placements.set(`${r.session_id}:${r.entry_id}`, {
      session,
      entryId: r.entry_id,
      archerName: r.archer_name!,
      archerUserId: r.archer_user_id,
      divisionName: r.division_name!,
      club: r.club ?? '',
      targetNumber: Number(r.target_number),
      position: r.position!,
      bowStyle: r.bow_style!,
      round: parsed?.round ?? null,
      ends: parsed?.ends ?? [],
      tasks: groupOf(r.session_id, Number(r.target_number)),
    });
  }
  return { sessions, placements };
}
