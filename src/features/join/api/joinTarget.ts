import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { JoinRequest, TargetPackage } from '../../../contract/sync';
import { localDb, targetKeyOf, type JoinedTarget } from '../../../local/db';
import { askPersistentStorage } from '../../../local/useSync';
import { syncLoop } from '../../../local/syncLoop';
import { pullCursorKey } from '../../../local/personMeta';

/** Joins a target group and keeps its package on the phone for offline scoring. */
export async function joinTarget(input: JoinRequest, userId: number): Promise<JoinedTarget> {
  const pkg = await apiRequest<TargetPackage>('/api/join', { method: 'POST', body: JSON.stringify(input) });
  const row: JoinedTarget = {
    ...pkg,
    key: targetKeyOf(userId, pkg.session.id, pkg.targetNumber),
    userId,
    joinedAt: new Date().toISOString(),
  };
  await localDb().transaction('rw', localDb().targets, localDb().meta, async () => {
    await localDb().targets.put(row);
    // The server's cursor only covers what this person could see before; a new target needs a fresh pull.
    await localDb().meta.put({ key: pullCursorKey(userId), value: 0 });
  });
  await askPersistentStorage();
  syncLoop().kick();
  return row;
}

/** The person is named per call: a newcomer's account is made on the same screen just before. */
export const useJoinTarget = () =>
  useMutation({
    mutationFn: ({ input, userId }: { input: JoinRequest; userId: number }) => joinTarget(input, userId),
  });
