import type { RoundDefinition } from '../../../src/core';
import type { TargetPackage } from '../../../src/contract/sync';
import type { Db } from '../../db';

export type TargetArcher = TargetPackage['archers'][number];

/**
 * The archers on one target in card order (positions A–D), each with the round snapshot their
 * division shoots in the session. An archer whose division has no round there cannot be scored
 * and is left out (the organizer's target list flags that case).
 */
export async function targetArchers(
  db: Db,
  sessionId: number,
  targetNumber: number,
): Promise<TargetArcher[]> {
  const rows = await db('target_assignments as ta')
    .join('entries as e', 'e.id', 'ta.entry_id')
    .join('divisions as d', 'd.id', 'e.division_id')
    .join('session_divisions as sd', (j) =>
      j.on('sd.session_id', 'ta.session_id').andOn('sd.division_id', 'e.division_id'),
    )
    .where({ 'ta.session_id': sessionId, 'ta.target_number': targetNumber })
    .orderBy('ta.position')
    .select(
      'ta.entry_id',
      'ta.position',
      'e.name',
      'e.club',
      'd.name as division',
      'd.bow_style',
      'sd.round_json',
    );
  return rows.map((r) => ({
    entryId: r.entry_id,
    position: r.position,
    name: r.name,
    club: r.club,
    division: r.division,
    bowStyle: r.bow_style,
    round: JSON.parse(r.round_json) as RoundDefinition,
  }));
}
