import { localDb } from '../../local/db';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import type { DeskItem } from './deskItems';

/**
 * Records the judge's signature on each end, one outbox row each. Sent once the judge pauses, like
 * a writer's taps: a sync's writes and re-reads do not compete with the next signature's paint.
 */
export async function signEnds(userId: number, items: DeskItem[]): Promise<void> {
  for (const item of items) {
    const archer = item.target.archers[item.archerIndex]!;
    await recordChange(localDb(), userId, {
      kind: 'end.sign',
      args: {
        sessionId: item.target.session.id,
        entryId: archer.entryId,
        endIndex: item.endIndex,
        arrows: item.view.arrows ?? [],
      },
    });
  }
  syncLoop().afterChange();
}
