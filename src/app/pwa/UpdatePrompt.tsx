import { useRegisterSW } from 'virtual:pwa-register/react';

/**
 * How a new version reaches a phone: it downloads in the background and waits. The person taps
 * "Update now" between ends (the page reloads; entries are kept in IndexedDB). If they never do,
 * the waiting version takes over the next time the app is opened from closed.
 */
export function UpdatePrompt() {
  const {
    needRefresh: [needRefresh, setNeedRefresh],
    offlineReady: [offlineReady, setOfflineReady],
    updateServiceWorker,
  } = useRegisterSW({
    onRegisteredSW(_url, registration) {
      // Phones keep apps open for a whole day; look for a new version every half hour.
      if (registration) setInterval(() => void registration.update(), 30 * 60 * 1000);
    },
  });

  if (needRefresh) {
    return (
      <div
        role="alert"
        className="surface mx-auto mt-3 w-[calc(100%-1.5rem)] max-w-3xl rounded-xl border-2 border-ink bg-card p-4 shadow"
      >
        <p className="font-bold">A new version of Ringcall is ready.</p>
        <p className="text-base">Update between ends; your entries stay on this phone.</p>
        <div className="mt-3 flex gap-3">
          <button
            type="button"
            className="min-h-14 flex-1 rounded-lg bg-moss px-4 font-bold text-white"
            onClick={() => void updateServiceWorker(true)}
          >
            Update now
          </button>
          <button
            type="button"
            className="min-h-14 flex-1 rounded-lg border-2 border-ink px-4 font-bold"
            onClick={() => setNeedRefresh(false)}
          >
            Later
          </button>
        </div>
      </div>
    );
  }
  // Shown in the page flow under the header, never over the buttons a person is about to tap.
  if (offlineReady) {
    return (
      <div
        role="status"
        className="surface mx-auto mt-3 flex w-[calc(100%-1.5rem)] max-w-3xl items-center gap-3 rounded-xl border-2 border-moss bg-card p-4"
      >
        <p className="flex-1">
          <span aria-hidden="true">✓ </span>Ringcall now works on this phone without signal.
        </p>
        <button
          type="button"
          className="min-h-12 rounded-lg border-2 border-ink px-4 font-bold"
          onClick={() => setOfflineReady(false)}
        >
          OK
        </button>
      </div>
    );
  }
  return null;
}
