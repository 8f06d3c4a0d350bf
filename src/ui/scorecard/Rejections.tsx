import { localDb, type OutboxRow } from '../../local/db';
import type { JoinedTarget } from '../../local/db';

/** Changes the server refused, with its reason, until the person has read them. Never silent. */
export function Rejections({ rows, target }: { rows: OutboxRow[]; target: JoinedTarget }) {
  const unseen = rows.filter((r) => !r.seenAt);
  if (unseen.length === 0) return null;
  const nameOf = (entryId: number) => target.archers.find((a) => a.entryId === entryId)?.name ?? 'an archer';
  return (
    <section
      role="alert"
      className="surface space-y-2 rounded-xl border-2 border-brick bg-brick-bg p-3 text-brick"
    >
      <h2 className="font-bold">▲ Not accepted by the event server</h2>
      <ul className="space-y-1">
        {unseen.map((r) => (
          <li key={r.id}>
            {'endIndex' in r.args ? `End ${r.args.endIndex + 1}` : 'Card'},{' '}
            {'entryId' in r.args ? nameOf(r.args.entryId) : 'a match'}: {r.reason}
          </li>
        ))}
      </ul>
      <button
        type="button"
        className="min-h-12 rounded-lg border-2 border-brick bg-card px-3 font-bold"
        onClick={() =>
          void localDb().transaction('rw', localDb().outbox, async () => {
            const at = new Date().toISOString();
            for (const r of unseen) await localDb().outbox.update([r.clientId, r.seq], { seenAt: at });
          })
        }
      >
        I have read this
      </button>
    </section>
  );
}
