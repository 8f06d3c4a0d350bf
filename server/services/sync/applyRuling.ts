import type { EndRuleArgs } from '../../../src/contract/judging';
import { rulingRow, type Author } from './effects';
import type { FieldBatch } from './fieldBatch';
import { checkArrows, checkJudgeEnd, refuse } from './fieldRules';

/**
 * A judge's ruling on an end: its values (a whole end, valid on the archer's face), a reason,
 * and perhaps a photo of the target from the same event. The writers' records stay as they were:
 * the latest ruling decides the end over them. On a signed end this is the only correction
 * there is, and it supersedes the end's signature and the card's signatures (kept as history).
 * Throws Refusal, changing nothing, when a rule is broken.
 */
export function applyRuling(batch: FieldBatch, args: EndRuleArgs, by: Author): void {
  const checked = checkJudgeEnd(batch, args, by.userId, 'rule on an end');
  checkArrows(checked, args.arrows, false);
  if (args.photoId !== undefined && batch.photoEvent(args.photoId) !== checked.placement.session.eventId)
    refuse("That photo is not one of this event's photos. Upload it again from this event's judge desk.");
  batch.putRuling(checked.placement, rulingRow(args, by));
}
