import { getFace } from '../faces';
import type { FaceId } from '../faces';

/** A point in mm from the centre of the spot it is measured on; x to the right, y downwards. */
export interface OffsetMm {
  xMm: number;
  yMm: number;
}

/** Where a group of plotted arrows sits and how tight it is. */
export interface GroupStats {
  arrows: number;
  /** Mean point of impact, from the centre of the spot. */
  centre: OffsetMm;
  /** Distance of the mean point of impact from the centre, in mm. */
  offsetMm: number;
  /** Clock direction of the mean point of impact (12 is up, 3 is right); undefined when dead centre. */
  clock: number | undefined;
  /** Radius around the group centre that holds half the arrows: the median distance from it. */
  spreadMm: number;
}

/**
 * A plotted point as an offset from the centre of its own spot. On the triple face the nearest
 * spot is the arrow's, as in the plotting rule (src/core/plotting.ts), so arrows on different
 * spots of one sheet make one group.
 */
export function offsetOnSpot(faceId: FaceId, xMm: number, yMm: number): OffsetMm {
  const centres = getFace(faceId).spotCentresMm;
  let dy = yMm - (centres[0] ?? 0);
  for (const c of centres) if (Math.abs(yMm - c) < Math.abs(dy)) dy = yMm - c;
  return { xMm, yMm: dy };
}

/** Offsets closer to the centre than this are dead centre: no clock direction to give. */
const CENTRE_MM = 1e-9;

/**
 * The hour on a clock face of a direction on the target (screen axes: y grows downwards):
 * 12 straight up, 3 to the right, 6 down, 9 to the left, rounded to the nearest hour.
 */
export function clockOf({ xMm, yMm }: OffsetMm): number | undefined {
  if (Math.hypot(xMm, yMm) < CENTRE_MM) return undefined;
  // Angle clockwise from straight up, in degrees 0–360.
  const degrees = ((Math.atan2(xMm, -yMm) * 180) / Math.PI + 360) % 360;
  const hour = Math.round(degrees / 30) % 12;
  return hour === 0 ? 12 : hour;
}

/** The middle value, or the mean of the two middle values for an even count. */
function median(sorted: readonly number[]): number {
  const mid = Math.floor(sorted.length / 2);
  if (sorted.length % 2 === 1) return sorted[mid] ?? 0;
  return ((sorted[mid - 1] ?? 0) + (sorted[mid] ?? 0)) / 2;
}

/**
 * The group of some plotted arrows (offsets from their spot's centre): the mean point of impact,
 * its distance and clock direction from the centre, and the spread as the median distance of the
 * arrows from the mean point of impact. Undefined with no arrows.
 */
export function groupStats(points: readonly OffsetMm[]): GroupStats | undefined {
  if (points.length === 0) return undefined;
  const centre = {
    xMm: points.reduce((s, p) => s + p.xMm, 0) / points.length,
    yMm: points.reduce((s, p) => s + p.yMm, 0) / points.length,
  };
  const distances = points
    .map((p) => Math.hypot(p.xMm - centre.xMm, p.yMm - centre.yMm))
    .sort((a, b) => a - b);
  return {
    arrows: points.length,
    centre,
    offsetMm: Math.hypot(centre.xMm, centre.yMm),
    clock: clockOf(centre),
    spreadMm: median(distances),
  };
}
