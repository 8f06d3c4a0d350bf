import { localDb, type OutboxRow } from '../../local/db';

/**
 * Changes the event server refused, with its reasons, until the person has read them (never
 * silent). `save` stores the reading like the screen's other changes, so a failure is shown.
 */
export function RefusedNotice({
  rows,
  save,
}: {
  rows: readonly OutboxRow[];
  save: (action: () => Promise<unknown>) => void;
}) {
  const refused = rows.filter((r) => r.status === 'rejected' && !r.seenAt);
  if (refused.length === 0) return null;
  const markRead = () => {
    const at = new Date().toISOString();
    save(() =>
      localDb().outbox.bulkUpdate(
        refused.map((r) => ({ key: [r.clientId, r.seq], changes: { seenAt: at } })),
      ),
    );
  };
  return (
    <div
      role="alert"
      className="surface rounded-lg border-2 border-brick bg-brick-bg p-3 font-bold text-brick"
      data-testid="refused-changes"
    >
      <span aria-hidden="true">▲ </span>
      Not accepted by the event server: {refused.map((r) => r.reason).join(' ')}{' '}
      <button
        type="button"
        className="min-h-12 rounded-lg border-2 border-brick bg-card px-3 font-bold"
        onClick={markRead}
      >
        I have read this
      </button>
    </div>
  );
}
