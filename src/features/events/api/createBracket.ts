import type { CreateBracket } from '../../../contract/matches';
import { eventPath, jsonBody, send } from '../../../api/eventKeys';
import { useBracketMutation, type BracketsAnswer } from './bracketMutation';

export const createBracket = (eventId: number, body: CreateBracket) =>
  send<BracketsAnswer>(eventPath(eventId, '/brackets'), jsonBody('POST', body));

export const useCreateBracket = (eventId: number) =>
  useBracketMutation(eventId, (body: CreateBracket) => createBracket(eventId, body));
