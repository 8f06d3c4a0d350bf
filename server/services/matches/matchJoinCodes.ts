import type { MatchJoinCodeDto } from '../../../src/contract/matches';
import type { Db } from '../../db';
import { nowIso } from '../../time';
import { randomJoinCode } from '../organizer/joinCodes';

/** A code no target and no other match has: the join screen takes either. */
async function unusedCode(db: Db): Promise<string> {
  for (let attempt = 0; attempt < 20; attempt += 1) {
    const code = randomJoinCode();
    const [target, match] = await Promise.all([
      db('join_codes').where({ code }).first('id'),
      db('match_join_codes').where({ code }).first('id'),
    ]);
    if (!target && !match) return code;
  }
  throw new Error('Could not draw an unused join code after 20 attempts.');
}

/**
 * The join codes of an event's open matches whose two archers are known, each made the first time
 * it is asked for and kept after (a code read out or written down keeps working).
 */
export async function matchJoinCodes(db: Db, eventId: number): Promise<MatchJoinCodeDto[]> {
  return db.transaction(async (trx) => {
    const ready = (await trx('matches as m')
      .join('brackets as b', 'b.id', 'm.bracket_id')
      .join('match_sides as s', 's.match_id', 'm.id')
      .leftJoin('match_join_codes as c', 'c.match_id', 'm.id')
      .where({ 'b.event_id': eventId })
      .whereNull('m.winner_side')
      .groupBy('m.id', 'c.code')
      .havingRaw('count(s.id) = 2')
      .orderBy('m.id')
      .select('m.id as matchId', 'c.code')) as { matchId: number; code: string | null }[];
    const out: MatchJoinCodeDto[] = [];
    for (const r of ready) {
      let code = r.code;
      if (!code) {
        code = await unusedCode(trx);
        await trx('match_join_codes').insert({
          match_id: r.matchId,
          code,
          created_at: nowIso(),
        });
      }
      out.push({ matchId: r.matchId, code });
    }
    return out;
  });
}
