import { bracketSize, firstRound, MAX_BRACKET_ENTRANTS } from '../../../src/core/matches';
import type { CreateBracket } from '../../../src/contract/matches';
import type { StandingRow } from '../../../src/contract/results';
import type { Db } from '../../db';
import { badRequest, conflict, notFound } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { findResultsEvent } from '../results/resultsEvent';
import { computeResults } from '../results/standings';
import { advance, placeSide } from './advance';

/** The division's final standings in the session, refused while they are not final. */
async function finalStandings(db: Db, eventId: number, sessionId: number, divisionId: number) {
  const results = await computeResults(db, await findResultsEvent(db, eventId));
  const session = results.sessions.find((s) => s.sessionId === sessionId);
  if (!session) throw notFound('That session does not exist in this event.');
  const division = session.divisions.find((d) => d.divisionId === divisionId);
  if (!division) throw notFound('That division does not shoot in this session.');
  const unfinished = division.rows.filter((r) => r.endsShot < r.totalEnds);
  if (unfinished.length > 0) {
    const who = unfinished.length === 1 ? '1 archer still has' : `${unfinished.length} archers still have`;
    throw conflict(`${who} ends to shoot in ${division.name}: a bracket is seeded from the final standings.`);
  }
  return division;
}

function entrantsFor(
  size: CreateBracket['size'],
  division: { name: string; cut: number | null; rows: StandingRow[] },
): number {
  const entrants = size === 'everyone' ? (division.cut ?? division.rows.length) : size;
  if (entrants > division.rows.length) {
    throw badRequest(
      `${division.name} has ${division.rows.length} archers in the standings, fewer than ${entrants}.`,
    );
  }
  if (entrants > MAX_BRACKET_ENTRANTS) {
    throw badRequest(`A bracket takes at most ${MAX_BRACKET_ENTRANTS} archers; choose a size.`);
  }
  const seeded = division.rows.slice(0, entrants);
  const open = seeded.find((r) => r.shootOff);
  const last = seeded.at(-1);
  const next = division.rows[entrants];
  if (open || (last && next && last.place === next.place)) {
    throw conflict(
      `Archers are level at place ${(open ?? last)!.place} and the bracket's cut runs through them: ` +
        `set the division's cut to ${entrants} and record their shoot-off first.`,
    );
  }
  return entrants;
}

/**
 * Seeds a division's bracket from a session's final standings (place order; WA chart order in
 * the core) and writes every match of it, the bronze match included; byes are decided at once
 * and their archers moved on.
 */
export async function createBracket(
  db: Db,
  eventId: number,
  userId: number,
  body: CreateBracket,
): Promise<number> {
  const divisionRow = (await db('divisions')
    .where({ id: body.divisionId, event_id: eventId })
    .first('id', 'bow_style')) as { id: number; bow_style: string } | undefined;
  if (!divisionRow) throw notFound('That division does not exist in this event.');
  if (await db('brackets').where({ event_id: eventId, division_id: body.divisionId }).first('id')) {
    throw conflict('This division already has a bracket.');
  }
  const division = await finalStandings(db, eventId, body.sessionId, body.divisionId);
  const entrants = entrantsFor(body.size, division);
  const size = bracketSize(entrants);
  const rounds = Math.log2(size);
  const format = body.format ?? (divisionRow.bow_style === 'compound' ? 'cumulative' : 'sets');
  const now = nowIso();

  return db.transaction(async (trx) => {
    const [b] = await trx('brackets')
      .insert({
        event_id: eventId,
        division_id: body.divisionId,
        session_id: body.sessionId,
        format,
        entrants,
        size,
        created_by: userId,
        created_at: now,
      })
      .returning('id');
    const bracketId = (b as { id: number }).id;
    const rows = [];
    for (let round = 0; round < rounds; round += 1) {
      for (let slot = 0; slot < size / 2 ** (round + 1); slot += 1)
        rows.push({ bracket_id: bracketId, round, slot, bronze: false });
    }
    rows.push({ bracket_id: bracketId, round: rounds - 1, slot: 0, bronze: true });
    await trx('matches').insert(rows);
    const firstIds = (await trx('matches')
      .where({ bracket_id: bracketId, round: 0 })
      .orderBy('slot')
      .select('id')) as {
      id: number;
    }[];
    const entryOf = (seed: number) => division.rows[seed - 1]!.entryId;
    for (const [slot, m] of firstRound(entrants).entries()) {
      const matchId = firstIds[slot]!.id;
      await placeSide(trx, matchId, 'a', m.a, [entryOf(m.a)]);
      if (m.b !== null) {
        await placeSide(trx, matchId, 'b', m.b, [entryOf(m.b)]);
        continue;
      }
      await trx('matches')
        .where({ id: matchId })
        .update({ winner_side: 'a', decided_by: 'bye', signed_at: now });
      await advance(trx, { id: matchId, bracket_id: bracketId, round: 0, slot, bronze: false, size }, 'a');
    }
    await audit(trx, {
      userId,
      eventId,
      action: 'bracket.create',
      details: { bracketId, divisionId: body.divisionId, entrants },
    });
    return bracketId;
  });
}
