// The shaft's diameter decides a line touch: a shaft touching a dividing line scores the higher
// zone (WA Book 3, scoring chapter, from memory; check the edition in use). Face sizes: WA Book 2
// (40 cm face: zones 400 / 20 = 20 mm wide, so the 10 ends at 20 mm, the 9 at 40 mm, the inner
// ring at 10 mm). Each expected value is worked out by hand beside its check.
import { describe, expect, it } from 'vitest';
import { scorePlottedArrow } from '../../src/core/plotting';
import { SHAFT_DIAMETER_MM, readShaftDiameter } from '../../src/core/shaft';
import type { BowStyle } from '../../src/core';

function value(xMm: number, yMm: number, shaftDiameterMm: number, bowStyle: BowStyle = 'recurve') {
  return scorePlottedArrow({ faceId: 'full-40', bowStyle, venue: 'indoor', xMm, yMm, shaftDiameterMm }).value;
}

describe('the shaft diameter in the plotting rule (worked examples, 40 cm face)', () => {
  it('scores a centre 23 mm out a 9 with a thin shaft and a 10 once the shaft reaches the 10/9 line', () => {
    // Edge = 23 − 4 / 2 = 21 mm > 20 mm: clear of the line, 9.
    expect(value(23, 0, 4)).toBe('9');
    // Edge = 23 − 5.5 / 2 = 20.25 mm > 20: still a 9 with the default shaft.
    expect(value(23, 0, SHAFT_DIAMETER_MM.default)).toBe('9');
    // Edge = 23 − 6 / 2 = 20 mm: the shaft touches the line, 10.
    expect(value(23, 0, 6)).toBe('10');
    // Edge = 23 − 9.3 / 2 = 18.35 mm: well inside, 10.
    expect(value(23, 0, 9.3)).toBe('10');
  });

  it('scores a centre 43.5 mm out, off the axes, 8 or 9 by the shaft', () => {
    // (26.1, 34.8) is 3 : 4 : 5 scaled by 8.7: √(26.1² + 34.8²) = 43.5 mm.
    // Edge = 43.5 − 2.75 = 40.75 mm > 40: 8.
    expect(value(26.1, 34.8, 5.5)).toBe('8');
    // Edge = 43.5 − 3.5 = 40 mm: touches the 9/8 line, 9.
    expect(value(26.1, 34.8, 7)).toBe('9');
    // Edge = 43.5 − 4.65 = 38.85 mm: inside the 9.
    expect(value(-26.1, -34.8, 9.3)).toBe('9');
  });

  it('gives compound indoors the inner-ring 10 only when the shaft touches the inner ring', () => {
    // Edge = 12.5 − 2 = 10.5 mm > 10: the rest of the gold, 9 for compound.
    expect(value(0, 12.5, 4, 'compound')).toBe('9');
    // Edge = 12.5 − 2.75 = 9.75 mm ≤ 10: inner ring, 10.
    expect(value(0, 12.5, 5.5, 'compound')).toBe('10');
  });
});

describe('readShaftDiameter', () => {
  it('reads a diameter as typed, to a tenth of a mm', () => {
    expect(readShaftDiameter('5.5')).toEqual({ ok: true, mm: 5.5 });
    expect(readShaftDiameter('5,5')).toEqual({ ok: true, mm: 5.5 });
    expect(readShaftDiameter(' 9.3 mm')).toEqual({ ok: true, mm: 9.3 });
    expect(readShaftDiameter('6.04')).toEqual({ ok: true, mm: 6 });
    expect(readShaftDiameter('.5e1')).toMatchObject({ ok: false });
  });

  it('keeps the ends of the range, 4 and 9.5 mm, and refuses beyond them in words', () => {
    expect(readShaftDiameter('4')).toEqual({ ok: true, mm: 4 });
    expect(readShaftDiameter('9.5')).toEqual({ ok: true, mm: 9.5 });
    for (const typed of ['3.9', '9.6', '0', '-5', '', 'abc', '1e1', 'Infinity', '5.5.5']) {
      expect(readShaftDiameter(typed)).toEqual({
        ok: false,
        message: "Give the shaft's diameter in mm, from 4 to 9.5 (for example 5.5).",
      });
    }
  });
});
