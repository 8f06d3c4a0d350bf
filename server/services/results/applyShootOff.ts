import type { ShootOffRecordArgs } from '../../../src/contract/results';
import type { Author } from '../sync/effects';
import type { FieldBatch } from '../sync/fieldBatch';
import { findPlacement, refuse } from '../sync/fieldRules';

/**
 * A judge records one shoot-off arrow of an archer placed in the session (also once the session
 * is closed: shoot-offs come after the last end). Whether the arrow matters is the standings'
 * business: arrows of an archer whose tie decides nothing are kept but not used.
 */
export function applyShootOff(batch: FieldBatch, args: ShootOffRecordArgs, by: Author): void {
  findPlacement(batch, args, (session) => {
    if (!batch.isJudge(by.userId, session.eventId))
      refuse('Only a judge of this event can record a shoot-off.');
  });
  batch.putShootOffArrow({
    session_id: args.sessionId,
    entry_id: args.entryId,
    arrow_index: args.arrowIndex,
    value: args.value,
    distance_mm: args.distanceMm ?? null,
    closer: args.closer,
    recorded_by: by.userId,
    recorded_at: by.at,
    mutation_id: by.mutationId,
  });
}
