import type { ArrowValue, EndOnRecord, MatchEnd } from '../core';
import { MATCH_ARROWS_PER_END, MATCH_MAX_ENDS, countedEnds, matchCrossCheck } from '../core/matches';
import type { MatchEndDto, MatchPadDto, MatchWriteArgs } from '../contract/matches';
import type { OutboxRow } from './db';

/**
 * Where one of the writer's ends stands: it counts (agreed, or settled by the judge), it waits for
 * the other writer or the judge, or it is agreed (or settled) but waits for an earlier end to count.
 */
export type WriterEndStatus = 'counted' | 'judge' | 'waiting' | 'mismatch' | 'stopped';

export type WriterEnd = {
  a: ArrowValue[];
  b: ArrowValue[];
  /** This phone's change not yet at the server. */
  waiting: boolean;
  status: WriterEndStatus;
  /** The judge signed this end: closed to the writers. */
  signed: boolean;
};

export type MatchPadView = {
  ends: WriterEnd[];
  /** The ends that count, by the core's countedEnds with this phone's changes laid over. */
  counted: MatchEndDto[];
  /** The end being written now, or null when there is none to write (match over, all ends shot). */
  current: number | null;
  /** The end an undo takes an arrow from, or null. */
  undoEnd: number | null;
  countersigned: 'server' | 'waiting' | null;
};

const complete = (e: Pick<MatchEnd, 'a' | 'b'> | undefined) =>
  !!e && e.a.length === MATCH_ARROWS_PER_END && e.b.length === MATCH_ARROWS_PER_END;

/**
 * A writer's match pad: this writer's ends (the server's copy with this phone's changes laid over,
 * so what is on screen is what is stored), each with where it stands by the core's countedEnds
 * (the same rule as the server's) against the other writer; the end to write next; the archer's
 * countersignature.
 */
export function matchPadView(pad: MatchPadDto, rows: readonly OutboxRow[]): MatchPadView {
  const { match, slot } = pad;
  const own: { a: ArrowValue[]; b: ArrowValue[]; waiting: boolean }[] = [];
  for (const w of match.writes) if (w.slot === slot) own[w.endIndex] = { a: w.a, b: w.b, waiting: false };
  let countersigned: MatchPadView['countersigned'] =
    pad.ownEntryId !== null && match.countersignedBy.includes(pad.ownEntryId) ? 'server' : null;
  const mine = rows
    .filter((r) => r.status !== 'rejected' && 'matchId' in r.args && r.args.matchId === match.id)
    .sort((x, y) => x.seq - y.seq);
  for (const row of mine) {
    if (row.kind === 'match.write') {
      const args = row.args as MatchWriteArgs;
      own[args.endIndex] = { a: args.a, b: args.b, waiting: row.status === 'pending' };
    } else if (row.kind === 'match.countersign' && !countersigned)
      countersigned = row.status === 'pending' ? 'waiting' : 'server';
  }
  const other = (i: number) => match.writes.find((w) => w.slot !== slot && w.endIndex === i);
  // The server's judge's and signed ends are closed; the writers' other ends are counted anew here.
  const closed = (i: number) => {
    const end = match.ends[i];
    return end && (end.by !== 'writers' || end.signed) ? { ...end, by: end.by ?? 'judge' } : undefined;
  };
  const length = Math.max(own.length, match.ends.length, ...match.writes.map((w) => w.endIndex + 1));
  const records = Array.from({ length }, (_, i): EndOnRecord => {
    const end = closed(i);
    const pair = [own[i], other(i)] as const;
    return { ...(end ? { closed: end } : {}), writers: slot === 1 ? pair : [pair[1], pair[0]] };
  });
  const counted = countedEnds(pad.format, records).map((e) => ({ ...e, a: [...e.a], b: [...e.b] }));
  const ends = own.map((e, i): WriterEnd => {
    const signed = !!match.ends[i]?.signed;
    if (i < counted.length) return { ...e, status: counted[i]!.by === 'judge' ? 'judge' : 'counted', signed };
    const check = matchCrossCheck(e, other(i));
    const status = closed(i) || check.status === 'agreed' ? 'stopped' : check.status;
    return { ...e, status, signed };
  });
  const firstOpen = ends.findIndex((e) => !complete(e));
  let current: number | null = firstOpen === -1 ? ends.length : firstOpen;
  const over = match.winner !== null || match.state?.winner || match.state?.next !== 'end';
  if (current >= MATCH_MAX_ENDS || (over && current >= match.ends.length)) current = null;
  const undoable = (i: number | null) =>
    i !== null &&
    i >= 0 &&
    ends[i] !== undefined &&
    ends[i]!.status !== 'judge' &&
    ends[i]!.status !== 'counted' &&
    !ends[i]!.signed;
  const here = current !== null && (ends[current]?.a.length ?? 0) + (ends[current]?.b.length ?? 0) > 0;
  const undoEnd = here ? current : current !== null && undoable(current - 1) ? current - 1 : null;
  return {
    ends,
    counted,
    current,
    undoEnd: undoEnd !== null && undoable(undoEnd) ? undoEnd : null,
    countersigned,
  };
}
