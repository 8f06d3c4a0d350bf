import request from 'supertest';
import { SignJWT } from 'jose';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { TEST_SECRET, makeEvent, makePerson } from './support/people';
import { hashPassword } from '../../server/auth/passwords';
import { createEmailToken } from '../../server/services/emailTokens';
import { waitForMail } from './support/mail';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

const refreshCookie = (res: request.Response) =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('rc_refresh='))!;

describe('sign-up', () => {
  it('creates the account, starts a session with an httpOnly refresh cookie, and mails a confirmation link', async () => {
    const res = await request(server.app).post('/api/auth/sign-up').send({
      email: ' Ines.Ashdown@Example.org ',
      password: 'arrows in the gold',
      displayName: 'Ines Ashdown',
    });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({
      email: 'ines.ashdown@example.org',
      displayName: 'Ines Ashdown',
      emailVerified: false,
    });
    expect(res.body.accessToken).toMatch(/^ey/);
    const cookie = refreshCookie(res);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Strict/i);
    expect(cookie).toMatch(/Path=\/api\/auth/);
    const mail = await waitForMail(server.db, 'ines.ashdown@example.org');
    expect(mail.subject).toContain('Confirm');
    expect(mail.text_body).toMatch(/\/verify-email\?token=/);
  });

  it.each([
    [{ email: 'a@example.org', password: 'short', displayName: 'A' }, /at least 8 characters/],
    [{ email: 'a@example.org', password: 'password123', displayName: 'A' }, /most common/],
    [{ email: 'not-an-address', password: 'long enough pass', displayName: 'A' }, /e-mail address/],
    [{ email: 'a@example.org', password: 'long enough pass' }, /name/],
    [{ email: 42, password: 'long enough pass', displayName: 'A' }, /e-mail/],
  ])('refuses bad input %# with a readable 400', async (body, message) => {
    const res = await request(server.app).post('/api/auth/sign-up').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(message);
  });

  it('refuses a second account for a confirmed address with 409', async () => {
    const body = { email: 'twice@example.org', password: 'first of two', displayName: 'Twice' };
    expect((await request(server.app).post('/api/auth/sign-up').send(body)).status).toBe(201);
    await server
      .db('users')
      .where({ email: body.email })
      .update({ email_verified_at: new Date().toISOString() });
    const again = await request(server.app).post('/api/auth/sign-up').send(body);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already exists/);
  });

  it('hashes with bcrypt cost 12 in production', async () => {
    expect(await hashPassword('some long passphrase')).toMatch(/^\$2[aby]\$12\$/);
  });
});

describe('sign-in, refresh, sign-out', () => {
  const email = 'lars.fenwick@example.org';
  const password = 'nock on the string';
  beforeAll(async () => {
    await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email, password, displayName: 'Lars Fenwick' });
  });

  it('signs in with the right password and answers /api/me', async () => {
    const res = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email: 'LARS.FENWICK@example.org', password });
    expect(res.status).toBe(200);
    const me = await request(server.app)
      .get('/api/me')
      .set('Authorization', `Bearer ${res.body.accessToken}`);
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(email);
    expect(me.body.roles).toEqual([]);
  });

  it('gives the same message for a wrong password and an unknown account', async () => {
    const wrong = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'not the password' });
    const unknown = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email: 'nobody@example.org', password: 'whatever it is' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
  });

  it('rotates the refresh token, and treats reuse of an old one as theft', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    try {
      const signIn = await request(server.app).post('/api/auth/sign-in').send({ email, password });
      const first = refreshCookie(signIn).split(';')[0]!;
      const refreshed = await request(server.app).post('/api/auth/refresh').set('Cookie', first);
      expect(refreshed.status).toBe(200);
      expect(refreshed.body.accessToken).toMatch(/^ey/);
      const second = refreshCookie(refreshed).split(';')[0]!;
      expect(second).not.toBe(first);

      vi.setSystemTime(Date.now() + 60_000);
      const reused = await request(server.app).post('/api/auth/refresh').set('Cookie', first);
      expect(reused.status).toBe(401);
      // The whole family is revoked: the newest token no longer works either.
      const after = await request(server.app).post('/api/auth/refresh').set('Cookie', second);
      expect(after.status).toBe(401);
      expect(after.body.error.message).toMatch(/sign in again/);
    } finally {
      vi.useRealTimers();
    }
  });

  it('signs out: the refresh cookie stops working', async () => {
    const signIn = await request(server.app).post('/api/auth/sign-in').send({ email, password });
    const cookie = refreshCookie(signIn).split(';')[0]!;
    expect((await request(server.app).post('/api/auth/sign-out').set('Cookie', cookie)).status).toBe(204);
    expect((await request(server.app).post('/api/auth/refresh').set('Cookie', cookie)).status).toBe(401);
  });

  it('refuses a refresh without a cookie', async () => {
    const res = await request(server.app).post('/api/auth/refresh');
    expect(res.status).toBe(401);
    expect(res.body.error.message).toMatch(/sign in/i);
  });
});

