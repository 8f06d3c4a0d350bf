import { createHash, randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { reserveMail } from '../../server/services/limits/mailLimits';
import { PHOTO_LIMITS } from '../../server/services/limits/photoLimits';
import { photoDir } from '../../server/services/judging/photos';
import { nowIso } from '../../server/time';
import { giveRole, makePerson, type TestPerson } from './support/people';
import { setUpEvent } from './support/eventSetup';
import { startTestServer, type TestServer } from './support/testServer';

/*
 * Mail and disk a person can cause are bounded per person, per event and per address, each
 * refusal a 4xx with a sentence that says what happened and when to try again.
 */

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

const invite = (eventId: number, who: TestPerson, email: string) =>
  request(server.app).post(`/api/events/${eventId}/staff`).set(who.auth).send({ email, role: 'judge' });

describe('mail limits', () => {
  it('one person sends at most 20 invitations an hour; the 21st is refused, not sent and not pending', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const stamp = Date.now();
    for (let i = 0; i < 20; i += 1)
      expect((await invite(setup.eventId, setup.organizer, `p${i}.${stamp}@example.org`)).status).toBe(201);
    const over = `p20.${stamp}@example.org`;
    const res = await invite(setup.eventId, setup.organizer, over);
    expect(res.status).toBe(429);
    expect(res.body.error).toEqual({
      code: 'too_many',
      message: expect.stringMatching(
        /^You have sent 20 invitations in the last hour\. Send more in (\d+ minutes|a minute)\.$/,
      ),
    });
    expect(await server.db('email_tokens').where({ email: over })).toEqual([]);
    await new Promise((r) => setTimeout(r, 300));
    expect(await server.db('caught_mail').where({ mail_to: over })).toEqual([]);
  });

  it('one event sends at most 40 invitations an hour, whoever of its organizers sends them', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const organizers = [setup.organizer, await makePerson(server.db), await makePerson(server.db)];
    for (const o of organizers.slice(1)) await giveRole(server.db, setup.eventId, o, 'organizer');
    const stamp = Date.now();
    for (let i = 0; i < 40; i += 1)
      expect((await invite(setup.eventId, organizers[i % 2]!, `e${i}.${stamp}@example.org`)).status).toBe(
        201,
      );
    const res = await invite(setup.eventId, organizers[2]!, `e40.${stamp}@example.org`);
    expect(res.status).toBe(429);
    expect(res.body.error.message).toMatch(/^This event has sent 40 invitations in the last hour\./);
  });

  it('one address is invited at most 3 times an hour by an event, and 10 times across events', async () => {
    const to = `again.${Date.now()}@example.org`;
    const setup = await setUpEvent(server.app, server.db);
    for (let i = 0; i < 3; i += 1)
      expect((await invite(setup.eventId, setup.organizer, to)).status).toBe(201);
    const res = await invite(setup.eventId, setup.organizer, to);
    expect(res.status).toBe(429);
    expect(res.body.error.message).toMatch(
      new RegExp(`^${to.replace(/\./g, '\\.')} was invited 3 times in the last hour\\. Ask them`),
    );
    for (let i = 0; i < 7; i += 1) {
      const other = await setUpEvent(server.app, server.db);
      expect((await invite(other.eventId, other.organizer, to)).status).toBe(201);
    }
    const eleventh = await setUpEvent(server.app, server.db);
    const refused = await invite(eleventh.eventId, eleventh.organizer, to);
    expect(refused.status).toBe(429);
    expect(refused.body.error.message).toMatch(/has received 10 invitations in the last hour/);
  });

  it('confirmation mail: the sign-up one and 3 more an hour, then a readable refusal', async () => {
    const signUp = await request(server.app)
      .post('/api/auth/sign-up')
      .send({
        email: `resend.${Date.now()}@example.org`,
        password: 'correct horse battery',
        displayName: 'Re Send',
      });
    expect(signUp.status).toBe(201);
    const resend = () =>
      request(server.app)
        .post('/api/me/send-verification')
        .set('Authorization', `Bearer ${signUp.body.accessToken}`);
    for (let i = 0; i < 3; i += 1) expect((await resend()).status).toBe(202);
    const res = await resend();
    expect(res.status).toBe(429);
    expect(res.body.error.message).toMatch(
      /^A confirmation mail went to you 4 times in the last hour\. Look for the newest one/,
    );
  });

  it('a final card goes to one address at most 3 times an hour when sent again', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const card = {
      kind: 'card' as const,
      sentBy: setup.organizer.id,
      eventId: setup.eventId,
      recipient: 'card@example.org',
    };
    for (let i = 0; i < 3; i += 1) await reserveMail(server.db, card);
    await expect(reserveMail(server.db, card)).rejects.toMatchObject({
      status: 429,
      message: expect.stringMatching(/^This card went to card@example\.org 3 times in the last hour\./),
    });
  });
});

