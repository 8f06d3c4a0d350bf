import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from './request';
import type { SetMemberTaskInput, TargetMember } from '../contract/targetTasks';

const membersPath = (eventId: number, sessionId: number, targetNumber: number) =>
  `/api/events/${eventId}/sessions/${sessionId}/targets/${targetNumber}/members`;
const membersKey = (eventId: number, sessionId: number, targetNumber: number) =>
  ['events', eventId, 'sessions', sessionId, 'targets', targetNumber, 'members'] as const;

export const useTargetMembers = (eventId: number, sessionId: number, targetNumber: number) =>
  useQuery({
    queryKey: membersKey(eventId, sessionId, targetNumber),
    queryFn: () => apiRequest<TargetMember[]>(membersPath(eventId, sessionId, targetNumber)),
  });

/** Frees or reassigns a task; the answer is the group as it is now. */
export function useSetMemberTask(eventId: number, sessionId: number, targetNumber: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, task }: { userId: number } & SetMemberTaskInput) =>
      apiRequest<TargetMember[]>(`${membersPath(eventId, sessionId, targetNumber)}/${userId}`, {
        method: 'PUT',
        body: JSON.stringify({ task }),
      }),
    networkMode: 'always',
    onSuccess: (members) => client.setQueryData(membersKey(eventId, sessionId, targetNumber), members),
  });
}
