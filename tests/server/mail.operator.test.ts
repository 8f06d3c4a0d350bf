import MailComposer from 'nodemailer/lib/mail-composer';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { readConfig } from '../../server/config';
import { setUpMail } from '../../server/mail/setUpMail';
import { nowIso } from '../../server/time';
import { giveRole, makeEvent, makePerson, TEST_SECRET, type TestPerson } from './support/people';
import { waitForMail } from './support/mail';
import {
  startTestServer,
  TEST_BCRYPT_COST,
  TEST_LINK_ADDRESS,
  TEST_MAIL_INBOX_KEY,
  type TestServer,
} from './support/testServer';
import { setUpEvent } from './support/eventSetup';

/*
 * The caught mail holds other people's confirmation and invitation links: only the operator's
 * key opens it. No event role does (organizer, judge, archer), and no anonymous caller.
 */

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

type Caller = 'organizer' | 'judge' | 'archer' | 'stranger' | 'anonymous';

async function fixture() {
  const setup = await setUpEvent(server.app, server.db);
  const judge = await makePerson(server.db, 'Inbox Judge');
  const archer = await makePerson(server.db, 'Inbox Archer');
  const stranger = await makePerson(server.db, 'Inbox Stranger');
  await giveRole(server.db, setup.eventId, judge, 'judge');
  await giveRole(server.db, setup.eventId, archer, 'archer');
  // Everyone organizes some event: that used to open every caught mail.
  for (const p of [judge, archer, stranger]) await makeEvent(server.db, p, 'Their own shoot');
  const invited = `invited.${Date.now()}@example.org`;
  expect((await setup.api('post', '/staff', { email: invited, role: 'judge' })).status).toBe(201);
  const mail = await waitForMail(server.db, invited);
  // A mail with an attachment, as the final card comes.
  const raw = await new MailComposer({
    from: 'test@ringcall.example',
    to: archer.email,
    subject: 'Your final scorecard',
    text: 'Attached.',
    attachments: [{ filename: 'card.pdf', content: Buffer.from('%PDF-1.4'), contentType: 'application/pdf' }],
  })
    .compile()
    .build();
  const [row] = (await server
    .db('caught_mail')
    .insert({
      mail_from: 'test@ringcall.example',
      mail_to: archer.email,
      subject: 'Your final scorecard',
      text_body: 'Attached.',
      raw: raw.toString('utf8'),
      received_at: nowIso(),
    })
    .returning('id')) as { id: number }[];
  const people: Record<Exclude<Caller, 'anonymous'>, TestPerson> = {
    organizer: setup.organizer,
    judge,
    archer,
    stranger,
  };
  return { people, inviteId: mail.id, inviteText: mail.text_body, attachmentMailId: row!.id };
}

const routes = (f: { inviteId: number; attachmentMailId: number }) => [
  '/api/operator/mail',
  `/api/operator/mail/${f.inviteId}`,
  `/api/operator/mail/${f.attachmentMailId}/attachments/0`,
  // The addresses the app used to serve caught mail at are gone.
  '/api/caught-mail',
  `/api/caught-mail/${f.inviteId}`,
  `/api/caught-mail/${f.attachmentMailId}/attachments/0`,
];

