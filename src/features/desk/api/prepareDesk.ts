import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { TargetPackage } from '../../../contract/sync';
import { fetchSessionTargets } from '../../../api/sessionTargets';
import { localDb, targetKeyOf, type JoinedTarget } from '../../../local/db';
import { syncLoop } from '../../../local/syncLoop';
import { askPersistentStorage } from '../../../local/useSync';
import { pullCursorKey } from '../../../local/personMeta';

/**
 * Keeps every target of a session on the judge's phone, so the desk works on the field without
 * signal; the sync loop then pulls every end of the event (judges see all of it).
 */
export async function prepareDesk(eventId: number, sessionId: number, userId: number): Promise<number> {
  const list = await fetchSessionTargets(eventId, sessionId);
  const packages = await Promise.all(
    list.targets.map((t) => apiRequest<TargetPackage>(`/api/targets/${sessionId}/${t.targetNumber}`)),
  );
  const joinedAt = new Date().toISOString();
  const db = localDb();
  await db.transaction('rw', db.targets, db.meta, async () => {
    for (const pkg of packages) {
      const row: JoinedTarget = {
        ...pkg,
        key: targetKeyOf(userId, sessionId, pkg.targetNumber),
        userId,
        joinedAt,
      };
      await db.targets.put(row);
    }
    // A fresh pull brings every end recorded before the desk was prepared.
    await db.meta.put({ key: pullCursorKey(userId), value: 0 });
  });
  await askPersistentStorage();
  syncLoop().kick();
  return packages.length;
}

export const usePrepareDesk = (eventId: number, sessionId: number, userId: number) =>
  useMutation({ mutationFn: () => prepareDesk(eventId, sessionId, userId) });
