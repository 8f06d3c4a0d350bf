import type { EndWriteArgs } from '../../../src/contract/sync';
import { nextEndEntry, transcriptionLabel, type Author } from './effects';
import type { FieldBatch } from './fieldBatch';
import { Refusal, checkArrows, checkEnd, refuseIfLocked } from './fieldRules';

/**
 * A writer's record of one archer's end. Writer 1 keeps slot 1 and writer 2 slot 2, each its own
 * record; a new write replaces only that writer's record, one revision on. A partial end is fine
 * (the writer may still be tapping); values the archer's face cannot score and too many arrows
 * are refused, and so is any change to an end a judge has ruled on or signed. Throws Refusal,
 * changing nothing, when a rule is broken.
 */
export function applyEndWrite(batch: FieldBatch, args: EndWriteArgs, by: Author): void {
  const card = args.slot === 1 ? 'first' : 'second';
  const checked = checkEnd(
    batch,
    args,
    by.userId,
    args.slot === 1 ? 'writer1' : 'writer2',
    `write the ${card} card`,
  );
  refuseIfLocked(batch, checked, args.endIndex);
  checkArrows(checked, args.arrows, true);
  for (const { index, flag } of args.flags) {
    if (index >= args.arrows.length) {
      const count = args.arrows.length === 1 ? '1 arrow' : `${args.arrows.length} arrows`;
      throw new Refusal(
        `${checked.endLabel}: the ${flag} mark is on arrow ${index + 1}, but the end has ${count}.`,
      );
    }
  }
  const row = nextEndEntry(batch.record(args.sessionId, args.entryId, args.endIndex, args.slot), args, by);
  batch.putRecord(checked.placement, row, transcriptionLabel(by));
}
