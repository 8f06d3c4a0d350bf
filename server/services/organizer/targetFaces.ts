import type { FaceId, RoundDefinition } from '../../../src/core';

/**
 * Faces each position shoots on its own: the 80 cm six-ring and the 40 cm triple (product brief:
 * "on faces of their own, e.g. the 80 cm 6-ring or 40 cm triple, each position has its own face").
 * The single 40 cm face indoors is added from memory of common practice (four 40 cm faces on one
 * boss, one per archer); every other face is shared by the archers on the target.
 */
const FACE_PER_POSITION: ReadonlySet<FaceId> = new Set<FaceId>(['sixring-80', 'triple-40', 'full-40']);

export const faceIsPerPosition = (faceId: FaceId): boolean => FACE_PER_POSITION.has(faceId);

/** Whether any distance of these rounds gives each archer a face of their own. */
export const facesAreOwn = (rounds: readonly RoundDefinition[]): boolean =>
  rounds.some((r) => r.distances.some((d) => faceIsPerPosition(d.faceId)));

/**
 * How many faces to hang on one target: one shared face, or one per archer when their face is
 * their own. Rounds with several distances take the largest number any distance needs.
 */
export function facesPerTarget(rounds: readonly RoundDefinition[], archers: number): number {
  let faces = 1;
  for (const round of rounds) {
    for (const distance of round.distances) {
      if (faceIsPerPosition(distance.faceId)) faces = Math.max(faces, archers);
    }
  }
  return faces;
}
