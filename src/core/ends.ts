import { arrowPoints, compareArrowValues, parseArrowValue } from './arrowValue';
import type { ArrowValue } from './arrowValue';
import { ScoringError } from './errors';

/** What an end must satisfy; build it for a round with `endRules`. */
export interface EndRules {
  arrowsPerEnd: number;
  allowed: readonly ArrowValue[];
  /** Words for messages, e.g. "the 80 cm six-ring face". */
  faceDescription?: string;
  /** While a writer is still tapping, fewer arrows than the end holds are fine. */
  allowPartial?: boolean;
}

export type EndCheck = { ok: true; values: ArrowValue[] } | { ok: false; problems: string[] };

/** Highest to lowest, the order values are written on a card (WA Book 3). */
export function sortEnd(values: readonly ArrowValue[]): ArrowValue[] {
  return [...values].sort(compareArrowValues);
}

/**
 * Sorts an end highest to lowest while each mark (a flag on an arrow, by position) stays on the
 * arrow it was put on.
 */
export function sortEndWithMarks<M extends { index: number }>(
  values: readonly ArrowValue[],
  marks: readonly M[],
): { values: ArrowValue[]; marks: M[] } {
  const order = values
    .map((value, index) => ({ value, index }))
    .sort((a, b) => compareArrowValues(a.value, b.value));
  const newIndex = new Map(order.map((o, i) => [o.index, i]));
  return {
    values: order.map((o) => o.value),
    marks: marks
      .filter((m) => newIndex.has(m.index))
      .map((m) => ({ ...m, index: newIndex.get(m.index)! }))
      .sort((a, b) => a.index - b.index),
  };
}

export function endTotal(values: readonly ArrowValue[]): number {
  let total = 0;
  for (const v of values) total += arrowPoints(v);
  return total;
}

/**
 * The arrows that score, highest first. When more arrows than allowed were shot in an end,
 * only the lowest values count (WA Book 3).
 */
export function countingArrows(values: readonly ArrowValue[], arrowsPerEnd: number): ArrowValue[] {
  const sorted = sortEnd(values);
  return sorted.length > arrowsPerEnd ? sorted.slice(sorted.length - arrowsPerEnd) : sorted;
}

function arrowsWord(n: number): string {
  return n === 1 ? '1 arrow' : `${n} arrows`;
}

/**
 * Checks an end as entered (raw text is accepted, so a synced payload can be checked in one
 * step) and returns it sorted. An end with too many arrows is reported rather than trimmed:
 * deciding which arrows count is the judge's call, made with `countingArrows`.
 */
export function validateEnd(values: readonly string[], rules: EndRules): EndCheck {
  const problems: string[] = [];
  const parsed: ArrowValue[] = [];
  const face = rules.faceDescription ?? 'this face';
  const refused = new Set<string>();

  for (const raw of values) {
    let value: ArrowValue;
    try {
      value = parseArrowValue(raw);
    } catch (error) {
      if (!(error instanceof ScoringError)) throw error;
      if (!refused.has(raw)) problems.push(error.message);
      refused.add(raw);
      continue;
    }
    parsed.push(value);
    if (rules.allowed.includes(value) || refused.has(value)) continue;
    refused.add(value);
    // Compound indoors the inner ring is the 10, so an X there is a writer's habit, not a value.
    const hint = value === 'X' && rules.allowed.includes('10') ? '; write the inner ring as 10' : '';
    problems.push(`${value} is not a value on ${face}${hint}.`);
  }

  const n = values.length;
  if (n > rules.arrowsPerEnd) {
    problems.push(`End has ${arrowsWord(n)}; this round has ${rules.arrowsPerEnd} per end.`);
  } else if (n === 0 && !rules.allowPartial) {
    problems.push(`End is empty; enter ${arrowsWord(rules.arrowsPerEnd)}, M for a miss.`);
  } else if (n < rules.arrowsPerEnd && !rules.allowPartial) {
    problems.push(
      `End has ${arrowsWord(n)}; this round has ${rules.arrowsPerEnd} per end. Enter M for an arrow that missed.`,
    );
  }

  return problems.length > 0 ? { ok: false, problems } : { ok: true, values: sortEnd(parsed) };
}
