import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from './request';
import type { ArcherPlace } from '../contract/archerPlace';

export const archerPlaceQuery = (sessionId: number, entryId: number) =>
  queryOptions({
    queryKey: ['place', sessionId, entryId],
    queryFn: () => apiRequest<ArcherPlace>(`/api/places/${sessionId}/${entryId}`),
    // Places move as other targets' ends are signed: look again now and then while shown.
    refetchInterval: 30_000,
  });

/** The archer's live place; the last copy stays (saved with the query cache) for offline use. */
export const useArcherPlace = (sessionId: number, entryId: number) =>
  useQuery(archerPlaceQuery(sessionId, entryId));
