import { endView } from '../../core';
import type { LocalEnd } from '../../local/endFacts';
import { flagWords, openFlags } from '../../ui/scorecard/endFlags';

export type PullAdvice = { kind: 'pull' | 'wait' | 'hold'; text: string };

const list = (n: readonly number[]) => n.map((i) => i + 1).join(', ');

/**
 * What the caller tells the target about pulling arrows for one end. Arrows are pulled only when
 * every archer's end is agreed or settled with no flag: a flagged, disputed or mismatched arrow
 * keeps them in the boss until its hole is marked and a judge (or the caller, for a mismatch) has
 * seen it.
 */
export function pullAdvice(rows: readonly { position: string; local: LocalEnd | undefined }[]): PullAdvice {
  const holds: string[] = [];
  const waiting: string[] = [];
  for (const { position, local } of rows) {
    const view = local && endView(local.facts);
    const flags = openFlags(local);
    if (flags.length > 0) holds.push(`${position}: ${flagWords(flags, false).toLowerCase()}`);
    if (view?.state === 'mismatch')
      holds.push(
        `${position}: the cards differ at arrow ${list(view.check.arrows.filter((a) => !a.same).map((a) => a.index))}`,
      );
    else if (view?.state === 'disputed')
      holds.push(`${position}: arrow ${list(local?.facts.settlement?.disputed ?? [])} is with a judge`);
    else if (!view || view.state === 'open' || view.state === 'entered') waiting.push(position);
  }
  if (holds.length > 0)
    return {
      kind: 'hold',
      text: `Do not pull yet. ${holds.join('; ')}. Mark the holes first: call a judge for flagged and disputed arrows, settle mismatches below.`,
    };
  if (waiting.length > 0)
    return {
      kind: 'wait',
      text: `Waiting for both writers' cards of ${waiting.join(', ')}. Do not pull until every end on this target is agreed.`,
    };
  return { kind: 'pull', text: 'Every end on this target is agreed, with no flag: arrows can be pulled.' };
}
