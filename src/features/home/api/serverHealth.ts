import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { Health } from '../../../contract/health';

async function fetchServerHealth(): Promise<Health> {
  const body = await apiRequest<Partial<Health> | undefined>('/api/health');
  // A plain check rather than the zod schema keeps zod out of the home screen's download.
  if (body?.ok !== true || typeof body.version !== 'string')
    throw new Error('The event server answered in an unexpected way.');
  return { ok: true, version: body.version };
}

export const serverHealthQuery = queryOptions({
  queryKey: ['server-health'],
  queryFn: fetchServerHealth,
  retry: 1,
});

export const useServerHealth = () => useQuery(serverHealthQuery);
