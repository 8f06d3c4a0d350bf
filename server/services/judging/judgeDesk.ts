import { endView, endTotal, endsOfRound, type RoundDefinition } from '../../../src/core';
import type { Position } from '../../../src/contract/events';
import type { JudgeDeskItem } from '../../../src/contract/judging';
import type { Db } from '../../db';
import type { SessionRow } from '../organizer/sessions';
import { loadEndRecords, type StoredEnd } from './endRecords';
import { arrowsInWords, differingPositions, incidentsInWords, incidentsOf } from './endWords';

const latest = (...times: (string | undefined)[]): string =>
  times.filter((t): t is string => !!t).sort((a, b) => b.localeCompare(a))[0] ?? '';

const DECIDED_BY = {
  writers: 'Agreed by the writers',
  caller: 'Settled by the caller',
  judge: 'Ruled by a judge',
};

/**
 * The judge desk of a session: what needs a judge, oldest first. Disputes (arrows a caller sent
 * to a judge), incidents (marks no ruling has answered), mismatches nobody settled, and decided
 * ends waiting for a signature. One end can appear twice (a dispute and an incident). Signed
 * ends need nothing.
 */
export async function judgeDesk(
  db: Db,
  session: SessionRow,
  targetNumber?: number,
): Promise<JudgeDeskItem[]> {
  const query = db('target_assignments as ta')
    .join('entries as e', 'e.id', 'ta.entry_id')
    .join('session_divisions as sd', (j) =>
      j.on('sd.session_id', 'ta.session_id').andOn('sd.division_id', 'e.division_id'),
    )
    .where('ta.session_id', session.id)
    .select('ta.entry_id', 'ta.target_number', 'ta.position', 'e.name', 'sd.round_json');
  if (targetNumber !== undefined) query.where('ta.target_number', targetNumber);
  const archers = (await query) as {
    entry_id: number;
    target_number: number;
    position: Position;
    name: string;
    round_json: string;
  }[];
  const stored = await loadEndRecords(
    db,
    session.id,
    archers.map((a) => a.entry_id),
  );

  const items: JudgeDeskItem[] = [];
  for (const archer of archers) {
    const round = JSON.parse(archer.round_json) as RoundDefinition;
    for (const end of endsOfRound(round)) {
      const s: StoredEnd = stored.end(archer.entry_id, end.index);
      if (s.signature || (!s.first && !s.second && !s.ruling)) continue;
      const facts = stored.facts(archer.entry_id, end.index);
      const view = endView(facts);
      const item = (
        kind: JudgeDeskItem['kind'],
        since: string,
        detail: string,
        extra: Pick<JudgeDeskItem, 'positions' | 'arrows'> = { positions: [] },
      ) =>
        items.push({
          kind,
          sessionId: session.id,
          targetNumber: archer.target_number,
          entryId: archer.entry_id,
          position: archer.position,
          archerName: archer.name,
          endIndex: end.index,
          since,
          detail,
          ...extra,
        });
      const written = latest(s.first?.written_at, s.second?.written_at);

      if (view.state === 'disputed') {
        const disputed = facts.settlement!.disputed;
        const values = disputed.map((p) => {
          const a = view.check.arrows[p];
          return a ? `${a.first ?? '–'} or ${a.second ?? '–'}` : '';
        });
        item(
          'dispute',
          s.settlement!.settled_at,
          `The caller sent ${arrowsInWords(disputed)} to a judge (the writers have ${values.join('; ')}).`,
          { positions: [...disputed] },
        );
      }
      if (view.openIncidents > 0) {
        const incidents = incidentsOf(facts);
        const marked = incidents.map((i) => i.index);
        const text = incidentsInWords(incidents);
        item('incident', written, `${text.charAt(0).toUpperCase()}${text.slice(1)}.`, {
          positions: [...new Set(marked)],
        });
      }
      if (view.state === 'mismatch') {
        const positions = differingPositions(view);
        item(
          'mismatch',
          written,
          `The two cards differ at ${arrowsInWords(positions)}${view.settlementStale ? ' (changed after the caller settled it)' : ''}; nobody has settled it.`,
          { positions },
        );
      }
      // Only a whole end can be signed; one the writers are still tapping waits.
      if (view.canSign && view.arrows && view.arrows.length === end.arrows) {
        const since = latest(
          written,
          view.decidedBy === 'caller' ? s.settlement?.settled_at : undefined,
          view.decidedBy === 'judge' ? s.ruling?.judgedAt : undefined,
        );
        item(
          'to-sign',
          since,
          `${DECIDED_BY[view.decidedBy ?? 'writers']}: ${view.arrows.join(' ')} (${endTotal(view.arrows)}).`,
          { positions: [], arrows: view.arrows },
        );
      }
    }
  }
  return items.sort(
    (a, b) =>
      a.since.localeCompare(b.since) ||
      a.targetNumber - b.targetNumber ||
      a.position.localeCompare(b.position) ||
      a.endIndex - b.endIndex,
  );
}
