// Face geometry: WA Book 2, target faces chapter (article numbers not given: they change between
// editions and are not known here for certain). Zone width = diameter / 20; the inner 10 has half
// the 10 zone's diameter; colours gold, red, blue, black, white from the centre.
import { describe, expect, it } from 'vitest';
import {
  FACE_IDS,
  ScoringError,
  TRIPLE_SPOT_SPACING_MM,
  describeFaceFor,
  getFace,
  scoresInnerTenOnly,
  scoringValues,
} from '../../src/core';
import type { FaceId } from '../../src/core';

describe('target faces (WA Book 2)', () => {
  it.each([
    ['full-122', 61],
    ['full-80', 40],
    ['sixring-80', 40],
    ['full-60', 30],
    ['full-40', 20],
    ['triple-40', 20],
  ] as const)('%s has zones %d mm wide (diameter / 20)', (id, width) => {
    const face = getFace(id);
    expect(face.zoneWidthMm).toBe(width);
    expect(face.diameterMm / 20).toBe(width);
    face.zones.forEach((zone, i) => expect(zone.outerRadiusMm).toBe((i + 1) * width));
  });

  it.each([
    ['full-122', 61],
    ['full-80', 40],
    ['full-40', 20],
  ] as const)('%s has an inner 10 of %d mm diameter, half the 10 zone', (id, xDiameter) => {
    const face = getFace(id);
    const tenZoneDiameter = 2 * (face.zones[0]?.outerRadiusMm ?? 0);
    expect(face.xRadiusMm * 2).toBe(xDiameter);
    expect(tenZoneDiameter / 2).toBe(xDiameter);
  });

  it('colours two zones each from the centre: gold, red, blue, black, white', () => {
    const face = getFace('full-122');
    expect(face.zones.map((z) => `${z.value}:${z.colour}`)).toEqual([
      '10:gold',
      '9:gold',
      '8:red',
      '7:red',
      '6:blue',
      '5:blue',
      '4:black',
      '3:black',
      '2:white',
      '1:white',
    ]);
  });

  it('gives the 80 cm six-ring face zones 10 to 5 only', () => {
    const face = getFace('sixring-80');
    expect(face.zones.map((z) => z.value)).toEqual(['10', '9', '8', '7', '6', '5']);
    expect(face.lowestZone).toBe(5);
    expect(face.zones.at(-1)?.outerRadiusMm).toBe(240);
  });

  it('gives the 40 cm triple face three spots with zones 10 to 6', () => {
    const face = getFace('triple-40');
    expect(face.spots).toBe(3);
    expect(face.lowestZone).toBe(6);
    expect(face.zones.map((z) => z.value)).toEqual(['10', '9', '8', '7', '6']);
    expect(face.spotCentresMm).toEqual([-TRIPLE_SPOT_SPACING_MM, 0, TRIPLE_SPOT_SPACING_MM]);
    // Spots must not overlap, or one arrow could sit in two of them.
    const spotDiameter = 2 * (face.zones.at(-1)?.outerRadiusMm ?? 0);
    expect(spotDiameter).toBe(200);
    expect(TRIPLE_SPOT_SPACING_MM).toBeGreaterThan(spotDiameter);
  });

  it('has single-spot faces centred on the sheet', () => {
    for (const id of FACE_IDS.filter((f) => f !== 'triple-40')) {
      expect(getFace(id).spots).toBe(1);
      expect(getFace(id).spotCentresMm).toEqual([0]);
    }
  });

  it('refuses an unknown face id from stored data', () => {
    expect(() => getFace('full-100' as FaceId)).toThrowError(ScoringError);
    expect(() => getFace('full-100' as FaceId)).toThrowError('"full-100" is not a known target face.');
  });
});

describe('scoringValues', () => {
  it('six-ring, compound outdoors: X for ties, 10 to 5, M (product brief; whole 10 zone scores 10)', () => {
    expect(scoringValues('sixring-80', 'compound', 'outdoor')).toEqual([
      'X',
      '10',
      '9',
      '8',
      '7',
      '6',
      '5',
      'M',
    ]);
  });

  it('triple face, recurve indoors: X, 10 to 6, M', () => {
    expect(scoringValues('triple-40', 'recurve', 'indoor')).toEqual(['X', '10', '9', '8', '7', '6', 'M']);
  });

  it('40 cm faces, compound indoors: no X, the inner ring is written 10 (WA Book 3, compound inner 10)', () => {
    expect(scoringValues('triple-40', 'compound', 'indoor')).toEqual(['10', '9', '8', '7', '6', 'M']);
    expect(scoringValues('full-40', 'compound', 'indoor')).not.toContain('X');
    // 60 cm face: from memory, compound also scores only the inner ring there.
    expect(scoresInnerTenOnly('full-60', 'compound', 'indoor')).toBe(true);
  });

  it('keeps X for every other bow style and venue', () => {
    expect(scoringValues('full-40', 'barebow', 'indoor')).toEqual([
      'X',
      '10',
      '9',
      '8',
      '7',
      '6',
      '5',
      '4',
      '3',
      '2',
      '1',
      'M',
    ]);
    expect(scoringValues('full-122', 'compound', 'outdoor')).toContain('X');
    expect(scoresInnerTenOnly('full-80', 'compound', 'indoor')).toBe(false);
    expect(scoresInnerTenOnly('full-40', 'recurve', 'indoor')).toBe(false);
  });

  it('names the face in words for messages', () => {
    expect(describeFaceFor('sixring-80', 'compound', 'outdoor')).toBe('the 80 cm six-ring face');
    expect(describeFaceFor('full-40', 'compound', 'indoor')).toBe('the 40 cm face for compound indoors');
  });
});
