import type { BracketSettings } from '../../../contract/matches';
import { eventPath, jsonBody, send } from '../../../api/eventKeys';
import { useBracketMutation, type BracketsAnswer } from './bracketMutation';

export type SetBracketSettings = BracketSettings & { bracketId: number };

/** `PATCH …/brackets/:bracketId`: which of the bracket's matches are shot alternately. */
export const setBracketSettings = (eventId: number, { bracketId, ...body }: SetBracketSettings) =>
  send<BracketsAnswer>(eventPath(eventId, `/brackets/${bracketId}`), jsonBody('PATCH', body));

export const useSetBracketSettings = (eventId: number) =>
  useBracketMutation(eventId, (input: SetBracketSettings) => setBracketSettings(eventId, input));
