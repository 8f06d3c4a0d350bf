import { useOnline } from '../local/online';

/** Quiet, always-visible network state: a shape and a word, never colour alone. */
export function ConnectionBadge() {
  const online = useOnline();
  return (
    <span
      role="status"
      aria-live="polite"
      data-testid="connection-badge"
      className={`inline-flex items-center gap-2 rounded-full border-2 px-3 py-1 text-base font-bold ${
        online ? 'border-white/70 text-white' : 'border-caution-bg bg-caution-bg text-caution-ink'
      }`}
    >
      <span aria-hidden="true">{online ? '●' : '▲'}</span>
      {online ? 'Online' : 'Offline'}
    </span>
  );
}
