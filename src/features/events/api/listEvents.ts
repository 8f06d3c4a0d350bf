import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { EventList } from '../../../contract/events';
import { eventKeys } from '../../../api/eventKeys';

export const fetchEvents = () => apiRequest<EventList>('/api/events');

export const eventsQuery = queryOptions({ queryKey: eventKeys.list, queryFn: fetchEvents });

export const useEvents = () => useQuery(eventsQuery);
