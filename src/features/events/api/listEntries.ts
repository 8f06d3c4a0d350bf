import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { EntryList } from '../../../contract/events';
import { eventKeys, eventPath } from '../../../api/eventKeys';

export const fetchEntries = (eventId: number) => apiRequest<EntryList>(eventPath(eventId, '/entries'));

export const entriesQuery = (eventId: number) =>
  queryOptions({ queryKey: eventKeys.entries(eventId), queryFn: () => fetchEntries(eventId) });

export const useEntries = (eventId: number) => useQuery(entriesQuery(eventId));
