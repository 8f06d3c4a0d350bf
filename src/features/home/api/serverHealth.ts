import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import { healthSchema, type Health } from '../../../contract/health';

async function fetchServerHealth(): Promise<Health> {
  return healthSchema.parse(await apiRequest<unknown>('/api/health'));
}

export const serverHealthQuery = queryOptions({
  queryKey: ['server-health'],
  queryFn: fetchServerHealth,
  retry: 1,
});

export const useServerHealth = () => useQuery(serverHealthQuery);
