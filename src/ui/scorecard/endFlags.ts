import type { ArrowFlag } from '../../contract/sync';
import type { LocalEnd } from '../../local/endFacts';

export const FLAG_LABELS: Record<ArrowFlag, string> = {
  'bounce-out': 'Bounce-out',
  'pass-through': 'Pass-through',
  missing: 'Missing arrow',
  hanging: 'Hanging arrow',
  'judge-needed': 'Judge needed',
};

/** An incident marked on an arrow, with the writers whose card marks it. */
export type MarkedArrow = { index: number; flag: ArrowFlag; slots: (1 | 2)[] };

/**
 * The incidents marked on either writer's card that no ruling has answered yet, once each: what
 * every phone of the target shows, and why the caller must not let arrows be pulled.
 */
export function openFlags(local: LocalEnd | undefined): MarkedArrow[] {
  if (!local || local.ruling) return [];
  const marked: MarkedArrow[] = [];
  for (const slot of [1, 2] as const) {
    for (const { index, flag } of local.slots[slot]?.flags ?? []) {
      const same = marked.find((m) => m.index === index && m.flag === flag);
      if (same) same.slots.push(slot);
      else marked.push({ index, flag, slots: [slot] });
    }
  }
  return marked.sort((a, b) => a.index - b.index);
}

/** "Bounce-out on arrow 3", with whose card marks it when only one does. */
export function flagWords(flags: readonly MarkedArrow[], withCards = true): string {
  return flags
    .map(
      (f) =>
        `${FLAG_LABELS[f.flag]} on arrow ${f.index + 1}` +
        (withCards && f.slots.length === 1 ? ` (writer ${f.slots[0]}'s card)` : ''),
    )
    .join('; ');
}
