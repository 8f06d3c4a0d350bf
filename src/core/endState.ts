import type { ArrowValue } from './arrowValue';
import { crossCheck, type CrossCheck } from './crossCheck';
import { sortEnd } from './ends';

/** The states an end goes through (Ringcall's names, see DEVELOPERS.md). */
export type EndState = 'open' | 'entered' | 'agreed' | 'mismatch' | 'settled' | 'disputed' | 'signed';

export interface WriterRecord {
  arrows: readonly ArrowValue[];
  /** Server revision of this writer's record; a settlement names the revisions it looked at. */
  revision: number;
  /** Incidents marked on arrows (bounce-out, pass-through…): a judge must rule before signing. */
  flags?: readonly { index: number; flag: string }[];
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
  /** A judge's latest ruling decides the end's values, over the writers and the caller. */
  ruling?: { arrows: readonly ArrowValue[] } | undefined;
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
  /** Who decided the values that count. */
  decidedBy?: 'writers' | 'caller' | 'judge';
  /** Incidents marked on the writers' records that no ruling has answered yet. */
  openIncidents: number;
  /** A judge may sign: the values are decided and no incident waits. */
  canSign: boolean;
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
  const openIncidents = facts.ruling
    ? 0
    : (facts.first?.flags?.length ?? 0) + (facts.second?.flags?.length ?? 0);
  const base = { check, settlementStale, openIncidents };
  const view = ((): Omit<EndView, 'openIncidents' | 'canSign'> => {
    if (facts.signedArrows) return { ...base, state: 'signed', arrows: sortEnd(facts.signedArrows) };
    if (facts.ruling)
      return { ...base, state: 'settled', arrows: sortEnd(facts.ruling.arrows), decidedBy: 'judge' };
    if (facts.settlement && !settlementStale) {
      return facts.settlement.disputed.length > 0
        ? { ...base, state: 'disputed' }
        : { ...base, state: 'settled', arrows: sortEnd(facts.settlement.arrows), decidedBy: 'caller' };
    }
    if (!facts.first && !facts.second) return { ...base, state: 'open' };
    if (check.status === 'waiting') return { ...base, state: 'entered' };
    if (check.status === 'agreed')
      return { ...base, state: 'agreed', arrows: sortEnd(facts.first!.arrows), decidedBy: 'writers' };
    return { ...base, state: 'mismatch' };
  })();
  return {
    ...view,
    openIncidents,
    canSign: (view.state === 'agreed' || view.state === 'settled') && openIncidents === 0,
  };
}

/** What an end said before a ruling: decided values (and by whom), or each writer's card. */
export type ValuesBefore =
  | { by: 'writers' | 'caller' | 'judge'; arrows: ArrowValue[] }
  | { by: 'cards'; first?: ArrowValue[] | undefined; second?: ArrowValue[] | undefined };

/**
 * Each ruling on an end with the values it replaced: the first replaced what the writers or the
 * caller decided (or, when nothing was decided, the two cards), each later one the ruling before.
 * `rulings` are oldest first; the signature is left out, as a ruling is what replaces it.
 */
export function rulingSteps<R extends { arrows: readonly ArrowValue[] }>(
  facts: EndFacts,
  rulings: readonly R[],
): { ruling: R; before: ValuesBefore }[] {
  const unjudged = endView({ ...facts, ruling: undefined, signedArrows: undefined });
  let before: ValuesBefore =
    unjudged.arrows && unjudged.decidedBy
      ? { by: unjudged.decidedBy, arrows: unjudged.arrows }
      : {
          by: 'cards',
          first: facts.first && [...facts.first.arrows],
          second: facts.second && [...facts.second.arrows],
        };
  return rulings.map((ruling) => {
    const step = { ruling, before };
    before = { by: 'judge', arrows: sortEnd(ruling.arrows) };
    return step;
  });
}
