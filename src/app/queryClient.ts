import { QueryClient, defaultShouldDehydrateQuery } from '@tanstack/react-query';
import { createSyncStoragePersister } from '@tanstack/query-sync-storage-persister';
import type { PersistQueryClientOptions, Persister } from '@tanstack/react-query-persist-client';
import { ApiError } from '../api/request';
import { onOwnerChange, phoneOwner } from '../local/phoneOwner';

const WEEK_MS = 7 * 24 * 60 * 60 * 1000;

const isFinalAnswer = (error: unknown) =>
  error instanceof ApiError &&
  error.status >= 400 &&
  error.status < 500 &&
  ![408, 429].includes(error.status);

export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      // Kept as long as the persisted copy so screens still render after days offline.
      gcTime: WEEK_MS,
      staleTime: 30_000,
      // Try the network even when the browser claims to be offline: field Wi-Fi often lies.
      networkMode: 'offlineFirst',
      // A refusal or a bad address does not change by asking again; a lost connection may.
      retry: (failures, error) => failures < 3 && !isFinalAnswer(error),
    },
  },
});

// What is in memory belongs to the person who signed in last; another person starts empty.
onOwnerChange(() => queryClient.clear());

const saved = createSyncStoragePersister({ storage: window.localStorage, key: 'ringcall.query-cache' });
/** The saved copy names its person in its buster (stamped when it is taken, not when written later). */
const personal = (buster: string) => `${buster}|${phoneOwner() ?? 'nobody'}`;
const personBound: Persister = {
  persistClient: (client) => saved.persistClient({ ...client, buster: personal(client.buster) }),
  restoreClient: async () => {
    const client = await saved.restoreClient();
    if (client?.buster === personal(__APP_VERSION__)) return { ...client, buster: __APP_VERSION__ };
    // Another person's copy, or an older version's: never restored.
    if (client) await saved.removeClient();
    return undefined;
  },
  removeClient: saved.removeClient,
};

export const persistOptions: Omit<PersistQueryClientOptions, 'queryClient'> = {
  persister: personBound,
  maxAge: WEEK_MS,
  buster: __APP_VERSION__,
  dehydrateOptions: {
    // A failed refetch offline marks a query as errored; keep its last good data anyway.
    shouldDehydrateQuery: (q) => defaultShouldDehydrateQuery(q) || q.state.data !== undefined,
  },
};
