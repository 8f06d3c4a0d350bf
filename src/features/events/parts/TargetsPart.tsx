import { Link } from 'react-router-dom';
import type { EventSummary } from '../../../contract/events';
import { localStart } from '../../../ui/localStart';
import { GoToPart } from '../components/GoToPart';
import { archersOnTargets } from '../components/archersOnTargets';

const linkButton = 'inline-flex min-h-14 items-center rounded-lg bg-moss px-5 text-lg font-bold text-white';

/** Each session's target layout, join codes and printouts live on their own screen. */
export function TargetsPart({ summary }: { summary: EventSummary }) {
  const eventId = summary.event.id;
  if (summary.sessions.length === 0) {
    return (
      <GoToPart
        title="Targets & printing"
        text="Add a session first; targets are laid out session by session."
        part="sessions"
        label="Go to sessions"
      />
    );
  }
  return (
    <>
      <h2 className="text-2xl font-bold">Targets & printing</h2>
      <ul className="space-y-3">
        {summary.sessions.map((s) => (
          <li key={s.id} className="surface space-y-2 rounded-xl border border-line bg-card p-4">
            <p>
              <strong className="text-xl">{s.name}</strong>
              <span className="block">{localStart(s.startsAt)}</span>
              <span className="block text-base">
                {s.assignedCount === 0 ? (
                  <>
                    <span aria-hidden="true">▲ </span>No archers on targets yet
                  </>
                ) : (
                  <>
                    <span aria-hidden="true">✓ </span>
                    {archersOnTargets(s.assignedCount, s.targetCount)}
                  </>
                )}
              </span>
            </p>
            <Link to={`/events/${eventId}/sessions/${s.id}/targets`} className={linkButton}>
              Open targets of {s.name}
            </Link>
          </li>
        ))}
      </ul>
    </>
  );
}
