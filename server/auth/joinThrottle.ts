import { ipKeyGenerator } from 'express-rate-limit';
import { FailureThrottle } from './failureThrottle';

const MINUTE = 60_000;

/**
 * Wrong join codes slow down the next try. A person who mistypes a code from the target sheet a
 * few times never notices (ten are free); a script guessing codes waits longer after each miss
 * (at most 15 minutes). Per address, 300 misses are free so a field on one Wi-Fi can mistype
 * freely at the start of the day; past that the address waits up to a minute between tries.
 */
export class JoinThrottle {
  private readonly person: FailureThrottle;
  private readonly address: FailureThrottle;

  constructor() {
    this.person = new FailureThrottle({ free: 10, maxDelayMs: 15 * MINUTE, forgetAfterMs: 60 * MINUTE });
    this.address = new FailureThrottle({ free: 300, maxDelayMs: MINUTE, forgetAfterMs: 15 * MINUTE });
  }

  keys(userId: number, ip: string | undefined) {
    return { person: `user:${userId}`, address: `ip:${ipKeyGenerator(ip ?? '')}` };
  }

  waitMs(keys: ReturnType<JoinThrottle['keys']>): number {
    return Math.max(this.person.waitMs(keys.person), this.address.waitMs(keys.address));
  }

  failed(keys: ReturnType<JoinThrottle['keys']>): void {
    this.person.fail(keys.person);
    this.address.fail(keys.address);
  }

  succeeded(keys: ReturnType<JoinThrottle['keys']>): void {
    this.person.clear(keys.person);
  }
}
