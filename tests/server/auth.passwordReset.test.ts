import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { waitForMail } from './support/mail';

/*
 * "Forgot password": a single-use link by mail that works for an hour, the same answer whether
 * or not the address has an account, and using it ends every other sign-in of the account.
 */

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});
afterEach(() => {
  vi.useRealTimers();
});

const cookieOf = (res: request.Response) =>
  ([] as string[])
    .concat(res.headers['set-cookie'] ?? [])
    .find((c) => c.startsWith('rc_refresh='))!
    .split(';')[0]!;

const forgot = (email: string) => request(server.app).post('/api/auth/forgot-password').send({ email });

/** The newest password mail to the address (sign-up sent a confirmation first; mail is asynchronous). */
async function passwordMail(email: string) {
  const until = Date.now() + 5_000;
  for (;;) {
    const mail = await waitForMail(server.db, email);
    if (mail.subject === 'Set a new Ringcall password') return mail;
    if (Date.now() > until) throw new Error(`No password mail to ${email}.`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

async function linkTokenFor(email: string): Promise<string> {
  return /\/reset-password\?token=([\w-]+)/.exec((await passwordMail(email)).text_body)![1]!;
}

async function account(email: string, password = 'old but gold arrows') {
  const res = await request(server.app)
    .post('/api/auth/sign-up')
    .send({ email, password, displayName: 'Rhea Bowman' });
  expect(res.status).toBe(201);
  return res;
}

describe('forgot password', () => {
  it('answers the same for an address with an account and one without, and mails only the account', async () => {
    await account('rhea@example.org');
    const known = await forgot('rhea@example.org');
    const unknown = await forgot('nobody.here@example.org');
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    const mail = await passwordMail('rhea@example.org');
    expect(mail.text_body).toMatch(/\/reset-password\?token=/);
    await new Promise((r) => setTimeout(r, 300));
    expect(
      await server.db('caught_mail').where({ mail_to: 'nobody.here@example.org' }).first(),
    ).toBeUndefined();
  });

  it('sets the new password once, and ends every other sign-in of the account (refresh and access tokens)', async () => {
    const email = 'sven@example.org';
    const signUp = await account(email);
    const elsewhere = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'old but gold arrows' });
    expect((await forgot(email)).status).toBe(202);
    const token = await linkTokenFor(email);

    const reset = await request(server.app)
      .post('/api/auth/reset-password')
      .send({ token, password: 'a brand new bowstring' });
    expect(reset.status).toBe(200);
    expect(reset.body.user).toMatchObject({ email, emailVerified: true });
    const me = await request(server.app)
      .get('/api/me')
      .set('Authorization', `Bearer ${reset.body.accessToken}`);
    expect(me.status).toBe(200);

    for (const old of [signUp, elsewhere]) {
      expect((await request(server.app).post('/api/auth/refresh').set('Cookie', cookieOf(old))).status).toBe(
        401,
      );
      const stale = await request(server.app)
        .get('/api/me')
        .set('Authorization', `Bearer ${old.body.accessToken}`);
      expect(stale.status).toBe(401);
    }
    const oldPassword = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'old but gold arrows' });
    expect(oldPassword.status).toBe(401);
    const newPassword = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'a brand new bowstring' });
    expect(newPassword.status).toBe(200);

    const again = await request(server.app)
      .post('/api/auth/reset-password')
      .send({ token, password: 'yet another one here' });
    expect(again.status).toBe(410);
    expect(again.body.error.message).toMatch(/not valid any more/);
  });

  it('refuses a link after an hour, and a refused password leaves the link usable', async () => {
    const email = 'ida@example.org';
    await account(email);
    await forgot(email);
    const token = await linkTokenFor(email);
    const weak = await request(server.app)
      .post('/api/auth/reset-password')
      .send({ token, password: 'ida@example.org' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.message).toMatch(/e-mail address/);

    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(Date.now() + 61 * 60_000);
    const late = await request(server.app)
      .post('/api/auth/reset-password')
      .send({ token, password: 'too late for this' });
    expect(late.status).toBe(410);
  });

  it('limits how often a link is mailed to one address', async () => {
    const answers = [];
    for (let i = 0; i < 4; i += 1) answers.push((await forgot('busy.box@example.org')).status);
    expect(answers).toEqual([202, 202, 202, 429]);
  });
});
