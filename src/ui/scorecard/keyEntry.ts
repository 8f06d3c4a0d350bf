import type { ArrowValue } from '../../core';

/** How long a lone "1" waits for a "0" before it counts as 1 (ms). */
export const LONE_ONE_WAIT_MS = 800;

export type KeyStep = {
  /** Values the keys so far have decided, in order. */
  values: ArrowValue[];
  /** A "1" that may still become 10. */
  pending: boolean;
  /** Whether the key meant something here (the page then keeps it from scrolling or typing). */
  handled: boolean;
};

/** A lone "1" once nothing more is coming: 1 where the face has it, else nothing. */
export const flushLoneOne = (allowed: readonly ArrowValue[]): ArrowValue[] =>
  allowed.includes('1') ? ['1'] : [];

function fresh(key: string, allowed: readonly ArrowValue[]): KeyStep {
  // "1" on a face that has 10 cannot be decided yet: it may be the first key of "10".
  if (key === '1' && allowed.includes('10')) return { values: [], pending: true, handled: true };
  const value = (key === '0' ? '10' : key) as ArrowValue;
  return allowed.includes(value)
    ? { values: [value], pending: false, handled: true }
    : { values: [], pending: false, handled: false };
}

/**
 * Keyboard entry on a desktop or a phone with a keyboard: 1–9, 10 typed as "1" then "0" (or "0"
 * alone), X and M, only values of this face. A "1" that could start 10 waits for the next key:
 * "0" makes it 10, Enter or space (or the wait running out) makes it 1, any other value key
 * makes it 1 and then counts itself.
 */
export function feedKey(pending: boolean, rawKey: string, allowed: readonly ArrowValue[]): KeyStep {
  const key = rawKey === ' ' || rawKey === 'Enter' ? 'ENTER' : rawKey.toUpperCase();
  if (!pending) return key === 'ENTER' ? { values: [], pending: false, handled: false } : fresh(key, allowed);
  if (key === '0') return { values: allowed.includes('10') ? ['10'] : [], pending: false, handled: true };
  if (key === 'ENTER') return { values: flushLoneOne(allowed), pending: false, handled: true };
  const next = fresh(key, allowed);
  return { values: [...flushLoneOne(allowed), ...next.values], pending: next.pending, handled: true };
}
