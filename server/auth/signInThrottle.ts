import { ipKeyGenerator } from 'express-rate-limit';
import { FailureThrottle } from './failureThrottle';

const MINUTE = 60_000;

/**
 * Wrong passwords slow down the next try; nobody is locked out. Two throttles, checked before
 * the password is:
 * - per account and address (or per known device, see deviceCookie): five wrong passwords are
 *   free, then each one doubles the wait (1 s … 15 min). A person who mistypes waits seconds;
 *   a script guessing one account gets a few tries an hour. Forgotten after an hour of quiet, or
 *   at the right password.
 * - per address, across accounts: a whole field shares one Wi-Fi address, so 200 wrong
 *   passwords in a row are free; past that the address waits (at most 30 s) between tries, which
 *   stops a script trying many accounts while the field can still sign in.
 * A sign-in from a known device of the account skips the address throttle and counts its
 * failures under the device, so a stranger on the same network cannot hold up the owner's phone.
 */
export class SignInThrottle {
  private readonly pair: FailureThrottle;
  private readonly address: FailureThrottle;

  constructor() {
    this.pair = new FailureThrottle({ free: 5, maxDelayMs: 15 * MINUTE, forgetAfterMs: 60 * MINUTE });
    this.address = new FailureThrottle({ free: 200, maxDelayMs: 30_000, forgetAfterMs: 15 * MINUTE });
  }

  /** What one attempt is counted under. */
  keys(email: string, ip: string | undefined, device: string | undefined) {
    const address = `ip:${ipKeyGenerator(ip ?? '')}`;
    return device
      ? { pair: `device:${device}:${email}`, address: undefined }
      : { pair: `${address}:${email}`, address };
  }

  /** How long the attempt must wait, and which throttle says so; undefined when it may go ahead. */
  wait(keys: ReturnType<SignInThrottle['keys']>): { ms: number; reason: 'account' | 'network' } | undefined {
    const pair = this.pair.waitMs(keys.pair);
    if (pair > 0) return { ms: pair, reason: 'account' };
    const address = keys.address ? this.address.waitMs(keys.address) : 0;
    return address > 0 ? { ms: address, reason: 'network' } : undefined;
  }

  failed(keys: ReturnType<SignInThrottle['keys']>): void {
    this.pair.fail(keys.pair);
    if (keys.address) this.address.fail(keys.address);
  }

  succeeded(keys: ReturnType<SignInThrottle['keys']>): void {
    this.pair.clear(keys.pair);
  }
}
