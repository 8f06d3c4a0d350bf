// End rules: WA Book 3, scoring chapter (article numbers not given: they change between editions
// and are not known here for certain): values written highest to lowest, X counts 10, more arrows
// than allowed → the lowest count.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  sortEndWithMarks,
  countingArrows,
  endRules,
  endTotal,
  getRound,
  scoringValues,
  sortEnd,
  validateEnd,
} from '../../src/core';
import type { ArrowValue } from '../../src/core';
import { end, endAndReordering } from './arbitraries';

const sixRing = {
  arrowsPerEnd: 6,
  allowed: scoringValues('sixring-80', 'compound', 'outdoor'),
  faceDescription: 'the 80 cm six-ring face',
};

describe('sortEnd', () => {
  it('writes an end highest to lowest (WA Book 3)', () => {
    expect(sortEnd(['5', '7', '6', '10', '9', '8'])).toEqual(['10', '9', '8', '7', '6', '5']);
    expect(sortEnd(['M', '10', 'X', '9'])).toEqual(['X', '10', '9', 'M']);
  });

  it('does not change its input', () => {
    const input: ArrowValue[] = ['1', 'X'];
    sortEnd(input);
    expect(input).toEqual(['1', 'X']);
  });

  it('is idempotent (property)', () => {
    fc.assert(
      fc.property(end(), (values) => {
        expect(sortEnd(sortEnd(values))).toEqual(sortEnd(values));
      }),
    );
  });

  it('gives the same end whatever the order the arrows were tapped (property)', () => {
    fc.assert(
      fc.property(endAndReordering(), ([a, b]) => {
        expect(sortEnd(a)).toEqual(sortEnd(b));
      }),
    );
  });
});

describe('endTotal', () => {
  it('counts X as 10 and M as 0 (WA Book 3)', () => {
    expect(endTotal(['X', '10', '9'])).toBe(29);
    expect(endTotal(['X', 'X', 'X', 'X', 'X', 'X'])).toBe(60);
  });

  it('totals an M-only end and an empty end as 0', () => {
    expect(endTotal(['M', 'M', 'M'])).toBe(0);
    expect(endTotal([])).toBe(0);
  });

  it('does not depend on entry order (property)', () => {
    fc.assert(
      fc.property(endAndReordering(), ([a, b]) => {
        expect(endTotal(a)).toBe(endTotal(b));
      }),
    );
  });
});

describe('countingArrows', () => {
  it('keeps only the lowest values when too many arrows were shot (WA Book 3)', () => {
    const seven: ArrowValue[] = ['9', 'X', '7', 'M', '10', '9', '8'];
    expect(countingArrows(seven, 6)).toEqual(['10', '9', '9', '8', '7', 'M']);
    expect(endTotal(countingArrows(seven, 6))).toBe(43);
  });

  it('keeps every arrow of a full or short end, sorted', () => {
    expect(countingArrows(['7', 'X'], 3)).toEqual(['X', '7']);
    expect(countingArrows([], 3)).toEqual([]);
  });

  it('never counts more than the end allows, and never more than the lowest would give (property)', () => {
    fc.assert(
      fc.property(end(), fc.integer({ min: 1, max: 6 }), (values, perEnd) => {
        const counted = countingArrows(values, perEnd);
        expect(counted).toHaveLength(Math.min(values.length, perEnd));
        const lowest = sortEnd(values).slice(-perEnd);
        expect(endTotal(counted)).toBe(endTotal(lowest));
      }),
    );
  });
});

