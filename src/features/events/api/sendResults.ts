import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { ResultsSendReport } from '../../../contract/results';

export const sendResults = (eventId: number) =>
  apiRequest<ResultsSendReport>(`/api/events/${eventId}/results/send`, { method: 'POST', body: '{}' });

/** "Send results": one mail to every entrant with an address (organizers, published results). */
export function useSendResults(eventId: number) {
  return useMutation({ mutationFn: () => sendResults(eventId), networkMode: 'always' });
}
