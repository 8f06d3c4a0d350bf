import { useLiveQuery } from 'dexie-react-hooks';
import { Link, useLocation } from 'react-router-dom';
import { localDb } from '../../local/db';
import { saveWaitingFile } from '../../local/saveWaitingFile';
import { useSyncStatus, useWaiting } from '../../local/useSync';
import { changesWords, waitingWords } from '../../local/waitingSummary';
import { syncLoop } from '../../local/syncLoop';
import { useOnline } from '../../local/online';
import { signInThenBack } from '../../account/nextPath';

/** What waits to sync, in words, with a way to send now and a file for the judge if it cannot. */
export function SyncLine() {
  const summary = useWaiting();
  const waiting = summary.changes;
  const status = useSyncStatus();
  const online = useOnline();
  const here = useLocation();
  const persistence = useLiveQuery(() => localDb().meta.get('storagePersistence'), [])?.value;
  // What waits in a person's terms, with the exact number of changes beside it.
  const what = `${waitingWords(summary)} (${changesWords(summary)})`;
  const text =
    waiting === 0
      ? status.lastSyncAt
        ? `✓ Everything on this phone has reached the event server.`
        : '✓ Nothing waiting to send.'
      : status.phase === 'signed-out'
        ? `▲ ${what} waiting for you to sign in again. They are kept on this phone.`
        : !online || status.phase === 'offline'
          ? `▲ ${what} waiting for signal. They are kept on this phone.`
          : status.phase === 'error'
            ? `▲ ${what} waiting. ${status.lastError ?? ''} Trying again soon.`
            : `↻ Sending ${what}…`;
  return (
    <section aria-label="Sync" className="surface space-y-2 rounded-xl border border-line bg-card p-3">
      <p data-testid="sync-line">{text}</p>
      {persistence === 'refused' && (
        <p className="text-base">
          This browser may clear stored data when the phone is short of space. Sync whenever you have signal.
        </p>
      )}
      {waiting > 0 && (
        <div className="flex flex-wrap gap-2">
          {status.phase === 'signed-out' && (
            // Back here after signing in: the loop then sends what waits (see SyncLoop.signedIn).
            <Link
              to={signInThenBack(here.pathname + here.search)}
              className="inline-flex min-h-12 items-center rounded-lg border-2 border-ink px-3 font-bold"
            >
              Sign back in to send them
            </Link>
          )}
          <button
            type="button"
            className="min-h-12 rounded-lg border-2 border-ink px-3 font-bold"
            onClick={() => syncLoop().kick()}
          >
            Send now
          </button>
          <button
            type="button"
            className="min-h-12 rounded-lg border-2 border-ink px-3 font-bold"
            onClick={() => void saveWaitingFile()}
          >
            Save waiting changes as a file
          </button>
        </div>
      )}
    </section>
  );
}
