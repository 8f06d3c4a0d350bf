import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BracketDto } from '../../../contract/matches';
import { bracketsKey } from '../../../api/eventBrackets';

export type BracketsAnswer = { brackets: BracketDto[] };

/** A bracket change needs the server; its answer (every bracket of the event) replaces the cached brackets. */
export function useBracketMutation<Input>(eventId: number, call: (input: Input) => Promise<BracketsAnswer>) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: call,
    networkMode: 'always',
    onSuccess: (answer) => client.setQueryData(bracketsKey(eventId), answer),
  });
}
