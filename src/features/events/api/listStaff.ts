import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { StaffList } from '../../../contract/events';
import { eventKeys, eventPath } from '../../../api/eventKeys';

export const fetchStaff = (eventId: number) => apiRequest<StaffList>(eventPath(eventId, '/staff'));

export const staffQuery = (eventId: number) =>
  queryOptions({ queryKey: eventKeys.staff(eventId), queryFn: () => fetchStaff(eventId) });

export const useStaff = (eventId: number) => useQuery(staffQuery(eventId));
