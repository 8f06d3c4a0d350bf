// Practice statistics. Counts follow the card (WA Book 3: X counts 10 and is one of the 10s, M
// counts 0). The group measures are common practice, no published source: the mean point of
// impact is the arithmetic mean of the points; its direction is read on a clock face (12 up);
// the spread is the median distance of the arrows from the mean point of impact (the radius that
// holds half the arrows). Every expected value below is worked by hand in the comment beside it.
import { describe, expect, it } from 'vitest';
import {
  clockOf,
  countedValues,
  groupStats,
  offsetOnSpot,
  plotPracticeArrow,
  practiceTally,
} from '../../src/core/practice';
import type { PlotSetup } from '../../src/core/practice';

describe('practiceTally', () => {
  it('counts a session like a card (WA Book 3)', () => {
    // X,10,9,9,8,M: total 10+10+9+9+8+0 = 46 over 6 arrows = 7.666…; 10s: X and 10 = 2; Xs 1;
    // hits: all but the M = 5. Rates: 2/6 and 1/6 (arithmetic by hand).
    const tally = practiceTally(['X', '10', '9', '9', '8', 'M']);
    expect(tally).toMatchObject({ arrows: 6, total: 46, tens: 2, xs: 1, hits: 5 });
    expect(tally.averagePerArrow).toBeCloseTo(46 / 6, 10);
    expect(tally.tenRate).toBeCloseTo(1 / 3, 10);
    expect(tally.xRate).toBeCloseTo(1 / 6, 10);
  });

  it('is all zero before the first arrow (no division by zero)', () => {
    expect(practiceTally([])).toEqual({
      arrows: 0,
      total: 0,
      averagePerArrow: 0,
      tens: 0,
      xs: 0,
      hits: 0,
      tenRate: 0,
      xRate: 0,
    });
  });
});

describe('clockOf (clock direction, 12 up, screen y downwards)', () => {
  it('reads the four quarters and an hour between', () => {
    expect(clockOf({ xMm: 0, yMm: -1 })).toBe(12);
    expect(clockOf({ xMm: 1, yMm: 0 })).toBe(3);
    expect(clockOf({ xMm: 0, yMm: 1 })).toBe(6);
    expect(clockOf({ xMm: -1, yMm: 0 })).toBe(9);
    // (-1, -√3): up and to the left, atan2(-1, √3) = -30° → 330° clockwise from up → 330/30 = 11.
    expect(clockOf({ xMm: -1, yMm: -Math.sqrt(3) })).toBe(11);
    // Dead centre has no direction.
    expect(clockOf({ xMm: 0, yMm: 0 })).toBeUndefined();
  });
});

describe('groupStats (mean point of impact; spread = median distance from it)', () => {
  it('a square group off to one o’clock', () => {
    // Four arrows 10 mm around (3, -4): (13,-4), (-7,-4), (3,6), (3,-14).
    // Mean x = (13 - 7 + 3 + 3) / 4 = 3; mean y = (-4 - 4 + 6 - 14) / 4 = -4.
    // Offset = √(3² + 4²) = 5 mm. Direction: right 3, up 4 → atan2(3, 4) = 36.87° → 36.87/30 = 1.23 → 1 o'clock.
    // Every arrow is 10 mm from (3, -4), so the median distance is 10.
    const g = groupStats([
      { xMm: 13, yMm: -4 },
      { xMm: -7, yMm: -4 },
      { xMm: 3, yMm: 6 },
      { xMm: 3, yMm: -14 },
    ]);
    expect(g?.arrows).toBe(4);
    expect(g?.centre.xMm).toBeCloseTo(3, 10);
    expect(g?.centre.yMm).toBeCloseTo(-4, 10);
    expect(g?.offsetMm).toBeCloseTo(5, 10);
    expect(g?.clock).toBe(1);
    expect(g?.spreadMm).toBeCloseTo(10, 10);
  });

  it('an odd count takes the middle distance', () => {
    // (1,1), (4,1), (1,5), (10,1), (-1,-3): mean x = 15/5 = 3, mean y = 5/5 = 1.
    // Distances from (3,1): (-2,0) → 2; (1,0) → 1; (-2,4) → √20; (7,0) → 7; (-4,-4) → √32.
    // Sorted 1, 2, √20 ≈ 4.472, √32 ≈ 5.657, 7: the median is √20.
    // Offset √(9 + 1) = √10; direction right 3, down 1 → atan2(3, -1) = 108.43° → 3.61 → 4 o'clock.
    const g = groupStats([
      { xMm: 1, yMm: 1 },
      { xMm: 4, yMm: 1 },
      { xMm: 1, yMm: 5 },
      { xMm: 10, yMm: 1 },
      { xMm: -1, yMm: -3 },
    ]);
    expect(g?.centre).toEqual({ xMm: 3, yMm: 1 });
    expect(g?.offsetMm).toBeCloseTo(Math.sqrt(10), 10);
    expect(g?.clock).toBe(4);
    expect(g?.spreadMm).toBeCloseTo(Math.sqrt(20), 10);
  });

  it('an even count takes the mean of the two middle distances', () => {
    // (0,0), (2,0), (0,4), (6,0): mean x = 8/4 = 2, mean y = 4/4 = 1.
    // Distances from (2,1): (-2,-1) → √5; (0,-1) → 1; (-2,3) → √13; (4,-1) → √17.
    // Sorted 1, √5, √13, √17: median (√5 + √13) / 2 ≈ (2.236 + 3.606) / 2 ≈ 2.921.
    const g = groupStats([
      { xMm: 0, yMm: 0 },
      { xMm: 2, yMm: 0 },
      { xMm: 0, yMm: 4 },
      { xMm: 6, yMm: 0 },
    ]);
    expect(g?.spreadMm).toBeCloseTo((Math.sqrt(5) + Math.sqrt(13)) / 2, 10);
    expect(g?.offsetMm).toBeCloseTo(Math.sqrt(5), 10);
  });

  it('a single arrow is its own centre with no spread; no arrows, no group', () => {
    expect(groupStats([{ xMm: 0, yMm: 30 }])).toEqual({
      arrows: 1,
      centre: { xMm: 0, yMm: 30 },
      offsetMm: 30,
      clock: 6,
      spreadMm: 0,
    });
    expect(groupStats([])).toBeUndefined();
  });
});

