import type { MatchScorerBody } from '../../../contract/matches';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export type SetMatchScorer = MatchScorerBody & { matchId: number };

/** `PUT …/matches/:matchId/scorers`: a named scorer writes for one line in place of its archer. */
export const setMatchScorer = (eventId: number, { matchId, ...body }: SetMatchScorer) =>
  send<void>(eventPath(eventId, `/matches/${matchId}/scorers`), jsonBody('PUT', body));

export const useSetMatchScorer = (eventId: number) =>
  useEventMutation(eventId, (input: SetMatchScorer) => setMatchScorer(eventId, input));
