import { useSyncExternalStore } from 'react';
import { isServerReachable, subscribeReachable } from '../api/serverFetch';

function subscribe(onChange: () => void): () => void {
  window.addEventListener('online', onChange);
  window.addEventListener('offline', onChange);
  const stopReachable = subscribeReachable(onChange);
  return () => {
    window.removeEventListener('online', onChange);
    window.removeEventListener('offline', onChange);
    stopReachable();
  };
}

/**
 * Whether the phone can reach the event server: the browser believes it has a network and the
 * server answered the last request. The sync loop still retries either way.
 */
export function useOnline(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => navigator.onLine && isServerReachable(),
    () => true,
  );
}
