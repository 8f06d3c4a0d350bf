import { localDb } from '../../local/db';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import type { DeskItem } from './deskItems';

/** Records the judge's signature on each end, one outbox row each, then asks the sync loop to send. */
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
  syncLoop().kick();
}
