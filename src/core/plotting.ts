import { compareArrowValues } from './arrowValue';
import type { ArrowValue } from './arrowValue';
import { ScoringError } from './errors';
import { getFace, scoresInnerTenOnly } from './faces';
import type { BowStyle, Face, FaceId, Venue } from './faces';

export interface PlottedArrow {
  /** Position of the shaft's centre in mm from the centre of the sheet (the middle spot on the
   * triple face); x grows to the right and y downwards, as on a screen. */
  xMm: number;
  yMm: number;
  shaftDiameterMm: number;
  faceId: FaceId;
  bowStyle: BowStyle;
  venue: Venue;
}

export interface PlottedScore {
  value: ArrowValue;
  /** Triple face only: index into the face's `spotCentresMm` (0 = top) of the spot hit. */
  spot?: number;
}

/**
 * Positions come from a finger or a photo, good to a fraction of a millimetre; this slack only
 * absorbs floating-point rounding so a shaft computed to sit exactly on a line keeps the higher zone.
 */
const LINE_TOLERANCE_MM = 1e-9;

/**
 * Scores a plotted arrow. A shaft touching a dividing line scores the higher zone (WA Book 3):
 * the zone counts when the centre's distance minus the shaft radius is within its outer radius.
 * On the triple face the nearest spot decides; outside its lowest zone the arrow is M.
 */
export function scorePlottedArrow(arrow: PlottedArrow): PlottedScore {
  const { xMm, yMm, shaftDiameterMm } = arrow;
  if (!Number.isFinite(xMm) || !Number.isFinite(yMm)) {
    throw new ScoringError('invalid-plot', 'The plotted position is not a number.');
  }
  if (!Number.isFinite(shaftDiameterMm) || shaftDiameterMm < 0) {
    throw new ScoringError('invalid-plot', `A shaft diameter of ${shaftDiameterMm} mm is not possible.`);
  }
  const face = getFace(arrow.faceId);

  let spot = 0;
  let dy = yMm - (face.spotCentresMm[0] ?? 0);
  for (let i = 1; i < face.spotCentresMm.length; i += 1) {
    const candidate = yMm - (face.spotCentresMm[i] ?? 0);
    if (Math.abs(candidate) < Math.abs(dy)) {
      dy = candidate;
      spot = i;
    }
  }

  // How far the nearest edge of the shaft lies from the spot's centre.
  const edge = Math.sqrt(xMm * xMm + dy * dy) - shaftDiameterMm / 2 - LINE_TOLERANCE_MM;
  const value = zoneValue(edge, face, scoresInnerTenOnly(arrow.faceId, arrow.bowStyle, arrow.venue));
  return face.spots === 3 && value !== 'M' ? { value, spot } : { value };
}

function zoneValue(edge: number, face: Face, innerTenOnly: boolean): ArrowValue {
  if (edge <= face.xRadiusMm) return innerTenOnly ? '10' : 'X';
  for (const zone of face.zones) {
    if (edge <= zone.outerRadiusMm) {
      // Compound indoors the rest of the 10 zone is worth 9 (the inner ring is the 10).
      return innerTenOnly && zone.value === '10' ? '9' : zone.value;
    }
  }
  return 'M';
}

/**
 * The values of one end plotted on the triple face, in the order given. Each spot takes one
 * arrow an end; when a spot holds more, only its lowest arrow counts and the others score M
 * (product brief; WA Book 3, from memory).
 */
export function oneArrowPerSpot(scores: readonly PlottedScore[]): ArrowValue[] {
  const lowestInSpot = new Map<number, ArrowValue>();
  for (const { value, spot } of scores) {
    if (spot === undefined) continue;
    const kept = lowestInSpot.get(spot);
    if (kept === undefined || compareArrowValues(value, kept) > 0) lowestInSpot.set(spot, value);
  }
  const counted = new Set<number>();
  return scores.map(({ value, spot }) => {
    if (spot === undefined) return value;
    // Equal lowest arrows in one spot: only the first of them counts.
    if (counted.has(spot) || lowestInSpot.get(spot) !== value) return 'M';
    counted.add(spot);
    return value;
  });
}
