import { useEffect, useSyncExternalStore } from 'react';
import { apiRequest, isSignedOutError } from '../api/request';
import type { Me } from '../contract/auth';
import { claimPhone } from './phoneOwner';
import { afterFirstScreen } from './firstScreen';

/**
 * Who is signed in, and their roles. Kept apart from the query cache so the field screens (pad,
 * header) start without the query library: the pad's first load stays small. Saved in
 * localStorage so the phone still knows its person offline, and across app updates.
 */
export type MeState = {
  /** undefined: not known yet; null: signed out. */
  data: Me | null | undefined;
  isFetching: boolean;
  /** The last check failed (no signal, server error); `data` keeps the last answer. */
  error: Error | null;
  isPending: boolean;
};

const STORAGE_KEY = 'ringcall.me';
/** An answer younger than this is not asked again when the app comes back into focus. */
const FRESH_MS = 60_000;

export async function fetchMe(): Promise<Me | null> {
  try {
    return await apiRequest<Me>('/api/me');
  } catch (error) {
    // A 401 means "signed out", not an error.
    if (isSignedOutError(error)) return null;
    throw error;
  }
}

type Saved = { me: Me | null; at: number };

function readSaved(): Saved | undefined {
  try {
    const raw = localStorage.getItem(STORAGE_KEY);
    return raw ? (JSON.parse(raw) as Saved) : undefined;
  } catch {
    return undefined;
  }
}

const saved = typeof localStorage === 'undefined' ? undefined : readSaved();
let checkedAt = saved?.at ?? 0;
let state: MeState = {
  data: saved?.me,
  isFetching: false,
  error: null,
  isPending: saved === undefined,
};
const listeners = new Set<() => void>();

/** Who this page knows is signed in, outside React (what `useMe` starts from). */
export const knownMe = (): Me | null | undefined => state.data;

function update(next: Partial<MeState>) {
  state = { ...state, ...next };
  state.isPending = state.data === undefined && state.error === null;
  listeners.forEach((l) => l());
}

/**
 * Records the answer, here and for the app's other tabs. A person signed in makes the phone
 * theirs first, so no screen shows them the previous person's data even for a moment.
 */
export function setMe(me: Me | null): void {
  if (me) claimPhone(me.user.id);
  checkedAt = Date.now();
  try {
    localStorage.setItem(STORAGE_KEY, JSON.stringify({ me, at: checkedAt } satisfies Saved));
  } catch {
    // Storage full or blocked: the answer still holds for this page.
  }
  update({ data: me, error: null });
}

let inFlight: Promise<void> | undefined;

/** Asks the server who is signed in; one request at a time however many screens ask. */
export function checkMe(): Promise<void> {
  inFlight ??= (async () => {
    update({ isFetching: true });
    try {
      setMe(await fetchMe());
    } catch (error) {
      update({ error: error instanceof Error ? error : new Error(String(error)) });
    } finally {
      inFlight = undefined;
      update({ isFetching: false });
    }
  })();
  return inFlight;
}

const checkIfOld = () => {
  if (Date.now() - checkedAt > FRESH_MS) void checkMe();
};

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

if (typeof window !== 'undefined') {
  // Signing out in one tab signs out the others.
  window.addEventListener('storage', (event) => {
    if (event.key !== STORAGE_KEY) return;
    const next = readSaved();
    checkedAt = next?.at ?? 0;
    update({ data: next?.me ?? null, error: null });
  });
  window.addEventListener('online', () => void checkMe());
  window.addEventListener('focus', checkIfOld);
}

/**
 * The signed-in person. Every screen that shows it asks the server again when it mounts: a saved
 * answer may predate a sign-out elsewhere. Opened on the pad, the question waits until the pad has
 * drawn (from the saved answer): on a slow phone it came before that drawing's first frame.
 */
export function useMe(): MeState {
  useEffect(() => afterFirstScreen(() => void checkMe()), []);
  return useSyncExternalStore(
    subscribe,
    () => state,
    () => state,
  );
}
