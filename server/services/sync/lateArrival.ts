import { LATE_HELD_REASON } from '../../../src/contract/lateValues';
import type { FieldBatch } from './fieldBatch';
import type { Placement } from './fieldPlacements';

/** Thrown by the field rules when a writer's or caller's change reaches a closed session. */
export class LateArrival extends Error {
  constructor(readonly placement: Placement) {
    super(LATE_HELD_REASON);
    this.name = 'LateArrival';
  }
}

/**
 * The hook in the field rules: a change from the person who keeps the task, to a closed session,
 * is held for a judge, unless this batch is applying a judge's acceptance of it.
 */
export function holdIfClosed(batch: FieldBatch, placement: Placement): void {
  if (placement.session.closed && !batch.acceptingLate) throw new LateArrival(placement);
}
