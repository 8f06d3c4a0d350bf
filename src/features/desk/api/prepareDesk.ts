import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { SessionPackages } from '../../../contract/sync';
import { localDb, targetKeyOf, type JoinedTarget } from '../../../local/db';
import { syncLoop } from '../../../local/syncLoop';
import { askPersistentStorage } from '../../../local/useSync';
import { pullCursorKey } from '../../../local/personMeta';

/**
 * Keeps every target of a session on the judge's phone, so the desk works on the field without
 * signal; the sync loop then pulls every end of the event (judges see all of it). The packages
 * come in one request: one a target took seconds on a phone (six connections at a time).
 */
export async function prepareDesk(sessionId: number, userId: number): Promise<number> {
  const { targets: packages } = await apiRequest<SessionPackages>(`/api/targets/${sessionId}`);
  const joinedAt = new Date().toISOString();
  const db = localDb();
  await db.transaction('rw', db.targets, db.meta, async () => {
    await db.targets.bulkPut(
      packages.map(
        (pkg): JoinedTarget => ({
          ...pkg,
          key: targetKeyOf(userId, sessionId, pkg.targetNumber),
          userId,
          joinedAt,
        }),
      ),
    );
    // A fresh pull brings every end recorded before the desk was prepared.
    await db.meta.put({ key: pullCursorKey(userId), value: 0 });
  });
  await askPersistentStorage();
  syncLoop().kick();
  return packages.length;
}

export const usePrepareDesk = (sessionId: number, userId: number) =>
  useMutation({ mutationFn: () => prepareDesk(sessionId, userId) });
