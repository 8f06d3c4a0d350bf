import { arrowPoints } from '../arrowValue';
import type { FaceId } from '../faces';
import { countedValues, type PracticeArrow } from './arrows';

// Its own file: the practice log keeps these with each arrow stored, and the rest of progress
// (weeks, the best session) stays in the progress screen's chunk.

/** A session's arrows and points at one distance and face (see progressParts). */
export interface ProgressPart {
  distanceM: number;
  faceId: FaceId;
  arrows: number;
  points: number;
}

/**
 * A session's arrows and points per distance and face, from its ends (each end counts at its own
 * distance and face; on the triple face only the arrows that count score, countedValues). Small
 * enough to keep with the session, so progress need not read every arrow.
 */
export function progressParts(
  ends: readonly { distanceM: number; faceId: FaceId; arrows: readonly PracticeArrow[] }[],
): ProgressPart[] {
  const parts: ProgressPart[] = [];
  for (const end of ends) {
    if (end.arrows.length === 0) continue;
    let points = 0;
    // Only arrows plotted on a spot (the triple face) need the one-arrow-a-spot rule.
    if (end.arrows.some((a) => a.spot !== undefined))
      for (const value of countedValues(end.arrows)) points += arrowPoints(value);
    else for (const arrow of end.arrows) points += arrowPoints(arrow.value);
    const part = parts.find((p) => p.distanceM === end.distanceM && p.faceId === end.faceId);
    if (part) {
      part.arrows += end.arrows.length;
      part.points += points;
    } else parts.push({ distanceM: end.distanceM, faceId: end.faceId, arrows: end.arrows.length, points });
  }
  return parts;
}

/** A session's arrows, points and average per arrow over all its parts (0 with no arrows): the log's line. */
export function partsTally(parts: readonly ProgressPart[]): {
  arrows: number;
  total: number;
  averagePerArrow: number;
} {
  let arrows = 0;
  let total = 0;
  for (const part of parts) {
    arrows += part.arrows;
    total += part.points;
  }
  return { arrows, total, averagePerArrow: arrows === 0 ? 0 : total / arrows };
}
