import { Link } from 'react-router-dom';
import { useLiveQuery } from 'dexie-react-hooks';
import { localDb } from '../../local/db';
import { TASK_LABELS } from '../../ui/scorecard/taskNames';

/** Targets this phone has joined: they open offline, straight from IndexedDB. */
export function MyTargets({ userId }: { userId: number }) {
  const targets = useLiveQuery(
    () =>
      localDb()
        .targets.where('userId')
        .equals(userId)
        .toArray()
        .then((mine) => mine.sort((a, b) => b.joinedAt.localeCompare(a.joinedAt))),
    [userId],
  );
  return (
    <section aria-label="Your targets" className="space-y-3">
      <h2 className="text-2xl font-bold">Your targets</h2>
      {targets && targets.length > 0 ? (
        <ul className="space-y-2">
          {targets.map((t) => (
            <li key={t.key}>
              <Link
                to={`/pad/${t.session.id}/${t.targetNumber}`}
                className="surface flex min-h-16 items-center justify-between rounded-xl border-2 border-ink bg-card p-3"
              >
                <span>
                  <span className="block text-xl font-bold">Target {t.targetNumber}</span>
                  <span className="block text-base">
                    {t.event.name} · {t.session.name}
                  </span>
                </span>
                <span className="font-bold">{TASK_LABELS[t.task]} ▸</span>
              </Link>
            </li>
          ))}
        </ul>
      ) : (
        <p>Scan the join code on your target sheet to start scoring.</p>
      )}
      <Link
        to="/join"
        className="flex min-h-14 items-center justify-center rounded-lg bg-moss px-5 text-lg font-bold text-white"
      >
        Join a target
      </Link>
    </section>
  );
}
