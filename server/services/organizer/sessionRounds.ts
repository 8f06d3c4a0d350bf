import type { BowStyleName, RoundSummary, SessionRoundInput } from '../../../src/contract/events';
import {
  ScoringError,
  defineCustomRound,
  getFace,
  getRound,
  roundArrowCount,
  roundEndCount,
  roundMaxScore,
  type RoundDefinition,
} from '../../../src/core';
import { badRequest } from '../../http/httpError';

/** What a screen shows of a round: its distances with face names, arrows, ends and the maximum. */
export function roundSummary(round: RoundDefinition, custom: boolean): RoundSummary {
  return {
    id: round.id,
    name: round.name,
    custom,
    venue: round.venue,
    distances: round.distances.map((d) => ({
      label: d.label,
      distanceM: d.distanceM,
      faceId: d.faceId,
      faceLabel: getFace(d.faceId).label,
      arrows: d.arrows,
      arrowsPerEnd: d.arrowsPerEnd,
    })),
    arrows: roundArrowCount(round),
    ends: roundEndCount(round),
    maxScore: roundMaxScore(round),
  };
}

/** The faces of a round in shooting order, each named once ("122 cm face", "80 cm face"). */
export function roundFaces(round: RoundDefinition): string[] {
  return [...new Set(round.distances.map((d) => getFace(d.faceId).label))];
}

/**
 * Turns a division's round choice into the full definition stored with the session: a catalog
 * round, or a custom one checked by the core. Either must be shot with the division's bow style.
 */
export function resolveRound(
  input: SessionRoundInput,
  division: { name: string; bowStyle: BowStyleName },
): { roundId: string; round: RoundDefinition } {
  let round: RoundDefinition;
  let roundId: string;
  if ('roundId' in input) {
    try {
      round = getRound(input.roundId);
    } catch {
      throw badRequest(
        `"${input.roundId}" is not a round in Ringcall's catalog. Choose one from the list or make a custom round.`,
        [{ path: 'rounds', message: `Unknown round "${input.roundId}".` }],
      );
    }
    roundId = round.id;
  } else {
    try {
      round = defineCustomRound(input.customRound);
    } catch (error) {
      if (error instanceof ScoringError) {
        throw badRequest(
          `The custom round for ${division.name} is not complete. ${error.message}`,
          error.problems.map((p) => ({ path: 'customRound', message: p })),
        );
      }
      throw error;
    }
    roundId = 'custom';
  }
  if (!round.bowStyles.includes(division.bowStyle)) {
    throw badRequest(
      `The ${round.name} is shot with ${round.bowStyles.join(' or ')}, but ${division.name} shoot ${division.bowStyle}. Choose a round for ${division.bowStyle}.`,
      [{ path: 'rounds', message: `${round.name} does not fit ${division.name}.` }],
    );
  }
  return { roundId, round };
}
