import type { EndSignatureDto, RulingDto } from '../../../src/contract/judging';
import type { Db } from '../../db';
import { toEndSignature, toRuling, type EndSignatureRow, type RulingRow } from './fieldRows';

/** A stored judging row with its id and the record phones see. */
export type StoredJudging<Row, Dto> = { id: number; row: Row; dto: Dto };

/**
 * The rulings (oldest first) and the current (not superseded) end signatures of some archers'
 * ends, with the judges' names: the one query the push's checks (FieldBatch) and the judge's and
 * archer's views (loadEndRecords) read them with. `rulingEnds` narrows the rulings to those ends.
 */
export async function loadRulingsAndSignatures(
  db: Db,
  scope: { sessionIds: readonly number[]; entryIds: readonly number[]; rulingEnds?: readonly number[] },
): Promise<{
  rulings: StoredJudging<RulingRow, RulingDto>[];
  signatures: StoredJudging<EndSignatureRow, EndSignatureDto>[];
}> {
  const of = (table: string) =>
    db(`${table} as t`).whereIn('t.session_id', scope.sessionIds).whereIn('t.entry_id', scope.entryIds);
  const rulingQuery = of('end_rulings').join('users as u', 'u.id', 't.judged_by');
  if (scope.rulingEnds) rulingQuery.whereIn('t.end_index', scope.rulingEnds);
  const rulings = (await rulingQuery.orderBy('t.id').select('t.*', 'u.display_name')) as (RulingRow & {
    id: number;
    display_name: string;
  })[];
  const signatures = (await of('end_signatures')
    .join('users as u', 'u.id', 't.signed_by')
    .whereNull('t.superseded_at')
    .select('t.*', 'u.display_name')) as (EndSignatureRow & { id: number; display_name: string })[];
  return {
    rulings: rulings.map(({ id, display_name, ...row }) => ({
      id,
      row,
      dto: toRuling(id, row, display_name),
    })),
    signatures: signatures.map(({ id, display_name, ...row }) => ({
      id,
      row,
      dto: toEndSignature(id, row, display_name),
    })),
  };
}
