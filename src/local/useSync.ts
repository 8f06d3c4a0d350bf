import { useEffect, useSyncExternalStore } from 'react';
import { useLiveQuery } from 'dexie-react-hooks';
import { localDb } from './db';
import { syncLoop, type SyncStatus } from './syncLoop';
import { summarizeWaiting, type WaitingSummary } from './waitingSummary';
import { useMe } from './me';
import { usePhoneOwner } from './phoneOwner';
import { afterFirstScreen } from './firstScreen';

export function useSyncStatus(): SyncStatus {
  const loop = syncLoop();
  return useSyncExternalStore(loop.subscribe, loop.getStatus, loop.getStatus);
}

const NOTHING_WAITING: WaitingSummary = {
  changes: 0,
  ends: 0,
  signatures: 0,
  shootOffArrows: 0,
  practiceSessions: 0,
};

/**
 * The changes of the person whose data this phone holds that the server has not accepted yet, as
 * ends and signatures. Another person's waiting changes stay on the phone but are never counted here.
 */
export function useWaiting(): WaitingSummary {
  const owner = usePhoneOwner();
  return useLiveQuery(
    async () =>
      owner === undefined
        ? NOTHING_WAITING
        : summarizeWaiting(
            await localDb()
              .outbox.where('status')
              .equals('pending')
              .filter((r) => r.userId === owner)
              .toArray(),
          ),
    [owner],
    NOTHING_WAITING,
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
    // Opened on the pad, the first round waits until the pad has drawn; no change is lost
    // meanwhile: the round then sends everything waiting in the outbox.
    return afterFirstScreen(() => syncLoop().setUser(userId));
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
