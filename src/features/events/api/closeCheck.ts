import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { CloseCheck } from '../../../contract/lateValues';
import { sessionPath } from '../../../api/sessionTargets';

export const fetchCloseCheck = (eventId: number, sessionId: number) =>
  apiRequest<CloseCheck>(sessionPath(eventId, sessionId, '/close-check'));

/** Asked fresh each time the organizer is about to close: it is about what phones sent last. */
export const closeCheckQuery = (eventId: number, sessionId: number) =>
  queryOptions({
    queryKey: ['events', eventId, 'sessions', sessionId, 'close-check'] as const,
    queryFn: () => fetchCloseCheck(eventId, sessionId),
    staleTime: 0,
    gcTime: 0,
  });

export const useCloseCheck = (eventId: number, sessionId: number, enabled: boolean) =>
  useQuery({ ...closeCheckQuery(eventId, sessionId), enabled });
