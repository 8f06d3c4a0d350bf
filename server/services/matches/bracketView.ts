import type { AlternateFrom, BracketArcher, MatchFormat, Side } from '../../../src/core';
import { alternates, finalPlaces } from '../../../src/core/matches';
import type { BracketDto, MatchDto, MatchSideDto } from '../../../src/contract/matches';
import type { Db } from '../../db';
import { loadRecords, readMatch, type MatchRow } from './matchRows';
import { loadWriterRecords, type WriterRecords } from './matchWriterRows';

type BracketRow = {
  id: number;
  division_id: number;
  division_name: string;
  session_id: number;
  format: MatchFormat;
  alternate: AlternateFrom;
  entrants: number;
  size: number;
};

async function sidesOf(db: Db, matchIds: number[]): Promise<Map<number, MatchDto['sides']>> {
  const rows = (await db('match_sides as s')
    .join('match_side_archers as sa', 'sa.match_side_id', 's.id')
    .join('entries as e', 'e.id', 'sa.entry_id')
    .whereIn('s.match_id', matchIds)
    .orderBy('sa.id')
    .select('s.match_id', 's.side', 's.seed', 'e.id as entry_id', 'e.name', 'e.club')) as {
    match_id: number;
    side: Side;
    seed: number;
    entry_id: number;
    name: string;
    club: string;
  }[];
  const sides = new Map<number, MatchDto['sides']>();
  for (const r of rows) {
    const match = sides.get(r.match_id) ?? {};
    const side: MatchSideDto = match[r.side] ?? { seed: r.seed, archers: [] };
    side.archers.push({ entryId: r.entry_id, name: r.name, club: r.club });
    match[r.side] = side;
    sides.set(r.match_id, match);
  }
  return sides;
}

function matchDto(
  m: MatchRow & { first_shooter: Side | null },
  alternate: boolean,
  format: MatchFormat,
  sides: MatchDto['sides'],
  record: Pick<MatchDto, 'ends' | 'shootOff'>,
  writers: WriterRecords,
): MatchDto {
  const state = sides.a && sides.b ? readMatch(format, record) : null;
  return {
    id: m.id,
    round: m.round,
    slot: m.slot,
    bronze: !!m.bronze,
    targetNumber: m.target_number,
    sides,
    ends: record.ends,
    writes: writers.writes,
    shootOff: record.shootOff,
    state: state && {
      score: state.score,
      totals: state.totals,
      setPoints: state.ends.map((e) => e.setPoints ?? null),
      next: state.next,
      winner: state.winner,
      endsLeft: state.endsLeft,
      shootOff: state.shootOff,
      outlook: state.outlook,
    },
    alternate,
    firstShooter: alternate ? m.first_shooter : null,
    winner: m.winner_side,
    decidedBy: m.decided_by,
    signedAt: m.signed_at,
    countersignedBy: writers.countersignedBy,
  };
}

/** Final places from the decided matches (core `finalPlaces`), best first. */
function places(matches: MatchDto[], rounds: number): BracketDto['places'] {
  const archers = new Map<number, BracketArcher & { side: MatchSideDto }>();
  const note = (side: MatchSideDto | undefined, fact: Partial<BracketArcher>) => {
    if (!side) return;
    const known = archers.get(side.seed) ?? { id: String(side.seed), seed: side.seed, side };
    archers.set(side.seed, { ...known, ...fact });
  };
  for (const m of matches) {
    for (const s of ['a', 'b'] as const) note(m.sides[s], {});
    if (!m.winner) continue;
    const loser = m.winner === 'a' ? 'b' : 'a';
    if (m.bronze) {
      note(m.sides[m.winner], { medal: 3 });
      note(m.sides[loser], { medal: 4 });
    } else if (m.round === rounds - 1) {
      note(m.sides[m.winner], { medal: 1 });
      note(m.sides[loser], { medal: 2 });
    } else {
      note(m.sides[loser], { lostInRound: m.round });
    }
  }
  const list = [...archers.values()];
  return finalPlaces(list, rounds)
    .flatMap((p, i) => {
      const { side } = list[i]!;
      const first = side.archers[0]!;
      return p.place === null
        ? []
        : [{ place: p.place, entryId: first.entryId, name: first.name, club: first.club, seed: side.seed }];
    })
    .sort((x, y) => x.place - y.place);
}

/** Every bracket of an event with its matches, each read by the core, and the final places so far. */
export async function eventBrackets(db: Db, eventId: number): Promise<BracketDto[]> {
  const brackets = (await db('brackets as b')
    .join('divisions as d', 'd.id', 'b.division_id')
    .where({ 'b.event_id': eventId })
    .orderBy('d.name')
    .select(
      'b.id',
      'b.division_id',
      'd.name as division_name',
      'b.session_id',
      'b.format',
      'b.alternate',
      'b.entrants',
      'b.size',
    )) as BracketRow[];
  const matchRows = (await db('matches')
    .whereIn(
      'bracket_id',
      brackets.map((b) => b.id),
    )
    .orderBy(['bracket_id', 'round', 'bronze', 'slot'])) as (Omit<MatchRow, 'format' | 'size'> & {
    first_shooter: Side | null;
  })[];
  const ids = matchRows.map((m) => m.id);
  const [sides, records, writers] = await Promise.all([
    sidesOf(db, ids),
    loadRecords(db, ids),
    loadWriterRecords(db, ids),
  ]);
  return brackets.map((b) => {
    const rounds = Math.log2(b.size);
    const matches = matchRows
      .filter((m) => m.bracket_id === b.id)
      .map((m) =>
        matchDto(
          { ...m, format: b.format, size: b.size },
          alternates(b.alternate, m, rounds),
          b.format,
          sides.get(m.id) ?? {},
          records.get(m.id)!,
          writers.get(m.id)!,
        ),
      );
    return {
      id: b.id,
      divisionId: b.division_id,
      divisionName: b.division_name,
      sessionId: b.session_id,
      format: b.format,
      alternate: b.alternate,
      entrants: b.entrants,
      size: b.size,
      rounds,
      matches,
      places: places(matches, rounds),
    };
  });
}
