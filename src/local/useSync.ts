import { useEffect, useSyncExternalStore } from 'react';
import { useLiveQuery } from 'dexie-react-hooks';
import { localDb } from './db';
import { syncLoop, type SyncStatus } from './syncLoop';
import { summarizeWaiting, type WaitingSummary } from './waitingSummary';
import { useMe } from '../features/auth/api/me';

export function useSyncStatus(): SyncStatus {
  const loop = syncLoop();
  return useSyncExternalStore(loop.subscribe, loop.getStatus, loop.getStatus);
}

const NOTHING_WAITING: WaitingSummary = { changes: 0, ends: 0, signatures: 0 };

/** Changes on this phone not yet accepted by the server (all people who used this phone), as ends and signatures. */
export function useWaiting(): WaitingSummary {
  return useLiveQuery(
    async () => summarizeWaiting(await localDb().outbox.where('status').equals('pending').toArray()),
    [],
    NOTHING_WAITING,
  );
}

/** Refused changes the person has not looked at yet. */
export function useUnseenRejections() {
  return useLiveQuery(
    () =>
      localDb()
        .outbox.where('status')
        .equals('rejected')
        .filter((r) => !r.seenAt)
        .toArray(),
    [],
    [],
  );
}

/** Connects the sync loop to whoever is signed in. */
export function useSyncBridge(): void {
  const me = useMe();
  const userId = me.data?.user.id;
  const known = me.data !== undefined;
  useEffect(() => {
    // Until the sign-in is known (offline start), keep the loop idle rather than "signed out".
    if (!known) return;
    syncLoop().setUser(userId);
  }, [userId, known]);
}

export type StoragePersistence = 'granted' | 'refused' | 'unsupported';

/** Asks the browser not to clear Ringcall's data under storage pressure; remembers the answer. */
export async function askPersistentStorage(): Promise<StoragePersistence> {
  if (!navigator.storage?.persist) return 'unsupported';
  const already = await navigator.storage.persisted();
  const result: StoragePersistence = already || (await navigator.storage.persist()) ? 'granted' : 'refused';
  await localDb().meta.put({ key: 'storagePersistence', value: result });
  return result;
}
