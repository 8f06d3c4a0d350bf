import type { ArrowValue, RoundDefinition, ShootOffArrow } from '../../../src/core';
import { rankArchers, rankTeams } from '../../../src/core/ranking';
import type {
  DivisionStandings,
  EventResults,
  ShootOffArrowDto,
  StandingRow,
  Trust,
} from '../../../src/contract/results';
import type { Db } from '../../db';
import { nowIso } from '../../time';
import { parseRound, sessionDivisions } from '../organizer/sessions';
import type { CardCounts } from './cardCounts';
import { cardKey, heldCardCounts, type HeldCardCounts, type WantedCard } from './heldCardCounts';
import type { ResultsEvent } from './resultsEvent';

type ArcherRow = {
  session_id: number;
  entry_id: number;
  target_number: number;
  name: string;
  club: string;
  in_team: number | boolean;
  division_id: number;
  class_name: string;
};

/** One archer's row before ranking, and what the ranking reads besides it. */
type Scored = {
  row: Omit<StandingRow, 'place' | 'tied' | 'shootOff' | 'decidedByShootOff'>;
  xs: number;
  nines: number;
  inTeam: boolean;
};

/** The latest recorded shoot-off arrows of each archer, by `session:entry`, in arrow order. */
async function shootOffArrows(db: Db, sessionIds: number[]): Promise<Map<string, ShootOffArrowDto[]>> {
  const rows = (await db('shootoff_arrows')
    .whereIn('session_id', sessionIds)
    .orderBy('id')
    .select('session_id', 'entry_id', 'arrow_index', 'value', 'distance_mm', 'closer')) as {
    session_id: number;
    entry_id: number;
    arrow_index: number;
    value: ArrowValue;
    distance_mm: number | null;
    closer: number | boolean;
  }[];
  const byArcher = new Map<string, ShootOffArrowDto[]>();
  for (const r of rows) {
    const key = `${r.session_id}:${r.entry_id}`;
    const arrows = byArcher.get(key) ?? [];
    arrows[r.arrow_index] = {
      value: r.value,
      ...(r.distance_mm !== null ? { distanceMm: r.distance_mm } : {}),
      ...(r.closer ? { closer: true } : {}),
    };
    byArcher.set(key, arrows);
  }
  // An arrow recorded out of order leaves a hole: only the arrows up to the first hole count.
  for (const [key, arrows] of byArcher) {
    const hole = arrows.findIndex((a) => a === undefined);
    byArcher.set(key, hole === -1 ? arrows : arrows.slice(0, hole));
  }
  return byArcher;
}

/** Final cards (both card signatures current), by `session:entry`. */
async function finalCards(db: Db, sessionIds: number[]): Promise<Set<string>> {
  const rows = (await db('card_signatures')
    .whereIn('session_id', sessionIds)
    .whereNull('superseded_at')
    .select('session_id', 'entry_id', 'role')) as { session_id: number; entry_id: number; role: string }[];
  const roles = new Map<string, Set<string>>();
  for (const r of rows) {
    const key = `${r.session_id}:${r.entry_id}`;
    roles.set(key, (roles.get(key) ?? new Set()).add(r.role));
  }
  return new Set([...roles].filter(([, held]) => held.size === 2).map(([key]) => key));
}

/** One archer's row before ranking: who they are and their card's counts. */
function scoreArcher(
  archer: ArcherRow,
  round: RoundDefinition,
  counts: CardCounts,
  final: boolean,
  shootOff: ShootOffArrowDto[],
): Scored {
  const trust: Trust = final ? 'final' : counts.signed ? 'signed' : 'provisional';
  return {
    row: {
      entryId: archer.entry_id,
      name: archer.name,
      club: archer.club,
      targetNumber: archer.target_number,
      total: counts.total,
      tens: counts.tens,
      second: round.venue === 'indoor' ? counts.nines : counts.xs,
      hits: counts.hits,
      endsShot: counts.endsShot,
      totalEnds: counts.totalEnds,
      shootOffArrows: shootOff,
      trust,
      className: archer.class_name,
    },
    xs: counts.xs,
    nines: counts.nines,
    inTeam: !!archer.in_team,
  };
}