describe('offsetOnSpot', () => {
  it('measures a triple-face arrow from the centre of the nearest spot (as the plotting rule does)', () => {
    // Spots at -220, 0 and 220 mm (TRIPLE_SPOT_SPACING_MM): y 225 is 5 below the bottom spot's centre.
    expect(offsetOnSpot('triple-40', 5, 225)).toEqual({ xMm: 5, yMm: 5 });
    // y -100: 100 from the middle spot, 120 from the top one → the middle spot.
    expect(offsetOnSpot('triple-40', 5, -100)).toEqual({ xMm: 5, yMm: -100 });
    expect(offsetOnSpot('full-122', 7, -9)).toEqual({ xMm: 7, yMm: -9 });
  });
});

describe('plotPracticeArrow (the core plotting rule, src/core/plotting.ts)', () => {
  const recurve122: PlotSetup = {
    faceId: 'full-122',
    bowStyle: 'recurve',
    venue: 'outdoor',
    shaftDiameterMm: 5,
  };

  it('a shaft touching the line scores the higher zone (WA Book 3)', () => {
    // 122 cm face: zones 1220/20 = 61 mm wide, the 10 ends at 61 mm. A 5 mm shaft centred at
    // 63 mm reaches in to 63 - 2.5 = 60.5 mm ≤ 61: it touches the 10 line and scores 10.
    expect(plotPracticeArrow(recurve122, 63, 0)).toEqual({ value: '10', xMm: 63, yMm: 0 });
    // Centred at 64 mm it reaches 61.5 mm: clear of the line, a 9.
    expect(plotPracticeArrow(recurve122, 0, 64).value).toBe('9');
    // Outside the face (radius 610 mm) plus the shaft's radius: M.
    expect(plotPracticeArrow(recurve122, 613, 0).value).toBe('M');
  });

  it('on the triple face keeps the spot and counts one arrow a spot', () => {
    const triple: PlotSetup = {
      faceId: 'triple-40',
      bowStyle: 'recurve',
      venue: 'indoor',
      shaftDiameterMm: 0,
    };
    // 40 cm spots: zones 20 mm wide; 5 mm from the top spot's centre (y -220) is inside the X (10 mm).
    const top = plotPracticeArrow(triple, 0, -215);
    expect(top).toEqual({ value: 'X', xMm: 0, yMm: -215, spot: 0 });
    // 30 mm from the top spot's centre: the 9 zone (20–40 mm).
    const topAgain = plotPracticeArrow(triple, 30, -220);
    expect(topAgain.value).toBe('9');
    // Two arrows in one spot: only the lower one counts, the other is M (oneArrowPerSpot).
    expect(countedValues([top, topAgain, { value: '8' }])).toEqual(['M', '9', '8']);
  });
});
