import { useSyncExternalStore } from 'react';

/**
 * The person whose data this phone holds: the last one to sign in, until they sign out. A phone
 * is often shared on the field, so everything stored is theirs alone: when someone else signs in
 * (even without a sign-out before, say after a sign-in ran out), the previous person's data goes
 * first, and a sign-out takes it all. Changes not yet on the server stay, hidden (see forgetOthers).
 */
const OWNER_KEY = 'ringcall.owner';
/** Keys in localStorage that hold one person's data (the query cache, the pad's last end). */
const PERSONAL_KEYS = ['ringcall.query-cache', 'ringcall.pad-end.'];

const listeners = new Set<() => void>();
let forgetting: Promise<void> = Promise.resolve();

const hasStorage = () => typeof localStorage !== 'undefined';

function readOwner(): number | undefined {
  const raw = hasStorage() ? localStorage.getItem(OWNER_KEY) : null;
  return raw === null || !/^\d+$/.test(raw) ? undefined : Number(raw);
}

let owner = readOwner();

export const phoneOwner = (): number | undefined => owner;

/** Called (synchronously) whenever the owner changes, here or in another tab: drop what is in memory. */
export function onOwnerChange(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

function removePersonalKeys(): void {
  for (let i = localStorage.length - 1; i >= 0; i -= 1) {
    const key = localStorage.key(i);
    if (key && PERSONAL_KEYS.some((p) => key.startsWith(p))) localStorage.removeItem(key);
  }
}

function changeOwner(next: number | undefined): Promise<void> {
  owner = next;
  if (hasStorage()) {
    removePersonalKeys();
    if (next === undefined) localStorage.removeItem(OWNER_KEY);
    else localStorage.setItem(OWNER_KEY, String(next));
  }
  listeners.forEach((l) => l());
  // One clearing after another, each run even if the one before failed.
  // The database and the clearing (which needs it) are imported here, not at the top: the public
  // results pages read the owner (their query cache is the owner's) without loading Dexie
  // (tests/client/publicFirstLoad.test.ts).
  forgetting = forgetting
    .catch(() => undefined)
    .then(async () => {
      const [{ localDb }, { forgetOthers }] = await Promise.all([import('./db'), import('./forgetOthers')]);
      await forgetOthers(localDb(), next);
    });
  return forgetting;
}

/** Someone signed in: if the phone holds another person's data, it goes before anything is shown. */
export function claimPhone(userId: number): void {
  if (owner !== userId) void changeOwner(userId).catch(() => undefined);
}

/** Sign-out: the person's data leaves the phone (their changes not yet on the server stay, hidden). */
export const releasePhone = (): Promise<void> => changeOwner(undefined);

/** Resolves once the last change of owner has cleared the phone: sync waits for it. */
export const ownerSettled = (): Promise<void> => forgetting.catch(() => undefined);

export const usePhoneOwner = (): number | undefined =>
  useSyncExternalStore(onOwnerChange, phoneOwner, phoneOwner);

if (typeof window !== 'undefined') {
  // Another tab changed the person: this tab drops what it holds in memory too.
  window.addEventListener('storage', (event) => {
    if (event.key !== OWNER_KEY) return;
    owner = readOwner();
    listeners.forEach((l) => l());
  });
}
