import type { ChangeDto, EndRecordDto } from '../contract/sync';
import { isPracticeChange } from '../contract/practiceChange';
import {
  cardKeyOf,
  endKeyOf,
  type CardSignatureRow,
  type EndSignatureRow,
  type LocalDb,
  type OutboxRow,
  type RulingRow,
  type SettlementRow,
} from './db';
import { storeRecords } from './cardRecords';

/**
 * Stores what a pull brought (the server's copies and the judges' decisions on late changes), in
 * the sync's transaction; the person's own practice is stored by applyPulledPractice.
 */
export async function storePulled(db: LocalDb, changes: ChangeDto[]): Promise<void> {
  await applyLateDecisions(db, changes);
  await applyChanges(db, changes);
}

/**
 * A judge's decision on changes this phone sent after their session closed: accepted ones are
 * delivered (their effect comes as ordinary records), rejected ones are shown with the reason.
 */
async function applyLateDecisions(db: LocalDb, changes: ChangeDto[]): Promise<void> {
  const decisions = changes.flatMap((c) => (c.type === 'late-value' ? [c.record] : []));
  if (decisions.length === 0) return;
  const rows = await db.outbox
    .where('id')
    .anyOf(decisions.map((d) => d.mutationId))
    .toArray();
  const decided = rows.flatMap((row): OutboxRow[] => {
    const d = decisions.find((x) => x.mutationId === row.id);
    if (!d || row.status !== 'held') return [];
    // A replaced value is no longer waiting: a later one of the same end from this phone speaks for it.
    if (d.status !== 'rejected') return [{ ...row, status: 'applied' }];
    return [
      {
        ...row,
        status: 'rejected',
        reason: `${d.decidedByName ?? 'A judge'} (judge) rejected this value: ${d.reason ?? ''}`,
      },
    ];
  });
  await db.outbox.bulkPut(decided);
}

/** Stores pulled changes; within one pull, a later change to the same record replaces an earlier one. */
async function applyChanges(db: LocalDb, changes: ChangeDto[]): Promise<void> {
  const cards = new Map<number, CardSignatureRow>();
  const rulings = new Map<number, RulingRow>();
  const signatures = new Map<number, EndSignatureRow>();
  const settlements = new Map<string, SettlementRow>();
  const records: EndRecordDto[] = [];
  for (const change of changes) {
    if (change.type === 'late-value' || isPracticeChange(change)) continue; // see applyLateDecisions, applyPulledPractice
    if (change.type === 'card-signature') {
      const r = change.record;
      cards.set(r.id, { ...r, cardKey: cardKeyOf(r.sessionId, r.entryId) });
      continue;
    }
    const r = change.record;
    const endKey = endKeyOf(r.sessionId, r.entryId, r.endIndex);
    if (change.type === 'ruling') rulings.set(change.record.id, { ...change.record, endKey });
    else if (change.type === 'signature') signatures.set(change.record.id, { ...change.record, endKey });
    else if (change.type === 'settlement') settlements.set(endKey, { ...change.record, endKey });
    else records.push(change.record);
  }
  await Promise.all([
    db.cardSignatures.bulkPut([...cards.values()]),
    db.rulings.bulkPut([...rulings.values()]),
    db.endSignatures.bulkPut([...signatures.values()]),
    db.settlements.bulkPut([...settlements.values()]),
    storeRecords(db.cardRecords, records),
  ]);
}
