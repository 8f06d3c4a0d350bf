import { eventPath, jsonBody, send } from '../../../api/eventKeys';
import { useBracketMutation, type BracketsAnswer } from './bracketMutation';

export type PlaceMatch = { matchId: number; targetNumber: number | null };

export const placeMatch = (eventId: number, { matchId, targetNumber }: PlaceMatch) =>
  send<BracketsAnswer>(eventPath(eventId, `/matches/${matchId}/target`), jsonBody('PATCH', { targetNumber }));

export const usePlaceMatch = (eventId: number) =>
  useBracketMutation(eventId, (input: PlaceMatch) => placeMatch(eventId, input));
