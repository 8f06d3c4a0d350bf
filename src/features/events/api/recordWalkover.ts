import type { MatchWalkover } from '../../../contract/matches';
import { eventPath, jsonBody, send } from '../../../api/eventKeys';
import { useBracketMutation, type BracketsAnswer } from './bracketMutation';

export type RecordWalkover = MatchWalkover & { matchId: number };

export const recordWalkover = (eventId: number, { matchId, ...body }: RecordWalkover) =>
  send<BracketsAnswer>(eventPath(eventId, `/matches/${matchId}/walkover`), jsonBody('POST', body));

export const useRecordWalkover = (eventId: number) =>
  useBracketMutation(eventId, (input: RecordWalkover) => recordWalkover(eventId, input));
