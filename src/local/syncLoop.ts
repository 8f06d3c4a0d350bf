import { ApiError } from '../api/request';
import { localDb, type LocalDb } from './db';
import { syncOnce, type SyncTransport } from './syncEngine';
import { httpTransport } from './httpTransport';

export type SyncStatus = {
  /** 'signed-out': changes wait until the person signs in again; nothing is dropped. */
  phase: 'idle' | 'syncing' | 'offline' | 'error' | 'signed-out';
  lastSyncAt?: string;
  lastError?: string;
  /** Milliseconds until the next automatic try, after a failure. */
  retryInMs?: number;
};

const MIN_BACKOFF = 3_000;
const MAX_BACKOFF = 5 * 60_000;
const IDLE_PULL = 20_000;

/**
 * Keeps the phone and the server in step: after every change, on `online`, when the app comes
 * back to the foreground, and on a timer (Safari has no Background Sync). Failures back off
 * exponentially; typing never waits for it.
 */
export class SyncLoop {
  private status: SyncStatus = { phase: 'idle' };
  private listeners = new Set<() => void>();
  private timer: ReturnType<typeof setTimeout> | undefined;
  private backoff = MIN_BACKOFF;
  private running: Promise<void> | undefined;
  private again = false;
  private userId: number | undefined;

  constructor(
    private readonly db: LocalDb,
    private readonly transport: SyncTransport,
  ) {}

  getStatus = (): SyncStatus => this.status;

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  /** Starts syncing for this person (undefined: signed out, so nothing is sent). */
  setUser(userId: number | undefined): void {
    if (this.userId === userId && this.status.phase !== 'signed-out') return;
    this.userId = userId;
    this.backoff = MIN_BACKOFF;
    if (userId === undefined) this.set({ phase: 'signed-out' });
    else this.kick();
  }

  /** Ask for a sync soon (after a change, on online or focus). */
  kick = (): void => {
    if (this.userId === undefined) return;
    if (this.running) {
      this.again = true;
      return;
    }
    this.schedule(0);
  };

  private schedule(ms: number) {
    clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.run(), ms);
  }

  private set(next: SyncStatus) {
    this.status = next;
    this.listeners.forEach((l) => l());
  }

  private async run(): Promise<void> {
    const userId = this.userId;
    if (userId === undefined || this.running) return;
    this.set({ ...this.status, phase: 'syncing' });
    this.running = (async () => {
      try {
        await syncOnce(this.db, userId, this.transport);
        this.backoff = MIN_BACKOFF;
        this.set({ phase: 'idle', lastSyncAt: new Date().toISOString() });
        this.schedule(this.again ? 0 : IDLE_PULL);
      } catch (error) {
        if (error instanceof ApiError && error.status === 401) {
          // Never touch the outbox: the changes wait for the next sign-in.
          this.set({
            ...this.status,
            phase: 'signed-out',
            lastError: 'Sign in again to send your waiting changes.',
          });
          return;
        }
        const offline = error instanceof ApiError && error.status === 0;
        this.set({
          ...this.status,
          phase: offline ? 'offline' : 'error',
          lastError: error instanceof Error ? error.message : String(error),
          retryInMs: this.backoff,
        });
        this.schedule(this.backoff);
        this.backoff = Math.min(this.backoff * 2, MAX_BACKOFF);
      } finally {
        this.again = false;
        this.running = undefined;
      }
    })();
    await this.running;
  }
}

let loop: SyncLoop | undefined;

/** The app's one sync loop, wired to the browser's online and focus events. */
export function syncLoop(): SyncLoop {
  if (!loop) {
    const created = new SyncLoop(localDb(), httpTransport);
    window.addEventListener('online', created.kick);
    window.addEventListener('focus', created.kick);
    document.addEventListener('visibilitychange', () => {
      if (document.visibilityState === 'visible') created.kick();
    });
    loop = created;
  }
  return loop;
}
