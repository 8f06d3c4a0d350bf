import { cardKeyOf } from '../contract/recordKeys';
import type { EndRecordDto } from '../contract/sync';
import type { CardRecordsRow, LocalDb } from './db';

/**
 * Stores writer records in their cards' rows (one row per archer and session): each record
 * replaces the stored one of its end and writer unless that one is newer. Changes arrive in
 * order, but an older revision never replaces a newer one on the phone.
 */
export async function storeRecords(table: LocalDb['cardRecords'], records: EndRecordDto[]): Promise<void> {
  const byCard = new Map<string, EndRecordDto[]>();
  for (const r of records) {
    const key = cardKeyOf(r.sessionId, r.entryId);
    const card = byCard.get(key);
    if (card) card.push(r);
    else byCard.set(key, [r]);
  }
  const keys = [...byCard.keys()];
  const stored = await table.bulkGet(keys);
  const rows = keys.map((cardKey, i): CardRecordsRow => {
    const card = new Map((stored[i]?.records ?? []).map((r) => [`${r.endIndex}:${r.slot}`, r]));
    for (const r of byCard.get(cardKey)!) {
      const held = card.get(`${r.endIndex}:${r.slot}`);
      if (!held || held.revision <= r.revision) card.set(`${r.endIndex}:${r.slot}`, r);
    }
    return { cardKey, sessionId: byCard.get(cardKey)![0]!.sessionId, records: [...card.values()] };
  });
  await table.bulkPut(rows);
}
