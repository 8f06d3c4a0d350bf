import { useOnline } from '../local/online';
import { useSyncStatus, useWaiting } from '../local/useSync';
import { changesWords, waitingWords } from '../local/waitingSummary';

/** Quiet, always-visible network and sync state: a shape and words, never colour alone. */
export function ConnectionBadge() {
  const online = useOnline();
  const summary = useWaiting();
  const waiting = summary.changes;
  const status = useSyncStatus();
  const attention = !online || status.phase === 'signed-out' || status.phase === 'error';
  const label = !online ? 'Offline' : status.phase === 'signed-out' && waiting > 0 ? 'Sign in' : 'Online';
  return (
    <span
      role="status"
      aria-live="polite"
      data-testid="connection-badge"
      title={
        [waiting > 0 ? `${changesWords(summary)} waiting` : '', status.lastError ?? '']
          .filter(Boolean)
          .join('. ') || undefined
      }
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border-2 px-2.5 py-1 min-[480px]:gap-2 min-[480px]:px-3 text-base font-bold ${
        attention ? 'border-caution-bg bg-caution-bg text-caution-ink' : 'border-white/70 text-white'
      }`}
    >
      <span aria-hidden="true">{attention ? '▲' : status.phase === 'syncing' ? '↻' : '●'}</span>
      {label}
      {waiting > 0 && (
        <span data-testid="waiting-count" data-waiting="">
          · {waitingWords(summary)} waiting
        </span>
      )}
    </span>
  );
}
