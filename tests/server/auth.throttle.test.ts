import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { trustProxySetting } from '../../server/config';

/*
 * Wrong passwords slow down the next try from the same place; nobody is locked out: the owner
 * signs in while a stranger hammers the account, a known phone is never held up by the field's
 * shared address, and a whole field signs up from one address.
 */

let server: TestServer;
/** Behind a trusted proxy, so each test can come from an address of its choice. */
let proxied: TestServer;
beforeAll(async () => {
  server = await startTestServer();
  proxied = await startTestServer({ trustProxy: 'loopback' });
});
afterAll(async () => {
  await server.close();
  await proxied.close();
});
afterEach(() => {
  vi.useRealTimers();
});

const PASSWORD = 'the real one here';
let n = 0;
async function account(app = proxied.app): Promise<string> {
  n += 1;
  const email = `owner${n}@example.org`;
  const res = await request(app)
    .post('/api/auth/sign-up')
    .send({ email, password: PASSWORD, displayName: 'Owner' });
  expect(res.status).toBe(201);
  return email;
}
const signIn = (email: string, password: string, from: string, app = proxied.app) =>
  request(app).post('/api/auth/sign-in').set('X-Forwarded-For', from).send({ email, password });

describe('wrong passwords', () => {
  it('let the owner in with the right password while a stranger hammers the account from another address', async () => {
    const email = await account();
    for (let i = 0; i < 30; i += 1) {
      const res = await signIn(email, `guess number ${i}`, '203.0.113.66');
      expect([401, 429]).toContain(res.status);
    }
    const owner = await signIn(email, PASSWORD, '198.51.100.7');
    expect(owner.status).toBe(200);
  });

  it('slow down the next try from the same address with a short wait, and the right password gets in after it', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const email = await account();
    for (let i = 0; i < 5; i += 1)
      expect((await signIn(email, `mistyped ${i}`, '192.0.2.10')).status).toBe(401);
    const held = await signIn(email, PASSWORD, '192.0.2.10');
    expect(held.status).toBe(429);
    expect(held.headers['retry-after']).toBe('1');
    expect(held.body.error.message).toMatch(/Wait 1 seconds?/);
    vi.setSystemTime(Date.now() + 1_000);
    expect((await signIn(email, PASSWORD, '192.0.2.10')).status).toBe(200);
  });

  it('grow the wait with each further failure, up to minutes, never a lock-out', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const email = await account();
    let waited = 0;
    for (let i = 0; i < 14; i += 1) {
      const res = await signIn(email, `script guess ${i}`, '192.0.2.20');
      if (res.status === 429) {
        waited = Number(res.headers['retry-after']);
        vi.setSystemTime(Date.now() + waited * 1000);
        i -= 1;
      } else expect(res.status).toBe(401);
    }
    expect(waited).toBeGreaterThanOrEqual(256);
    vi.setSystemTime(Date.now() + 15 * 60_000);
    expect((await signIn(email, PASSWORD, '192.0.2.20')).status).toBe(200);
  });

  it('never hold up a phone the owner signed in on before, though a stranger fails on the same Wi-Fi address', async () => {
    const email = await account();
    const first = await signIn(email, PASSWORD, '192.0.2.30');
    const device = ([] as string[])
      .concat(first.headers['set-cookie'] ?? [])
      .find((c) => c.startsWith('rc_device='))!
      .split(';')[0]!;
    expect(device).toBeTruthy();
    for (let i = 0; i < 12; i += 1) await signIn(email, `stranger ${i}`, '192.0.2.30');
    expect((await signIn(email, PASSWORD, '192.0.2.30')).status).toBe(429);
    const phone = await signIn(email, PASSWORD, '192.0.2.30').set('Cookie', device);
    expect(phone.status).toBe(200);
    // A device cookie for another account, or a forged one, is no way round.
    const forged = await signIn(email, PASSWORD, '192.0.2.30').set(
      'Cookie',
      `rc_device=abc.${'x'.repeat(43)}`,
    );
    expect(forged.status).toBe(429);
  });

  it('from one address across many accounts: a field mistyping passes, a guessing script is slowed', async () => {
    for (let i = 0; i < 150; i += 1) {
      const res = await signIn(`field${i}@example.org`, 'a mistyped password', '192.0.2.40');
      expect(res.status, `attempt ${i}`).toBe(401);
    }
    let slowed: request.Response | undefined;
    for (let i = 150; i < 260 && !slowed; i += 1) {
      const res = await signIn(`field${i}@example.org`, 'a mistyped password', '192.0.2.40');
      if (res.status === 429) slowed = res;
    }
    expect(slowed?.body.error.message).toMatch(/from this network/);
    // Another address is not held up.
    expect((await signIn('field1@example.org', 'a mistyped password', '192.0.2.41')).status).toBe(401);
  });
});

describe('addresses behind a proxy', () => {
  it('ignore X-Forwarded-For unless TRUST_PROXY says so: a changing header is still one address', async () => {
    const email = await account(server.app);
    for (let i = 0; i < 5; i += 1)
      expect((await signIn(email, `forged ${i}`, `198.51.100.${i + 1}`, server.app)).status).toBe(401);
    expect((await signIn(email, PASSWORD, '198.51.100.99', server.app)).status).toBe(429);
  });

  it('reads TRUST_PROXY: off by default, a hop count, or a list of addresses', () => {
    expect(trustProxySetting(undefined)).toBe(false);
    expect(trustProxySetting('off')).toBe(false);
    expect(trustProxySetting('1')).toBe(1);
    expect(trustProxySetting('loopback, 10.0.0.2')).toBe('loopback, 10.0.0.2');
  });

  it('mark the refresh cookie Secure when the request came over HTTPS, and not over plain http', async () => {
    const email = await account();
    const over = async (proto: string) => {
      const res = await request(proxied.app)
        .post('/api/auth/sign-in')
        .set('X-Forwarded-Proto', proto)
        .send({ email, password: PASSWORD });
      return ([] as string[])
        .concat(res.headers['set-cookie'] ?? [])
        .find((c) => c.startsWith('rc_refresh='))!;
    };
    expect(await over('https')).toMatch(/;\s*Secure/i);
    expect(await over('http')).not.toMatch(/;\s*Secure/i);
  });
});

describe('sign-ups from one address', () => {
  it('let a whole field (200 people) sign up from one Wi-Fi address', async () => {
    // In waves of 40 at once, as at the field (and to keep the test short).
    for (let wave = 0; wave < 5; wave += 1) {
      const answers = await Promise.all(
        Array.from({ length: 40 }, (_, i) =>
          request(server.app)
            .post('/api/auth/sign-up')
            .send({
              email: `archer${wave}.${i}@field.example`,
              password: 'loose drawing arm',
              displayName: `Archer ${wave}.${i}`,
            }),
        ),
      );
      expect(answers.map((a) => a.status)).toEqual(answers.map(() => 201));
    }
  }, 120_000);
});
