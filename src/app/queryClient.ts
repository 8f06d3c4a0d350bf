import { QueryClient, defaultShouldDehydrateQuery } from '@tanstack/react-query';
import { createSyncStoragePersister } from '@tanstack/query-sync-storage-persister';
import type {
  PersistQueryClientOptions,
  PersistedClient,
  Persister,
} from '@tanstack/react-query-persist-client';
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

const STORAGE_KEY = 'ringcall.query-cache';
const saved = createSyncStoragePersister({ storage: window.localStorage, key: STORAGE_KEY });
/** The saved copy names its person in its buster (stamped when it is taken, not when written later). */
const personal = (buster: string) => `${buster}|${phoneOwner() ?? 'nobody'}`;
/** The newest copy handed to the (throttled) writer and not yet known to be written. */
let unwritten: PersistedClient | undefined;
// A reload, a closed tab or a phone putting the browser away must not lose the last second's
// answers (a signed card would come back unsigned offline): write the newest copy at once.
const writeNow = () => {
  if (!unwritten) return;
  try {
    window.localStorage.setItem(STORAGE_KEY, JSON.stringify(unwritten));
  } catch {
    // Storage full: the throttled writer's copy (or none) stays; the screens ask the server again.
  }
  unwritten = undefined;
};
// What is in memory belongs to the person who signed in last; another person starts empty.
onOwnerChange(() => {
  unwritten = undefined;
  queryClient.clear();
});
window.addEventListener('pagehide', writeNow);
document.addEventListener('visibilitychange', () => {
  if (document.visibilityState === 'hidden') writeNow();
});
const personBound: Persister = {
  persistClient: (client) => {
    unwritten = { ...client, buster: personal(client.buster) };
    return saved.persistClient(unwritten);
  },
  restoreClient: async () => {
    const client = await saved.restoreClient();
    if (client?.buster === personal(__APP_VERSION__)) return { ...client, buster: __APP_VERSION__ };
    // Another person's copy, or an older version's: never restored.
    if (client) await saved.removeClient();
    return undefined;
  },
  removeClient: () => {
    unwritten = undefined;
    return saved.removeClient();
  },
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
