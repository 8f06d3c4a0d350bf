import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { EventResults, ResultsSettings } from '../../../contract/results';
import { resultsKey } from '../../../api/eventResults';

export const updateResultsSettings = (eventId: number, settings: ResultsSettings) =>
  apiRequest<EventResults>(`/api/events/${eventId}/results-settings`, {
    method: 'PATCH',
    body: JSON.stringify(settings),
  });

/** The organizer's results settings (publish, team size, cuts); the results are fetched again after. */
export function useUpdateResultsSettings(eventId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (settings: ResultsSettings) => updateResultsSettings(eventId, settings),
    networkMode: 'always',
    onSuccess: () => client.invalidateQueries({ queryKey: resultsKey(eventId) }),
  });
}
