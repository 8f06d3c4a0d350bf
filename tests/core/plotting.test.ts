// Plotted arrows: a shaft touching a dividing line scores the higher zone (WA Book 3, scoring
// chapter; article number not given, check against the edition in use). Face sizes: WA Book 2.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  ScoringError,
  TRIPLE_SPOT_SPACING_MM,
  compareArrowValues,
  getFace,
  scoresInnerTenOnly,
} from '../../src/core';
import type { ArrowValue, BowStyle, FaceId, Venue } from '../../src/core';
import { oneArrowPerSpot, scorePlottedArrow } from '../../src/core/plotting';

type Setup = { faceId: FaceId; bowStyle: BowStyle; venue: Venue };

const SETUPS: Setup[] = [
  { faceId: 'full-122', bowStyle: 'recurve', venue: 'outdoor' },
  { faceId: 'full-80', bowStyle: 'compound', venue: 'outdoor' },
  { faceId: 'sixring-80', bowStyle: 'compound', venue: 'outdoor' },
  { faceId: 'full-60', bowStyle: 'barebow', venue: 'indoor' },
  { faceId: 'full-40', bowStyle: 'recurve', venue: 'indoor' },
  { faceId: 'full-40', bowStyle: 'compound', venue: 'indoor' },
  { faceId: 'triple-40', bowStyle: 'recurve', venue: 'indoor' },
  { faceId: 'triple-40', bowStyle: 'compound', venue: 'indoor' },
];

function at(setup: Setup, xMm: number, yMm: number, shaftDiameterMm = 0) {
  return scorePlottedArrow({ ...setup, xMm, yMm, shaftDiameterMm });
}

/** Every dividing line of a face, innermost first, with the value an arrow touching it scores. */
function lines(setup: Setup): { radiusMm: number; inside: ArrowValue; outside: ArrowValue }[] {
  const face = getFace(setup.faceId);
  const innerTenOnly = scoresInnerTenOnly(setup.faceId, setup.bowStyle, setup.venue);
  // Compound indoors: the inner ring is the 10, the rest of the 10 zone and the 9 zone score 9.
  const values: ArrowValue[] = [
    innerTenOnly ? '10' : 'X',
    ...face.zones.map((z) => (innerTenOnly && z.value === '10' ? '9' : z.value)),
    'M',
  ];
  const radii = [face.xRadiusMm, ...face.zones.map((z) => z.outerRadiusMm)];
  return radii.map((radiusMm, i) => ({
    radiusMm,
    inside: values[i] as ArrowValue,
    outside: values[i + 1] as ArrowValue,
  }));
}

const recurve122: Setup = { faceId: 'full-122', bowStyle: 'recurve', venue: 'outdoor' };
const compound40: Setup = { faceId: 'full-40', bowStyle: 'compound', venue: 'indoor' };
const recurveTriple: Setup = { faceId: 'triple-40', bowStyle: 'recurve', venue: 'indoor' };

