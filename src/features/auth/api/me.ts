import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest, isSignedOutError } from '../../../api/request';
import type { Me } from '../../../contract/auth';

/**
 * Who is signed in, and their roles. Persisted with the query cache so the phone still knows
 * its person offline. A 401 means "signed out" (null), not an error.
 */
export async function fetchMe(): Promise<Me | null> {
  try {
    return await apiRequest<Me>('/api/me');
  } catch (error) {
    if (isSignedOutError(error)) return null;
    throw error;
  }
}

// Always re-checked when a screen mounts: a restored copy may predate a sign-out in another tab.
export const meQuery = queryOptions({
  queryKey: ['me'],
  queryFn: fetchMe,
  staleTime: 60_000,
  refetchOnMount: 'always',
});

export const useMe = () => useQuery(meQuery);
