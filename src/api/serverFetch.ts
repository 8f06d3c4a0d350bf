/**
 * Every request to Ringcall's server goes through here, so the app knows whether the server
 * answers lately. `navigator.onLine` alone is not enough: a field Wi-Fi without internet, or a
 * phone with one bar that times out, still counts as "online" for the browser.
 */
let reachable = true;
const listeners = new Set<() => void>();
let probeTimer: ReturnType<typeof setTimeout> | undefined;
/** While the server does not answer, ask it this often whether it is back. */
const PROBE_EVERY = 15_000;

function setReachable(next: boolean): void {
  if (next) clearTimeout(probeTimer);
  else scheduleProbe();
  if (reachable === next) return;
  reachable = next;
  listeners.forEach((listener) => listener());
}

function scheduleProbe(delayMs = PROBE_EVERY): void {
  clearTimeout(probeTimer);
  probeTimer = setTimeout(
    () => void serverFetch('/api/health', { cache: 'no-store' }).catch(() => {}),
    delayMs,
  );
}

/** `fetch`, remembering whether the server answered (any HTTP answer counts) or could not be reached. */
export async function serverFetch(input: string, init?: RequestInit): Promise<Response> {
  try {
    const response = await fetch(input, init);
    setReachable(true);
    return response;
  } catch (error) {
    setReachable(false);
    throw error;
  }
}

export const isServerReachable = (): boolean => reachable;

export function subscribeReachable(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

// When the browser says the network is back, check at once instead of waiting for the next probe.
if (typeof window !== 'undefined')
  window.addEventListener('online', () => {
    if (!reachable) scheduleProbe(0);
  });