/** A 1 × 1 PNG; each call gets its own trailing bytes, so each is a new picture. */
const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==',
  'base64',
);
const picture = () => Buffer.concat([PNG, randomBytes(8)]);
const upload = (eventId: number, who: TestPerson, bytes: Buffer) =>
  request(server.app)
    .post(`/api/events/${eventId}/photos`)
    .set(who.auth)
    .attach('photo', bytes, { filename: 'target.png', contentType: 'image/png' });
const fileOf = (bytes: Buffer) =>
  join(photoDir(server.dir), `${createHash('sha256').update(bytes).digest('hex')}.png`);

async function photoRows(eventId: number, by: TestPerson, count: number, sizeBytes: number, at = nowIso()) {
  const rows = Array.from({ length: count }, () => ({
    event_id: eventId,
    sha256: randomBytes(32).toString('hex'),
    mime_type: 'image/png',
    size_bytes: sizeBytes,
    stored_name: 'x.png',
    uploaded_by: by.id,
    uploaded_at: at,
  }));
  await server.db('photos').insert(rows);
}

describe('photo limits', () => {
  it('one person uploads at most 10 photos in 10 minutes; the same picture again is free', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const first = picture();
    expect((await upload(setup.eventId, setup.organizer, first)).status).toBe(201);
    for (let i = 1; i < PHOTO_LIMITS.perPerson.max; i += 1)
      expect((await upload(setup.eventId, setup.organizer, picture())).status).toBe(201);
    const over = picture();
    const res = await upload(setup.eventId, setup.organizer, over);
    expect(res.status).toBe(429);
    expect(res.body.error.message).toMatch(
      /^You have uploaded 10 photos in the last 10 minutes\. Upload the next one in/,
    );
    expect(existsSync(fileOf(over))).toBe(false);
    expect((await upload(setup.eventId, setup.organizer, first)).status).toBe(200);
  });

  it('one event receives at most 60 photos an hour, from all its judges together', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const judge = await makePerson(server.db, 'Photo Judge');
    await giveRole(server.db, setup.eventId, judge, 'judge');
    await photoRows(setup.eventId, setup.organizer, 60, 1000);
    const res = await upload(setup.eventId, judge, picture());
    expect(res.status).toBe(429);
    expect(res.body.error.message).toMatch(/^This event has received 60 photos in the last hour\./);
  });

  it('a photo that would take the event past its storage quota is refused with 413', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const twoHoursAgo = new Date(Date.now() - 2 * 3600_000).toISOString();
    await photoRows(setup.eventId, setup.organizer, 1, PHOTO_LIMITS.bytesPerEvent - 50, twoHoursAgo);
    const over = picture();
    const res = await upload(setup.eventId, setup.organizer, over);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('quota_full');
    expect(res.body.error.message).toMatch(
      /^This event's photos already use 500 MB of its 500 MB on the server/,
    );
    expect(existsSync(fileOf(over))).toBe(false);
  });
});
