import type { EndRules } from './ends';
import { describeFaceFor, scoringValues } from './faces';
import type { BowStyle } from './faces';
import type { RoundDefinition } from './rounds';
import { ScoringError } from './errors';

/** The rules an end at one distance of a round must meet, for one archer's bow style. */
export function endRules(
  round: RoundDefinition,
  distanceIndex: number,
  bowStyle: BowStyle,
  options: { allowPartial?: boolean } = {},
): EndRules {
  const distance = round.distances[distanceIndex];
  if (!distance) {
    throw new ScoringError('invalid-round', `The ${round.name} has no distance ${distanceIndex + 1}.`);
  }
  return {
    arrowsPerEnd: distance.arrowsPerEnd,
    allowed: scoringValues(distance.faceId, bowStyle, round.venue),
    faceDescription: describeFaceFor(distance.faceId, bowStyle, round.venue),
    allowPartial: options.allowPartial ?? false,
  };
}