function rankDivision(
  division: { id: number; name: string; cut: number | null },
  round: RoundDefinition,
  scored: Scored[],
  teamSize: number,
): DivisionStandings {
  const cut = division.cut ?? undefined;
  const opts = { venue: round.venue, ...(cut !== undefined ? { cut } : {}) };
  const byId = new Map(scored.map((s) => [String(s.row.entryId), s.row]));
  // One input serves both rankings: rankTeams reads club and inTeam, rankArchers the shoot-off.
  const input = scored.map((s) => ({
    id: String(s.row.entryId),
    club: s.row.club,
    inTeam: s.inTeam,
    total: s.row.total,
    tens: s.row.tens,
    xs: s.xs,
    nines: s.nines,
    complete: s.row.endsShot === s.row.totalEnds,
    shootOff: s.row.shootOffArrows as ShootOffArrow[],
  }));
  const ranked = (archers: typeof input, rankOpts: typeof opts): StandingRow[] =>
    rankArchers(archers, rankOpts).map((r) =>
      // Object.assign rather than a spread with extra keys: much quicker in V8 (see rankArchers).
      Object.assign({}, byId.get(r.id)!, {
        place: r.place,
        tied: r.tied,
        shootOff: r.shootOff,
        decidedByShootOff: r.decidedByShootOff,
      }),
    );
  const rows = ranked(input, opts);
  // Each class on its own: its medal places by the same rules; the cut is the division's, not a class's.
  const classNames = [...new Set(scored.map((s) => s.row.className).filter((c) => c !== ''))].sort((a, b) =>
    a.localeCompare(b),
  );
  const classes = classNames.map((name) => ({
    name,
    rows: ranked(
      input.filter((a) => byId.get(a.id)!.className === name),
      { venue: round.venue },
    ),
  }));
  const teams = rankTeams(input, { ...opts, teamSize }).map((t) => ({
    club: t.club,
    members: t.members.map((m) => {
      const s = byId.get(m)!;
      return { entryId: s.entryId, name: s.name, total: s.total };
    }),
    total: t.total,
    tens: t.tens,
    second: round.venue === 'indoor' ? t.nines : t.xs,
    place: t.place,
    tied: t.tied,
    shootOff: t.shootOff,
  }));
  return {
    divisionId: division.id,
    name: division.name,
    roundName: round.name,
    venue: round.venue,
    secondCount: round.venue === 'indoor' ? '9s' : 'Xs',
    cut: division.cut,
    rows,
    teams,
    classes,
  };
}

/**
 * The standings of every session and division of an event, computed by the core from the cards
 * as they stand: each archer's decided ends (agreed, settled, ruled or signed), ranked with the
 * tie rules of the division's round, shoot-offs and team places included. The card counts come
 * from `held` (kept between calls, only changed cards read again); without it every card is read.
 */
export async function computeResults(
  db: Db,
  event: ResultsEvent,
  held: HeldCardCounts = heldCardCounts(),
): Promise<EventResults> {
  const sessions = (await db('event_sessions')
    .where({ event_id: event.id })
    .orderBy([{ column: 'starts_at' }, { column: 'id' }])
    .select('id', 'name')) as { id: number; name: string }[];
  const sessionIds = sessions.map((s) => s.id);
  const divisions = await sessionDivisions(db, sessionIds);
  const cuts = new Map(
    (
      (await db('divisions').where({ event_id: event.id }).select('id', 'cut_size')) as {
        id: number;
        cut_size: number | null;
      }[]
    ).map((d) => [d.id, d.cut_size]),
  );
  const archers = (await db('target_assignments as ta')
    .join('entries as e', 'e.id', 'ta.entry_id')
    .whereIn('ta.session_id', sessionIds)
    .select(
      'ta.session_id',
      'ta.entry_id',
      'ta.target_number',
      'e.name',
      'e.club',
      'e.in_team',
      'e.division_id',
      'e.class_name',
    )) as ArcherRow[];
  const rounds = new Map(
    divisions.map((d) => [
      `${d.session_id}:${d.division_id}`,
      { json: d.round_json, round: parseRound(d.round_json) },
    ]),
  );
  const wanted: WantedCard[] = [];
  for (const a of archers) {
    const round = rounds.get(`${a.session_id}:${a.division_id}`);
    if (round)
      wanted.push({
        sessionId: a.session_id,
        entryId: a.entry_id,
        targetNumber: a.target_number,
        roundJson: round.json,
        round: round.round,
      });
  }
  const [counts, finals, shootOffs] = await Promise.all([
    held.counts(db, event.id, wanted),
    finalCards(db, sessionIds),
    shootOffArrows(db, sessionIds),
  ]);

  let totalCards = 0;
  let finalCount = 0;
  const standings = [];
  for (const session of sessions) {
    const inSession = archers.filter((a) => a.session_id === session.id);
    const result: DivisionStandings[] = [];
    for (const d of divisions.filter((sd) => sd.session_id === session.id)) {
      const round = rounds.get(`${session.id}:${d.division_id}`)!.round;
      const scored = inSession
        .filter((a) => a.division_id === d.division_id)
        .map((a) => {
          const key = cardKey(session.id, a.entry_id);
          return scoreArcher(a, round, counts.get(key)!, finals.has(key), shootOffs.get(key) ?? []);
        });
      totalCards += scored.length;
      finalCount += scored.filter((s) => s.row.trust === 'final').length;
      const division = { id: d.division_id, name: d.division_name, cut: cuts.get(d.division_id) ?? null };
      result.push(rankDivision(division, round, scored, event.teamSize));
    }
    standings.push({ sessionId: session.id, name: session.name, divisions: result });
  }
  return {
    event: {
      id: event.id,
      name: event.name,
      venue: event.venue,
      published: event.published,
      teamSize: event.teamSize,
    },
    computedAt: nowIso(),
    finalCards: finalCount,
    totalCards,
    sessions: standings,
  };
}
