import { afterNextPaint } from './afterPaint';
import type { SyncLoop } from './syncLoopRunner';

export type SyncStatus = {
  /** 'signed-out': changes wait until the person signs in again; nothing is dropped. */
  phase: 'idle' | 'syncing' | 'offline' | 'error' | 'signed-out';
  lastSyncAt?: string;
  lastError?: string;
  /** Milliseconds until the next automatic try, after a failure. */
  retryInMs?: number;
};

type Ask = (loop: SyncLoop) => void;

const IDLE: SyncStatus = { phase: 'idle' };
const listeners = new Set<() => void>();
const notify = () => listeners.forEach((l) => l());
let loop: SyncLoop | undefined;
const asked: Ask[] = [];
let loading: Promise<void> | undefined;

/**
 * The sync loop and the sync engine load after the first paint, out of the pad's first load:
 * nothing on screen needs them, and a tap is stored without them (the outbox). What the app asks
 * of the loop before it is there waits here and reaches it once loaded, so a tap made meanwhile
 * is still sent.
 */
function load(): void {
  loading ??= new Promise<void>((resolve) => afterNextPaint(resolve))
    .then(() => import('./syncLoopRunner'))
    .then(
      ({ startSyncLoop }) => {
        const started = startSyncLoop();
        started.subscribe(notify);
        loop = started;
        for (const ask of asked.splice(0)) ask(started);
        notify();
      },
      () => {
        // Not fetched (no signal before the app was installed): tried again with signal, or at the next ask.
        loading = undefined;
        window.addEventListener('online', load, { once: true });
      },
    )
    // A loop that fetched but could not start is a fault to see, not an unhandled rejection.
    .catch((error: unknown) => console.error('The sync loop could not start:', error));
}

function ask(what: Ask): void {
  if (loop) {
    what(loop);
    return;
  }
  asked.push(what);
  load();
}

const front = {
  getStatus: (): SyncStatus => loop?.getStatus() ?? IDLE,
  subscribe: (listener: () => void): (() => void) => {
    listeners.add(listener);
    return () => listeners.delete(listener);
  },
  /** Starts syncing for this person (undefined: signed out, so nothing is sent). */
  setUser: (userId: number | undefined): void => ask((l) => l.setUser(userId)),
  /** Ask for a sync now (on online, focus, or when the person asks). */
  kick: (): void => ask((l) => l.kick()),
  /** Ask for a sync after a change on the pad, once typing pauses. */
  afterChange: (): void => ask((l) => l.afterChange()),
};

/** The app's one sync loop. */
export const syncLoop = () => front;

