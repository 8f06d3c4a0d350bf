import { useEffect, useSyncExternalStore } from 'react';
import { useLiveQuery } from 'dexie-react-hooks';
import { localDb } from './db';
import { waitingCount } from './outbox';
import { syncLoop, type SyncStatus } from './syncLoop';
import { useMe } from '../features/auth/api/me';
import { usePhoneOwner } from './phoneOwner';

export function useSyncStatus(): SyncStatus {
  const loop = syncLoop();
  return useSyncExternalStore(loop.subscribe, loop.getStatus, loop.getStatus);
}

/**
 * The changes of the person whose data this phone holds that the server has not accepted yet.
 * Another person's waiting changes stay on the phone but are never counted or shown here.
 */
export function useWaitingCount(): number {
  const owner = usePhoneOwner();
  return useLiveQuery(() => (owner === undefined ? 0 : waitingCount(localDb(), owner)), [owner], 0);
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
