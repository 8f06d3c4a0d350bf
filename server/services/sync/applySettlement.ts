import { crossCheck } from '../../../src/core';
import type { EndSettleArgs } from '../../../src/contract/sync';
import { settlementRow, transcriptionLabel, type Author } from './effects';
import type { FieldBatch } from './fieldBatch';
import { decodeEndEntry } from './fieldRows';
import { Refusal, checkArrows, checkEnd, refuseIfLocked } from './fieldRules';

export const STALE_BASIS_REASON = 'A writer changed this end after you looked at it. Check the end again.';

/**
 * The caller's decision on a mismatch between the two writers: the agreed end (complete), and
 * the positions sent to a judge. It must name the writers' current revisions, so a settlement
 * made while a writer was still changing the end is refused rather than applied to other values.
 * Settling the same mismatch again replaces the earlier settlement. Throws Refusal, changing
 * nothing, when a rule is broken.
 */
export function applySettlement(batch: FieldBatch, args: EndSettleArgs, by: Author): void {
  const checked = checkEnd(batch, args, by.userId, 'caller', 'settle an end');
  refuseIfLocked(batch, checked, args.endIndex);
  const { endLabel } = checked;

  const first = batch.record(args.sessionId, args.entryId, args.endIndex, 1);
  const second = batch.record(args.sessionId, args.entryId, args.endIndex, 2);
  if (!first || !second)
    throw new Refusal(`${endLabel} cannot be settled until both writers' entries are in.`);
  if (args.basis.first !== first.revision || args.basis.second !== second.revision)
    throw new Refusal(STALE_BASIS_REASON);
  const check = crossCheck(decodeEndEntry(first).arrows, decodeEndEntry(second).arrows);
  if (check.status !== 'mismatch')
    throw new Refusal(`${endLabel}: the two writers agree, so there is nothing to settle.`);

  checkArrows(checked, args.arrows, false);
  for (const position of args.disputed) {
    if (position >= args.arrows.length) {
      throw new Refusal(
        `${endLabel}: arrow ${position + 1} cannot go to a judge; the end has ${args.arrows.length} arrows.`,
      );
    }
  }
  const row = settlementRow(args, by);
  batch.putSettlement(checked.placement, row, transcriptionLabel(by));
}
