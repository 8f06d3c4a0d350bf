import { cardTotals, endView, endsOfRound, type RoundDefinition } from '../../../src/core';
import type { EndRecords } from '../judging/endRecords';

/** What the standings need of one card: its counts from the ends as they stand now. */
export type CardCounts = {
  total: number;
  tens: number;
  xs: number;
  nines: number;
  hits: number;
  endsShot: number;
  totalEnds: number;
  /** A judge signed every end of the round. */
  signed: boolean;
};

/** One archer's counts from their decided ends (agreed, settled, ruled or signed; signed ones fixed). */
export function countCard(round: RoundDefinition, records: EndRecords, entryId: number): CardCounts {
  const views = endsOfRound(round).map((end) => endView(records.facts(entryId, end.index)));
  const totals = cardTotals(
    round,
    views.map((v) => v.arrows),
  );
  return {
    total: totals.total,
    tens: totals.tens,
    xs: totals.xs,
    nines: totals.nines,
    hits: totals.hits,
    endsShot: views.filter((v) => v.arrows).length,
    totalEnds: views.length,
    signed: views.every((v) => v.state === 'signed'),
  };
}
