import { Link } from 'react-router-dom';

/** Shown instead of a blank page when a screen fails to load or throws (see RouteBoundary). */
export function RouteError({ error }: { error: unknown }) {
  const detail = error instanceof Error ? error.message : 'Unknown problem';
  // A lazy chunk that cannot be fetched offline is the most common cause on the field.
  const offline = typeof navigator !== 'undefined' && !navigator.onLine;
  return (
    <div className="mx-auto max-w-xl space-y-4 p-5" role="alert">
      <h1 className="text-2xl font-bold">This screen could not be shown</h1>
      <p>
        {offline
          ? 'This phone is offline and this screen was not saved on it yet. Reload once you have signal again.'
          : 'Something went wrong while showing this screen. Reloading usually fixes it.'}
      </p>
      <p className="text-base text-ink-soft">Details: {detail}</p>
      <div className="flex gap-3">
        <button
          type="button"
          className="min-h-14 rounded-lg bg-moss px-5 font-bold text-white"
          onClick={() => window.location.reload()}
        >
          Reload
        </button>
        <Link to="/" className="flex min-h-14 items-center rounded-lg border-2 border-ink px-5 font-bold">
          Go to start
        </Link>
      </div>
    </div>
  );
}
