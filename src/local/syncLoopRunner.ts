import { ApiError, messageOf } from '../api/request';
import { localDb, type LocalDb } from './db';
import { syncOnce, type SyncTransport } from './syncEngine';
import { httpTransport } from './httpTransport';
import { onSessionChange, sessionUserId } from '../api/session';
import { ownerSettled } from './phoneOwner';
import type { SyncStatus } from './syncLoop';

const MIN_BACKOFF = 3_000;
const MAX_BACKOFF = 5 * 60_000;
const IDLE_PULL = 20_000;
/** A burst of taps goes as one push once the person pauses, and never waits longer than this. */
const TYPING_PAUSE = 800;
const MAX_TYPING_WAIT = 4_000;

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
  /** Milliseconds to wait before the next round, asked for while a round was running. */
  private again: number | undefined;
  /** Signal came back (or the person asked) while a round was running: a failed round retries at once. */
  private kicked = false;
  private userId: number | undefined;
  /** When the oldest change typed since the last round was made (for MAX_TYPING_WAIT). */
  private typingSince: number | undefined;

  constructor(
    private readonly db: LocalDb,
    private readonly transport: SyncTransport,
    /** Resolves when the phone is ready to hold this person's data (see phoneOwner). */
    private readonly ready: () => Promise<void> = () => Promise.resolve(),
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

  /**
   * The page holds a sign-in again: a loop a 401 stopped sends what waits, if the sign-in is the
   * loop's own person's. The same person signing in again does not change who the loop is for, so
   * `setUser` is not called for it; another person's sign-in never sends this person's changes.
   */
  signedIn = (userId: number): void => {
    if (this.status.phase === 'signed-out' && userId === this.userId) this.kick();
  };

  /** Ask for a sync now (on online, focus, or when the person asks). */
  kick = (): void => {
    if (this.running) this.kicked = true;
    this.request(0);
  };

  /**
   * Ask for a sync after a change on the pad: once typing pauses, so the database is not busy
   * with a sync's writes while the next tap is stored.
   */
  afterChange = (): void => {
    this.typingSince ??= Date.now();
    this.request(Math.min(TYPING_PAUSE, Math.max(0, this.typingSince + MAX_TYPING_WAIT - Date.now())));
  };

  private request(ms: number): void {
    if (this.userId === undefined) return;
    if (this.running) {
      this.again = Math.min(this.again ?? ms, ms);
      return;
    }
    this.schedule(ms);
  }

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
    this.typingSince = undefined;
    this.running = (async () => {
      try {
        await this.ready();
        await syncOnce(this.db, userId, this.transport);
        this.backoff = MIN_BACKOFF;
        this.set({ phase: 'idle', lastSyncAt: new Date().toISOString() });
        this.schedule(this.again ?? IDLE_PULL);
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
          lastError: messageOf(error),
          retryInMs: this.backoff,
        });
        // A round that failed because it began just before signal returned must not make the
        // 'online' that came meanwhile wait for the backoff (up to minutes after a long time offline).
        this.schedule(this.kicked ? 0 : this.backoff);
        this.backoff = Math.min(this.backoff * 2, MAX_BACKOFF);
      } finally {
        this.again = undefined;
        this.kicked = false;
        this.running = undefined;
      }
    })();
    await this.running;
  }
}

/** The app's one sync loop, wired to the browser's online and focus events (src/local/syncLoop.ts starts it). */
export function startSyncLoop(): SyncLoop {
  const loop = new SyncLoop(localDb(), httpTransport, ownerSettled);
  onSessionChange(() => {
    const userId = sessionUserId();
    if (userId !== undefined) loop.signedIn(userId);
  });
  window.addEventListener('online', loop.kick);
  window.addEventListener('focus', loop.kick);
  document.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'visible') loop.kick();
  });
  return loop;
}
