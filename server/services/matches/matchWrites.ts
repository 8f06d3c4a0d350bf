import {
  matchCrossCheck,
  matchState,
  ScoringError,
  sortEnd,
  type ArrowValue,
  type MatchEnd,
} from '../../../src/core';
import type { MatchWriteArgs } from '../../../src/contract/matches';
import type { Db } from '../../db';
import { badRequest, conflict, forbidden } from '../../http/httpError';
import { nowIso } from '../../time';
import { findMatch, loadRecords, requireBothSides, requireOpen, type MatchRow } from './matchRows';
import { writerSlot } from './matchWriters';

/*
 * Two writers score a match at its target, like a qualification end: each writer's record of an
 * end (both lines' arrows) is kept apart; the core's cross-check compares them arrow by arrow;
 * an end both wrote alike, complete, counts on the match card. A mismatch waits for the match's
 * judge, whose end (`match.end`) settles it and closes it to the writers.
 */

type WriteRow = { end_index: number; slot: number; a_json: string; b_json: string; revision: number };

const sameEnd = (x: MatchEnd, y: MatchEnd) =>
  JSON.stringify([sortEnd(x.a), sortEnd(x.b)]) === JSON.stringify([sortEnd(y.a), sortEnd(y.b)]);

/**
 * Counts the ends the writers agree on, in order: an end the judge entered stays as it is; the
 * first end they do not (yet) agree on stops the count, and so does an end the rules refuse
 * (after the match is won): those wait for the writers or the judge.
 */
async function countAgreedEnds(db: Db, match: MatchRow, userId: number): Promise<void> {
  const record = (await loadRecords(db, [match.id])).get(match.id)!;
  const writes = (await db('match_end_writes').where({ match_id: match.id })) as WriteRow[];
  const writerEnd = (slot: number, endIndex: number): MatchEnd | undefined => {
    const w = writes.find((r) => Number(r.slot) === slot && r.end_index === endIndex);
    return w && { a: JSON.parse(w.a_json) as ArrowValue[], b: JSON.parse(w.b_json) as ArrowValue[] };
  };
  const ends = [...record.ends];
  for (let i = 0; ; i += 1) {
    const counted = ends[i];
    if (counted?.by === 'judge') continue;
    const { agreed } = matchCrossCheck(writerEnd(1, i), writerEnd(2, i));
    if (!agreed) return;
    if (counted && sameEnd(counted, agreed)) continue;
    const next = [...ends];
    next[i] = { a: [...agreed.a], b: [...agreed.b], by: 'writers' };
    try {
      matchState(match.format, { ends: next, shootOff: record.shootOff });
    } catch (error) {
      if (error instanceof ScoringError) return;
      throw error;
    }
    const row = {
      a_json: JSON.stringify(agreed.a),
      b_json: JSON.stringify(agreed.b),
      source: 'writers',
      recorded_by: userId,
      recorded_at: nowIso(),
    };
    await db('match_ends')
      .insert({ match_id: match.id, end_index: i, ...row })
      .onConflict(['match_id', 'end_index'])
      .merge(row);
    ends.splice(0, ends.length, ...next);
  }
}

/** A writer's record of one end of a match (replacing their previous record of it). */
export async function recordMatchWrite(db: Db, args: MatchWriteArgs, userId: number): Promise<void> {
  const match = await findMatch(db, args.eventId, args.matchId);
  const slot = await writerSlot(db, match.id, userId);
  if (!slot)
    throw forbidden(
      'Only the two writers of this match can score it: its archers or named scorers, after joining it with its code.',
    );
  requireOpen(match);
  await requireBothSides(db, match.id);
  const n = args.endIndex + 1;
  const judged = (await db('match_ends')
    .where({ match_id: match.id, end_index: args.endIndex, source: 'judge' })
    .first('id')) as { id: number } | undefined;
  if (judged) throw conflict(`The judge settled end ${n} of this match; only the judge can change it now.`);
  const own = (await db('match_end_writes')
    .where({ match_id: match.id, slot })
    .select('end_index', 'revision')) as Pick<WriteRow, 'end_index' | 'revision'>[];
  if (args.endIndex > 0 && !own.some((w) => w.end_index === args.endIndex - 1))
    throw badRequest(`Write end ${n - 1} of this match before end ${n}.`);
  const previous = own.find((w) => w.end_index === args.endIndex);
  const row = {
    a_json: JSON.stringify(args.a),
    b_json: JSON.stringify(args.b),
    user_id: userId,
    revision: (previous?.revision ?? 0) + 1,
    written_at: nowIso(),
  };
  await db('match_end_writes')
    .insert({ match_id: match.id, end_index: args.endIndex, slot, ...row })
    .onConflict(['match_id', 'end_index', 'slot'])
    .merge(row);
  await countAgreedEnds(db, match, userId);
}
