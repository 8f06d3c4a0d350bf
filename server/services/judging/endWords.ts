import type { EndFacts, EndView } from '../../../src/core';
import type { ArrowFlag } from '../../../src/contract/fieldTerms';

/*
 * The words judges and writers read about an end: which arrows, which incidents, and why an end
 * cannot be signed yet. Arrow numbers count from 1 in the end as written, highest first.
 */

const FLAG_WORDS: Record<string, string> = {
  'bounce-out': 'a bounce-out',
  'pass-through': 'a pass-through',
  missing: 'a missing arrow',
  hanging: 'a hanging arrow',
  'judge-needed': 'a call for a judge',
};

export const flagWords = (flag: string): string => FLAG_WORDS[flag] ?? `a ${flag} mark`;

/** "a, b and c" */
export function listInWords(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

/** Positions (0-based) as "arrow 2" or "arrows 2 and 5". */
export const arrowsInWords = (positions: readonly number[]): string =>
  `${positions.length === 1 ? 'arrow' : 'arrows'} ${listInWords(positions.map((p) => String(p + 1)))}`;

/** The incidents marked on the writers' records, once each (both writers may mark the same one). */
export function incidentsOf(facts: EndFacts): { index: number; flag: ArrowFlag }[] {
  const seen = new Map<string, { index: number; flag: ArrowFlag }>();
  // Writers' flags are stored from the contract's ArrowFlag values (core keeps them as strings).
  for (const f of [...(facts.first?.flags ?? []), ...(facts.second?.flags ?? [])])
    seen.set(`${f.index}:${f.flag}`, { index: f.index, flag: f.flag as ArrowFlag });
  return [...seen.values()].sort((a, b) => a.index - b.index || a.flag.localeCompare(b.flag));
}

/** "a bounce-out on arrow 5 and a missing arrow on arrow 6" */
export const incidentsInWords = (incidents: readonly { index: number; flag: string }[]): string =>
  listInWords(incidents.map((i) => `${flagWords(i.flag)} on arrow ${i.index + 1}`));

/** Positions where the two writers' cards differ. */
export const differingPositions = (view: EndView): number[] =>
  view.check.arrows.filter((a) => !a.same).map((a) => a.index);

/** Why a judge cannot sign an end yet; `endLabel` is "End 3 of Ada Fletcher". */
export function whyNotSignable(endLabel: string, facts: EndFacts, view: EndView): string {
  switch (view.state) {
    case 'open':
      return `${endLabel} has no arrows yet, so there is nothing to sign.`;
    case 'entered':
      return `${endLabel} has only one writer's card so far. Wait for the other card, or rule on the end.`;
    case 'mismatch':
      return (
        `${endLabel}: the two cards still differ at ${arrowsInWords(differingPositions(view))}` +
        `${view.settlementStale ? ' (a writer changed the end after the caller settled it)' : ''}. ` +
        'The caller settles it, or rule on the end.'
      );
    case 'disputed':
      return `${endLabel}: ${arrowsInWords(facts.settlement?.disputed ?? [])} ${
        (facts.settlement?.disputed.length ?? 0) === 1 ? 'is' : 'are'
      } still disputed. Rule on the end first.`;
    case 'signed':
      return `${endLabel} is already signed.`;
    default: {
      const incidents = incidentsOf(facts);
      const verb = incidents.length === 1 ? 'needs' : 'need';
      return `${endLabel}: ${incidentsInWords(incidents)} ${verb} a ruling first.`;
    }
  }
}