describe("caught mail is the operator's, not an app role's", () => {
  it('organizer, judge, archer, stranger and anonymous callers are refused on every caught-mail route', async () => {
    const f = await fixture();
    const token = /invite\?token=(\S+)/.exec(f.inviteText)![1]!;
    for (const path of routes(f)) {
      for (const caller of ['organizer', 'judge', 'archer', 'stranger', 'anonymous'] as Caller[]) {
        let req = request(server.app).get(path);
        if (caller !== 'anonymous') req = req.set(f.people[caller].auth);
        const res = await req;
        expect([401, 403, 404], `${path} as ${caller}`).toContain(res.status);
        expect(res.body.error.message, `${path} as ${caller}`).toMatch(/\w{3,}.*\./);
        expect(res.text).not.toContain(token);
      }
      // A wrong key is refused like no key.
      const wrong = await request(server.app).get(path).set('X-Operator-Key', `${TEST_MAIL_INBOX_KEY}x`);
      expect([401, 404], `${path} with a wrong key`).toContain(wrong.status);
    }
  });

  it('opens with the operator key: the list, a message with its link, an attachment', async () => {
    const f = await fixture();
    const key = { 'X-Operator-Key': TEST_MAIL_INBOX_KEY };
    const list = await request(server.app).get('/api/operator/mail').set(key);
    expect(list.status).toBe(200);
    expect(list.headers['cache-control']).toBe('no-store');
    expect(list.body.messages.map((m: { id: number }) => m.id)).toEqual(
      expect.arrayContaining([f.inviteId, f.attachmentMailId]),
    );
    const one = await request(server.app).get(`/api/operator/mail/${f.inviteId}`).set(key);
    expect(one.status).toBe(200);
    expect(one.body.text).toContain('/invite?token=');
    const withFile = await request(server.app).get(`/api/operator/mail/${f.attachmentMailId}`).set(key);
    expect(withFile.body.attachments).toEqual([
      expect.objectContaining({ index: 0, filename: 'card.pdf', contentType: 'application/pdf' }),
    ]);
    const file = await request(server.app)
      .get(`/api/operator/mail/${f.attachmentMailId}/attachments/0`)
      .set(key);
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toMatch(/application\/pdf/);
    const missing = await request(server.app).get('/api/operator/mail/999999').set(key);
    expect(missing.status).toBe(404);
  });

  it('is absent when the server does not catch mail, whatever key is sent', async () => {
    const app = createApp({
      db: server.db,
      version: 'test',
      secret: new TextEncoder().encode('x'.repeat(40)),
      mailer: { send: async () => undefined },
      dataDir: server.dir,
      signingKeys: server.signingKeys,
      linkAddress: TEST_LINK_ADDRESS,
    });
    const res = await request(app).get('/api/operator/mail').set('X-Operator-Key', TEST_MAIL_INBOX_KEY);
    expect(res.status).toBe(404);
  });
});

describe('when mail is caught', () => {
  it('the demo, development and tests catch it; production does not unless asked (MAIL_CATCHER=on)', () => {
    expect(readConfig({}).mail).toBe('catcher');
    expect(readConfig({ NODE_ENV: 'development' }).mail).toBe('catcher');
    expect(readConfig({ NODE_ENV: 'production' }).mail).toBe('off');
    expect(readConfig({ NODE_ENV: 'production', MAIL_CATCHER: 'on' }).mail).toBe('catcher');
    expect(readConfig({ MAIL_CATCHER: 'off' }).mail).toBe('off');
    expect(readConfig({ SMTP_URL: 'smtp://mail.example.org:587' }).mail).toBe('smtp');
    expect(() => readConfig({ SMTP_URL: 'smtp://mail.example.org:587', MAIL_CATCHER: 'on' })).toThrow(
      /not both/,
    );
    expect(() => readConfig({ MAIL_INBOX_SECRET: 'short' })).toThrow(/MAIL_INBOX_SECRET/);
  });

  it('in production without SMTP_URL no catcher starts, and sending says so readably', async () => {
    const config = readConfig({ NODE_ENV: 'production' });
    const mail = await setUpMail(server.db, config);
    expect(mail.catcher).toBeUndefined();
    await expect(mail.mailer.send({ to: 'a@example.org', subject: 's', text: 't' })).rejects.toMatchObject({
      status: 503,
      message: expect.stringMatching(/SMTP_URL/),
    });
  });

  it('without mail, sign-up still makes the account; asking for the link again says why it cannot come', async () => {
    const { mailer } = await setUpMail(server.db, readConfig({ NODE_ENV: 'production' }));
    const app = createApp({
      db: server.db,
      version: 'test',
      secret: TEST_SECRET,
      mailer,
      dataDir: server.dir,
      signingKeys: server.signingKeys,
      linkAddress: TEST_LINK_ADDRESS,
      bcryptCost: TEST_BCRYPT_COST,
    });
    const signUp = await request(app)
      .post('/api/auth/sign-up')
      .send({
        email: `no.mail.${Date.now()}@example.org`,
        password: 'a long enough password',
        displayName: 'Mo',
      });
    expect(signUp.status).toBe(201);
    const again = await request(app)
      .post('/api/me/send-verification')
      .set('Authorization', `Bearer ${signUp.body.accessToken}`);
    expect(again.status).toBe(503);
    expect(again.body.error.message).toMatch(/SMTP_URL/);
  });
});
