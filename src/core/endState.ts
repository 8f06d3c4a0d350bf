import type { ArrowValue } from './arrowValue';
import { crossCheck, type CrossCheck } from './crossCheck';
import { sortEnd } from './ends';

/** The states an end goes through (Ringcall's names, see DEVELOPERS.md). */
export type EndState = 'open' | 'entered' | 'agreed' | 'mismatch' | 'settled' | 'disputed' | 'signed';

export interface WriterRecord {
  arrows: readonly ArrowValue[];
  /** Server revision of this writer's record; a settlement names the revisions it looked at. */
  revision: number;
}

export interface Settlement {
  arrows: readonly ArrowValue[];
  /** Positions (in the sorted end) the caller sent to a judge instead of settling. */
  disputed: readonly number[];
  basis: { first: number; second: number };
}

export interface EndFacts {
  first?: WriterRecord | undefined;
  second?: WriterRecord | undefined;
  settlement?: Settlement | undefined;
  /** A judge's signature fixes the end whatever the records say later. */
  signedArrows?: readonly ArrowValue[] | undefined;
}

export interface EndView {
  state: EndState;
  check: CrossCheck;
  /** The values that count for the card, when the end has them. */
  arrows?: ArrowValue[];
  /** True when a settlement exists but a writer changed their record after it. */
  settlementStale: boolean;
}

/** Whether a caller's settlement still speaks for both writers' current records. */
export function settlementApplies(facts: EndFacts): boolean {
  const s = facts.settlement;
  return (
    !!s && s.basis.first === (facts.first?.revision ?? 0) && s.basis.second === (facts.second?.revision ?? 0)
  );
}

/**
 * Derives an end's state from its separate records. The same function runs on the phone and on
 * the server, so both always tell the same story.
 */
export function endView(facts: EndFacts): EndView {
  const check = crossCheck(facts.first?.arrows, facts.second?.arrows);
  const settlementStale = !!facts.settlement && !settlementApplies(facts);
  if (facts.signedArrows)
    return { state: 'signed', check, arrows: sortEnd(facts.signedArrows), settlementStale };
  if (facts.settlement && !settlementStale) {
    const disputed = facts.settlement.disputed.length > 0;
    return disputed
      ? { state: 'disputed', check, settlementStale }
      : { state: 'settled', check, arrows: sortEnd(facts.settlement.arrows), settlementStale };
  }
  if (!facts.first && !facts.second) return { state: 'open', check, settlementStale };
  if (check.status === 'waiting') return { state: 'entered', check, settlementStale };
  if (check.status === 'agreed')
    return { state: 'agreed', check, arrows: sortEnd(facts.first!.arrows), settlementStale };
  return { state: 'mismatch', check, settlementStale };
}
