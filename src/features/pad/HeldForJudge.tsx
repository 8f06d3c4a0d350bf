import type { JoinedTarget, OutboxRow } from '../../local/db';

/**
 * Values that reached the server after the session closed. They are not lost and not refused:
 * the server keeps them until a judge accepts them (they then count) or rejects them (the
 * reason then shows as a refusal). Shown for as long as they wait.
 */
export function HeldForJudge({ rows, target }: { rows: OutboxRow[]; target: JoinedTarget }) {
  // Each tap sends the whole end: only the latest of an end (and slot) is what waits.
  const latest = [
    ...new Map(
      [...rows]
        .sort((a, b) => a.seq - b.seq)
        .map((r) => [`${r.endKey}:${r.kind}:${'slot' in r.args ? r.args.slot : 0}`, r]),
    ).values(),
  ];
  if (latest.length === 0) return null;
  const nameOf = (entryId: number) => target.archers.find((a) => a.entryId === entryId)?.name ?? 'an archer';
  return (
    <section
      aria-labelledby="held-for-judge"
      data-testid="held-for-judge"
      className="surface space-y-2 rounded-xl border-2 border-caution-ink bg-caution-bg p-3 text-caution-ink"
    >
      <h2 id="held-for-judge" className="font-bold">
        <span aria-hidden="true">▲ </span>Waiting for a judge
      </h2>
      <p>
        The session closed before these reached the event server. They are kept there, and a judge will accept
        or reject them.
      </p>
      <ul className="list-disc space-y-1 pl-5">
        {latest.map((r) => (
          <li key={r.id}>
            {'endIndex' in r.args ? `End ${r.args.endIndex + 1}` : 'Card'},{' '}
            {'entryId' in r.args ? nameOf(r.args.entryId) : 'a match'}
            {'arrows' in r.args && r.args.arrows.length > 0 ? `: ${r.args.arrows.join(' ')}` : ''}
          </li>
        ))}
      </ul>
    </section>
  );
}
