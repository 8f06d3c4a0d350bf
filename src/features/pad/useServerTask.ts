import { useEffect, useState } from 'react';
import { ApiError, apiRequest } from '../../api/request';
import type { Task } from '../../contract/fieldTerms';
import type { TargetPackage } from '../../contract/sync';
import { localDb, type JoinedTarget } from '../../local/db';
import { useOnline } from '../../local/online';

/** What the server says of this person's place on the target, when it differs from the phone's copy. */
export type ServerTask = { kind: 'changed'; from: Task; to: Task } | { kind: 'removed' } | undefined;

/**
 * A judge or organizer may reassign or free a task while the phone keeps its own copy of the
 * target: whenever the pad opens with signal, the phone asks again and takes the new task (or
 * learns that it left the group), so a freed writer is not left typing values the server refuses.
 */
export function useServerTask(target: JoinedTarget): ServerTask {
  const online = useOnline();
  const [found, setFound] = useState<ServerTask>();
  useEffect(() => {
    if (!online) return;
    let stopped = false;
    apiRequest<TargetPackage>(`/api/targets/${target.session.id}/${target.targetNumber}`).then(
      async (pkg) => {
        if (stopped || pkg.task === target.task) return;
        await localDb().targets.update(target.key, { task: pkg.task, members: pkg.members });
        setFound({ kind: 'changed', from: target.task, to: pkg.task });
      },
      (error: unknown) => {
        if (!stopped && error instanceof ApiError && error.status === 403) setFound({ kind: 'removed' });
      },
    );
    return () => {
      stopped = true;
    };
  }, [online, target.key, target.session.id, target.targetNumber, target.task]);
  return found;
}
