import { serverFetch } from './serverFetch';
import type { AuthSession } from '../contract/auth';

/**
 * Where the phone keeps its sign-in: the short-lived access token only in memory (never in
 * storage a script could read later); the refresh token in an httpOnly cookie the server set,
 * so a reload or a closed browser signs back in with one refresh call when there is signal.
 */
let current: AuthSession | undefined;
let refreshing: Promise<AuthSession | undefined> | undefined;
/** The last refresh got no answer (no signal, a server fault): whether the person is signed in is not known. */
let unanswered = false;
const listeners = new Set<() => void>();

export function setSession(session: AuthSession | undefined): void {
  current = session;
  listeners.forEach((l) => l());
}

export function onSessionChange(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** A valid access token, refreshing when it is missing or about to expire. */
export async function accessToken(): Promise<string | undefined> {
  if (current && Date.parse(current.expiresAt) - Date.now() > 30_000) return current.accessToken;
  return (await refreshSession())?.accessToken;
}

/** One refresh at a time, however many requests ask for it. */
export function refreshSession(): Promise<AuthSession | undefined> {
  refreshing ??= (async () => {
    try {
      const response = await serverFetch('/api/auth/refresh', { method: 'POST', credentials: 'same-origin' });
      unanswered = !response.ok && response.status !== 401;
      if (response.status === 401) {
        setSession(undefined);
        return undefined;
      }
      if (!response.ok) return undefined;
      const session = (await response.json()) as AuthSession;
      setSession(session);
      return session;
    } catch {
      // Offline: keep whatever we had; the caller decides what to do without a token.
      unanswered = true;
      return undefined;
    } finally {
      refreshing = undefined;
    }
  })();
  return refreshing;
}

/** Whether the last refresh went unanswered, so a request sent without a token may still be the person's. */
export const lastRefreshUnanswered = (): boolean => unanswered;

/** Who this page holds a sign-in for now (from a sign-in or a refresh), if anyone. */
export const sessionUserId = (): number | undefined => current?.user.id;

export function forgetAccessToken(): void {
  current = undefined;
}