describe('scorePlottedArrow', () => {
  it('scores the centre of the 122 cm face X', () => {
    expect(at(recurve122, 0, 0, 5)).toEqual({ value: 'X' });
  });

  it('gives a 5 mm shaft touching the 10/9 line on 122 cm a 10, and a 9 a tenth of a mm further', () => {
    // 10 zone outer radius 61 mm (WA Book 2: 122 mm ten zone); shaft radius 2.5 mm.
    expect(at(recurve122, 63.5, 0, 5).value).toBe('10');
    expect(at(recurve122, 0, -63.6, 5).value).toBe('9');
  });

  it('scores a shaft touching the outer line of the 1 zone 1, and beyond it M', () => {
    expect(at(recurve122, 612.5, 0, 5).value).toBe('1');
    expect(at(recurve122, 612.6, 0, 5).value).toBe('M');
  });

  it('scores the inner ring 10 and the rest of the gold 9 for compound indoors (WA Book 3)', () => {
    expect(at(compound40, 0, 0).value).toBe('10');
    expect(at(compound40, 10, 0).value).toBe('10');
    expect(at(compound40, 15, 0).value).toBe('9');
    expect(at(compound40, 25, 0).value).toBe('9');
    expect(at(compound40, 45, 0).value).toBe('8');
    // The same spot for recurve on the same face is a 10.
    expect(at({ ...compound40, bowStyle: 'recurve' }, 15, 0).value).toBe('10');
  });

  it('keeps X for compound outdoors, where the whole 10 zone scores 10 (product brief)', () => {
    const compound80 = { faceId: 'full-80', bowStyle: 'compound', venue: 'outdoor' } as const;
    expect(at(compound80, 0, 10).value).toBe('X');
    expect(at(compound80, 0, 30).value).toBe('10');
  });

  it('scores outside the 5 zone of the six-ring face M, unless the shaft touches the line', () => {
    const sixRing = { faceId: 'sixring-80', bowStyle: 'compound', venue: 'outdoor' } as const;
    expect(at(sixRing, 240, 0).value).toBe('5');
    expect(at(sixRing, 241, 0).value).toBe('M');
    expect(at(sixRing, 242, 0, 4).value).toBe('5');
  });

  it('finds the spot on the triple face, numbered from the top', () => {
    expect(at(recurveTriple, 0, -TRIPLE_SPOT_SPACING_MM)).toEqual({ value: 'X', spot: 0 });
    expect(at(recurveTriple, 0, TRIPLE_SPOT_SPACING_MM + 50)).toEqual({ value: '8', spot: 2 });
    expect(at(recurveTriple, 100, 0)).toEqual({ value: '6', spot: 1 });
    expect(at(recurveTriple, 0, 105, 10)).toEqual({ value: '6', spot: 1 });
  });

  it('scores M with no spot between the spots of the triple face', () => {
    expect(at(recurveTriple, 0, TRIPLE_SPOT_SPACING_MM / 2)).toEqual({ value: 'M' });
    expect(at(recurveTriple, 150, 0)).toEqual({ value: 'M' });
  });

  it('applies the compound inner 10 on each spot of the triple face', () => {
    const compoundTriple = { ...recurveTriple, bowStyle: 'compound' } as const;
    expect(at(compoundTriple, 0, TRIPLE_SPOT_SPACING_MM)).toEqual({ value: '10', spot: 2 });
    expect(at(compoundTriple, 0, TRIPLE_SPOT_SPACING_MM + 15)).toEqual({ value: '9', spot: 2 });
  });

  it('refuses positions and shafts that are not real', () => {
    expect(() => at(recurve122, Number.NaN, 0)).toThrowError(ScoringError);
    expect(() => at(recurve122, 0, Number.POSITIVE_INFINITY)).toThrowError(
      'The plotted position is not a number.',
    );
    expect(() => at(recurve122, 0, 0, -1)).toThrowError('A shaft diameter of -1 mm is not possible.');
  });

  it('counts only the lowest arrow in a spot hit twice on the triple face (product brief; WA Book 3, from memory)', () => {
    expect(
      oneArrowPerSpot([
        { value: 'X', spot: 1 },
        { value: '8', spot: 1 },
        { value: '9', spot: 0 },
      ]),
    ).toEqual(['M', '8', '9']);
    expect(oneArrowPerSpot([{ value: '7', spot: 2 }, { value: '7', spot: 2 }, { value: 'M' }])).toEqual([
      '7',
      'M',
      'M',
    ]);
    expect(
      oneArrowPerSpot([
        { value: '10', spot: 0 },
        { value: '10', spot: 1 },
        { value: '10', spot: 2 },
      ]),
    ).toEqual(['10', '10', '10']);
  });

  const setup = fc.constantFrom(...SETUPS);
  const angle = fc.double({ min: 0, max: 2 * Math.PI, noNaN: true });

  it('never rises as the arrow moves away from the centre along a ray (property)', () => {
    fc.assert(
      fc.property(
        setup,
        angle,
        fc.double({ min: 0, max: 12, noNaN: true }),
        fc.nat({ max: 2 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (s, theta, shaft, spotIndex, f1, f2) => {
          const face = getFace(s.faceId);
          const centre = face.spotCentresMm[spotIndex % face.spots] ?? 0;
          // On the triple face, stay closer to this spot than to its neighbours.
          const reach = face.spots === 3 ? TRIPLE_SPOT_SPACING_MM / 2 : face.diameterMm;
          const [near, far] = [Math.min(f1, f2) * reach, Math.max(f1, f2) * reach];
          const inner = at(s, near * Math.cos(theta), centre + near * Math.sin(theta), shaft).value;
          const outer = at(s, far * Math.cos(theta), centre + far * Math.sin(theta), shaft).value;
          expect(compareArrowValues(inner, outer)).toBeLessThanOrEqual(0);
        },
      ),
    );
  });

  it('gives a shaft whose edge lies exactly on a line the higher zone, for any shaft > 0 (property)', () => {
    fc.assert(
      fc.property(
        setup,
        angle,
        fc.double({ min: Number.MIN_VALUE, max: 20, noNaN: true }),
        fc.nat({ max: 2 }),
        fc.nat({ max: 10 }),
        (s, theta, shaft, spotIndex, lineIndex) => {
          const face = getFace(s.faceId);
          const all = lines(s);
          const line = all[lineIndex % all.length];
          if (!line) throw new Error('no line');
          const spot = spotIndex % face.spots;
          const centre = face.spotCentresMm[spot] ?? 0;
          const onLine = line.radiusMm + shaft / 2;
          const touching = at(s, onLine * Math.cos(theta), centre + onLine * Math.sin(theta), shaft);
          expect(touching.value).toBe(line.inside);
          if (face.spots === 3) expect(touching.spot).toBe(spot);
          // A micrometre further out, the shaft no longer touches: the lower value.
          const clear = onLine + 0.001;
          expect(at(s, clear * Math.cos(theta), centre + clear * Math.sin(theta), shaft).value).toBe(
            line.outside,
          );
        },
      ),
    );
  });
});
