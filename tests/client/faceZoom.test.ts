// The plotting face's zoom (two fingers, the zoom keys) and the magnifier's place, in mm of the
// 40 cm face's drawing: radius 200 mm and a margin of 16 mm (8 %), so the whole face is the
// square from −216 to 216 mm. Each expected figure is worked out by hand beside its check.
import { describe, expect, it } from 'vitest';
import { MAX_ZOOM, followPoint, wholeFace, zoomAbout, zoomRect } from '../../src/features/practice/faceZoom';
import { loupePlace } from '../../src/features/practice/Loupe';
import { faceFrame } from '../../src/features/practice/TargetFace';

const frame = faceFrame('full-40');
const whole = wholeFace(frame);

describe('zoomAbout', () => {
  it('starts from the whole face', () => {
    expect(frame).toMatchObject({ x: -216, y: -216, width: 432, height: 432 });
    expect(zoomRect(frame, whole)).toEqual({ x: -216, y: -216, width: 432, height: 432 });
  });

  it('zooms twice about a point that stays where it was on screen', () => {
    // x = 100 + (−216 − 100) / 2 = −58, y = 50 + (−216 − 50) / 2 = −83, 216 mm square.
    // (100, 50) sits at (100 + 216) / 432 = 0.7315 of the width before and (100 + 58) / 216 after.
    const z = zoomAbout(frame, whole, 2, { xMm: 100, yMm: 50 });
    expect(zoomRect(frame, z)).toEqual({ x: -58, y: -83, width: 216, height: 216 });
  });

  it('pans with two fingers: the point under them follows them', () => {
    const start = zoomAbout(frame, whole, 2, { xMm: 0, yMm: 0 });
    expect(zoomRect(frame, start)).toMatchObject({ x: -108, y: -108 });
    // The fingers landed on (10, 0) and moved to where (30, 0) was: x = 10 + (−108 − 30) = −128.
    const panned = zoomAbout(frame, start, 1, { xMm: 10, yMm: 0 }, { xMm: 30, yMm: 0 });
    expect(zoomRect(frame, panned)).toMatchObject({ x: -128, y: -108, width: 216 });
  });

  it('pinches and pans at once', () => {
    // Fingers on (0, 0), spread twice as far, midpoint now where (−20, 10) was:
    // x = 0 + (−216 + 20) / 2 = −98, y = 0 + (−216 − 10) / 2 = −113.
    const z = zoomAbout(frame, whole, 2, { xMm: 0, yMm: 0 }, { xMm: -20, yMm: 10 });
    expect(z).toEqual({ scale: 2, xMm: 10, yMm: -5 });
  });

  it('stays on the face and between the whole face and the largest zoom', () => {
    // View −108..108; a pan bringing (0, 0) to where (−200, 0) was: x = 0 + (−108 + 200) = 92,
    // past the right edge's limit 216 − 216 = 0, so held at 0 (middle 108).
    const centred = zoomAbout(frame, whole, 2, { xMm: 0, yMm: 0 });
    expect(zoomAbout(frame, centred, 1, { xMm: 0, yMm: 0 }, { xMm: -200, yMm: 0 })).toEqual({
      scale: 2,
      xMm: 108,
      yMm: 0,
    });
    expect(zoomAbout(frame, whole, 100, { xMm: 0, yMm: 0 }).scale).toBe(MAX_ZOOM);
    const start = zoomAbout(frame, whole, 2, { xMm: 100, yMm: 100 });
    expect(zoomAbout(frame, start, 0.1, { xMm: 100, yMm: 100 })).toEqual(whole);
  });

  it('keeps the whole face’s shape on the tall triple face, so the drawing never changes size', () => {
    // Spots of radius 100 mm (6 to 10) with an 8 mm margin, 220 mm apart: 216 × 656 mm.
    const triple = faceFrame('triple-40');
    expect(triple).toMatchObject({ width: 216, height: 656 });
    const rect = zoomRect(triple, zoomAbout(triple, wholeFace(triple), 4, { xMm: 0, yMm: -220 }));
    expect(rect).toMatchObject({ width: 54, height: 164 });
  });
});

describe('followPoint', () => {
  const start = zoomAbout(frame, whole, 2, { xMm: 0, yMm: 0 });

  it('leaves the view alone while the point is well inside it', () => {
    expect(followPoint(frame, start, { xMm: 50, yMm: -50 })).toBe(start);
  });

  it('moves the view just enough to keep a margin of a tenth around the point', () => {
    // View −108..108, margin 21.6: 100 is 13.6 past 86.4, so the middle moves to 13.6.
    const moved = followPoint(frame, start, { xMm: 100, yMm: 0 });
    expect(moved.scale).toBe(2);
    expect(moved.xMm).toBeCloseTo(13.6, 9);
    expect(moved.yMm).toBe(0);
  });
});

describe('loupePlace', () => {
  it('puts the magnifier 120 px above the finger when there is room', () => {
    expect(loupePlace({ left: 0, top: 300, width: 400 }, { x: 100, y: 500 })).toEqual({ x: 100, y: 80 });
  });

  it('puts it beside the finger, towards the middle, near the top of the screen', () => {
    // 150 − 120 − 68 < 0: no room above. Right half: 120 px to the left; top kept on screen (68 − 100).
    expect(loupePlace({ left: 0, top: 100, width: 400 }, { x: 300, y: 150 })).toEqual({ x: 180, y: 50 });
    // Left half: 120 px to the right; its top held at the screen's top: 68 − 50 = 18 > 0.
    expect(loupePlace({ left: 0, top: 50, width: 400 }, { x: 50, y: 60 })).toEqual({ x: 170, y: 18 });
  });
});