describe('access tokens', () => {
  it('refuses missing, forged, unsigned and expired tokens', async () => {
    const person = await makePerson(server.db);
    const now = Math.floor(Date.now() / 1000);
    const forged = await new SignJWT({})
      .setProtectedHeader({ alg: 'HS256' })
      .setSubject(String(person.id))
      .setIssuer('ringcall')
      .setAudience('ringcall-api')
      .setExpirationTime(now + 600)
      .sign(new TextEncoder().encode('another-secret-another-secret-another'));
    const expired = await new SignJWT({})
      .setProtectedHeader({ alg: 'HS256' })
      .setSubject(String(person.id))
      .setIssuer('ringcall')
      .setAudience('ringcall-api')
      .setIssuedAt(now - 3600)
      .setExpirationTime(now - 60)
      .sign(TEST_SECRET);
    const header = Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url');
    const payload = Buffer.from(
      JSON.stringify({ sub: String(person.id), iss: 'ringcall', aud: 'ringcall-api', exp: now + 600 }),
    ).toString('base64url');
    const unsigned = `${header}.${payload}.`;

    expect((await request(server.app).get('/api/me')).status).toBe(401);
    for (const token of [forged, expired, unsigned, 'not-a-token']) {
      const res = await request(server.app).get('/api/me').set('Authorization', `Bearer ${token}`);
      expect(res.status).toBe(401);
      expect(res.body.error.message).toMatch(/sign in/i);
    }
    expect((await request(server.app).get('/api/me').set(person.auth)).status).toBe(200);
  });
});

describe('proving an address', () => {
  it('links entry-list entries to the person once the address is confirmed', async () => {
    const organizer = await makePerson(server.db, 'Org');
    const eventId = await makeEvent(server.db, organizer);
    const [division] = await server
      .db('divisions')
      .insert({ event_id: eventId, bow_style: 'recurve', class_name: 'Women', name: 'Recurve Women' })
      .returning('id');
    await server.db('entries').insert({
      event_id: eventId,
      division_id: (division as { id: number }).id,
      name: 'Marta Garrow',
      club: '',
      email: 'marta.garrow@example.org',
      created_at: new Date().toISOString(),
    });
    const signUp = await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email: 'marta.garrow@example.org', password: 'a clean release', displayName: 'Marta Garrow' });
    const token = /verify-email\?token=([\w-]+)/.exec(
      (await waitForMail(server.db, 'marta.garrow@example.org')).text_body,
    )![1]!;

    const before = await request(server.app)
      .get('/api/me')
      .set('Authorization', `Bearer ${signUp.body.accessToken}`);
    expect(before.body.roles).toEqual([]);
    const verified = await request(server.app).post('/api/auth/verify-email').send({ token });
    expect(verified.status).toBe(200);
    expect(verified.body.user.emailVerified).toBe(true);
    const after = await request(server.app)
      .get('/api/me')
      .set('Authorization', `Bearer ${signUp.body.accessToken}`);
    expect(after.body.roles).toEqual([{ eventId, eventName: 'Test Shoot', role: 'archer' }]);

    const again = await request(server.app).post('/api/auth/verify-email').send({ token });
    expect(again.status).toBe(410);
  });

  it('grants an invited role only to the invited address', async () => {
    const organizer = await makePerson(server.db, 'Org');
    const eventId = await makeEvent(server.db, organizer, 'Invite Shoot');
    const judge = await makePerson(server.db, 'Judge');
    const stranger = await makePerson(server.db, 'Stranger');
    const token = await createEmailToken(server.db, {
      purpose: 'invite',
      email: judge.email,
      eventId,
      role: 'judge',
      createdBy: organizer.id,
    });

    const wrong = await request(server.app)
      .post('/api/invitations/accept')
      .set(stranger.auth)
      .send({ token });
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.message).toContain(judge.email);

    const ok = await request(server.app).post('/api/invitations/accept').set(judge.auth).send({ token });
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ eventId, eventName: 'Invite Shoot', role: 'judge' });
    // Taken up already: the same person hears the same again, anyone else that it is used.
    const again = await request(server.app).post('/api/invitations/accept').set(judge.auth).send({ token });
    expect(again.status).toBe(200);
    expect(again.body).toEqual(ok.body);
    const other = await request(server.app)
      .post('/api/invitations/accept')
      .set(stranger.auth)
      .send({ token });
    expect(other.status).toBe(410);
  });
});
