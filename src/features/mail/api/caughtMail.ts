import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { CaughtMailMessage, CaughtMailSummary } from '../../../contract/caughtMail';

export const caughtMailListQuery = queryOptions({
  queryKey: ['caught-mail'],
  queryFn: () => apiRequest<{ messages: CaughtMailSummary[] }>('/api/caught-mail'),
  refetchInterval: 5_000,
});

export const caughtMailQuery = (id: number) =>
  queryOptions({
    queryKey: ['caught-mail', id],
    queryFn: () => apiRequest<CaughtMailMessage>(`/api/caught-mail/${id}`),
  });

export const useCaughtMailList = () => useQuery(caughtMailListQuery);
export const useCaughtMail = (id: number | undefined) =>
  useQuery({ ...caughtMailQuery(id ?? 0), enabled: id !== undefined });