describe('validateEnd', () => {
  it('accepts a full end and returns it sorted', () => {
    expect(validateEnd(['7', 'X', '10', '5', 'M', '9'], sixRing)).toEqual({
      ok: true,
      values: ['X', '10', '9', '7', '5', 'M'],
    });
  });

  it('reads typed values as the pad does', () => {
    expect(
      validateEnd(['x', ' m', '10'], {
        arrowsPerEnd: 3,
        allowed: scoringValues('full-40', 'recurve', 'indoor'),
      }),
    ).toEqual({ ok: true, values: ['X', '10', 'M'] });
  });

  it('accepts an M-only end', () => {
    expect(validateEnd(['M', 'M', 'M', 'M', 'M', 'M'], sixRing)).toEqual({
      ok: true,
      values: Array(6).fill('M'),
    });
  });

  it('reports too many arrows in words', () => {
    expect(validateEnd(['X', '10', '9', '9', '8', '7', '6'], sixRing)).toEqual({
      ok: false,
      problems: ['End has 7 arrows; this round has 6 per end.'],
    });
  });

  it('names a value the face does not have, once however often it appears', () => {
    expect(validateEnd(['X', '10', '4', '9', '4', '8'], sixRing)).toEqual({
      ok: false,
      problems: ['4 is not a value on the 80 cm six-ring face.'],
    });
    expect(
      validateEnd(['7', '7', '1'], {
        arrowsPerEnd: 3,
        allowed: scoringValues('triple-40', 'recurve', 'indoor'),
      }),
    ).toEqual({
      ok: false,
      problems: ['1 is not a value on this face.'],
    });
  });

  it('refuses X for compound indoors, where the inner ring is the 10 (WA Book 3)', () => {
    const rules = endRules(getRound('18m'), 0, 'compound');
    expect(validateEnd(['X', '10', '9'], rules)).toEqual({
      ok: false,
      problems: ['X is not a value on the 40 cm face for compound indoors; write the inner ring as 10.'],
    });
  });

  it('reports text that is not an arrow value, naming it', () => {
    const result = validateEnd(['10', '0', 'eleven', '9', '9', '9'], sixRing);
    expect(result).toEqual({
      ok: false,
      problems: [
        '"0" is not an arrow value: write M for a miss.',
        '"eleven" is not an arrow value; use X, 10 to 1, or M for a miss.',
      ],
    });
  });

  it('refuses an empty or short end once the writer submits it', () => {
    expect(validateEnd([], sixRing)).toEqual({
      ok: false,
      problems: ['End is empty; enter 6 arrows, M for a miss.'],
    });
    expect(validateEnd(['X'], sixRing)).toEqual({
      ok: false,
      problems: ['End has 1 arrow; this round has 6 per end. Enter M for an arrow that missed.'],
    });
  });

  it('lets a short or empty end through while the writer is still tapping', () => {
    expect(validateEnd([], { ...sixRing, allowPartial: true })).toEqual({ ok: true, values: [] });
    expect(validateEnd(['5', 'X'], { ...sixRing, allowPartial: true })).toEqual({
      ok: true,
      values: ['X', '5'],
    });
    expect(validateEnd(Array(7).fill('9'), { ...sixRing, allowPartial: true }).ok).toBe(false);
  });

  it('accepts any end of allowed values up to the end size (property)', () => {
    const allowed = scoringValues('full-122', 'recurve', 'outdoor');
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...allowed), { minLength: 6, maxLength: 6 }), (values) => {
        expect(validateEnd(values, { arrowsPerEnd: 6, allowed })).toEqual({
          ok: true,
          values: sortEnd(values),
        });
      }),
    );
  });
});

describe('endRules', () => {
  it('takes the face and end size from the round and the values from the bow style', () => {
    expect(endRules(getRound('50m-compound'), 1, 'compound')).toEqual({
      arrowsPerEnd: 6,
      allowed: ['X', '10', '9', '8', '7', '6', '5', 'M'],
      faceDescription: 'the 80 cm six-ring face',
      allowPartial: false,
    });
    expect(endRules(getRound('1440-women'), 3, 'recurve', { allowPartial: true })).toMatchObject({
      arrowsPerEnd: 3,
      faceDescription: 'the 80 cm face',
      allowPartial: true,
    });
  });

  it('refuses a distance the round does not have', () => {
    expect(() => endRules(getRound('70m'), 2, 'recurve')).toThrowError('The 70 m round has no distance 3.');
  });
});

describe('sorting an end with marks on arrows', () => {
  it('keeps each mark on its arrow (values highest to lowest, WA Book 3)', () => {
    expect(sortEndWithMarks(['7', 'X', '9'], [{ index: 0, flag: 'bounce-out' }])).toEqual({
      values: ['X', '9', '7'],
      marks: [{ index: 2, flag: 'bounce-out' }],
    });
    expect(sortEndWithMarks(['M'], [{ index: 3, flag: 'hanging' }])).toEqual({ values: ['M'], marks: [] });
  });
});
