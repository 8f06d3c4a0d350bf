/**
 * Slows down repeated failures under one key (an account and an address, an address, a person
 * joining targets) instead of locking anyone out: the first `free` failures cost nothing, then
 * each further one makes the key wait twice as long as the one before (1 s, 2 s, 4 s …, at most
 * `maxDelayMs`) before its next attempt is looked at. The count is forgotten once the key has
 * been quiet for `forgetAfterMs`, or at once when `clear` is called (a success).
 *
 * Kept in memory: the server is one process, and a restart only forgives failures.
 */
export type ThrottleRule = { free: number; maxDelayMs: number; forgetAfterMs: number };

type Record = { count: number; lastAt: number };

/** Far more keys than a tournament's people and addresses; beyond it the stalest go first. */
const MAX_KEYS = 50_000;

export class FailureThrottle {
  private readonly records = new Map<string, Record>();

  constructor(
    private readonly rule: ThrottleRule,
    private readonly now: () => number = () => Date.now(),
  ) {}

  /** Milliseconds the key must still wait before its next attempt; 0 when it may try now. */
  waitMs(key: string): number {
    const record = this.current(key);
    if (!record || record.count < this.rule.free) return 0;
    const delay = Math.min(1000 * 2 ** (record.count - this.rule.free), this.rule.maxDelayMs);
    return Math.max(0, record.lastAt + delay - this.now());
  }

  fail(key: string): void {
    const count = (this.current(key)?.count ?? 0) + 1;
    // Re-inserted so the map's order stays "least recently failed first" for pruning.
    this.records.delete(key);
    this.records.set(key, { count, lastAt: this.now() });
    if (this.records.size > MAX_KEYS) this.prune();
  }

  clear(key: string): void {
    this.records.delete(key);
  }

  private current(key: string): Record | undefined {
    const record = this.records.get(key);
    if (record && this.now() - record.lastAt > this.rule.forgetAfterMs) {
      this.records.delete(key);
      return undefined;
    }
    return record;
  }

  private prune(): void {
    for (const key of this.records.keys()) {
      if (this.records.size <= MAX_KEYS * 0.9) break;
      this.records.delete(key);
    }
  }
}

/** Whole seconds to tell a person (and the Retry-After header), never 0. */
export const waitSeconds = (ms: number): number => Math.max(1, Math.ceil(ms / 1000));
