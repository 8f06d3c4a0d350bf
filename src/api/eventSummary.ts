import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from './request';
import type { EventSummary } from '../contract/events';
import { eventKeys, eventPath } from './eventKeys';

export const fetchEventSummary = (eventId: number) => apiRequest<EventSummary>(eventPath(eventId));

export const eventSummaryQuery = (eventId: number) =>
  queryOptions({ queryKey: eventKeys.summary(eventId), queryFn: () => fetchEventSummary(eventId) });

export const useEventSummary = (eventId: number) => useQuery(eventSummaryQuery(eventId));
