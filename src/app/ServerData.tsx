import type { ReactNode } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import { persistQueryClient } from '@tanstack/react-query-persist-client';
import { persistOptions, queryClient } from './queryClient';

/**
 * The query cache, restored from localStorage once, when the first screen that reads server data
 * opens. Screens wait for it, so a query never fetches before its saved copy is back.
 */
export const restored = persistQueryClient({ queryClient, ...persistOptions })[1];

export function ServerData({ children }: { children: ReactNode }) {
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
