import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { giveRole, makePerson } from './support/people';
import { setUpEvent } from './support/eventSetup';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

/** Mail is delivered over SMTP to the catcher, which stores it a moment later. */
async function caughtMailTo(address: string, timeoutMs = 5000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const row = await server.db('caught_mail').where({ mail_to: address }).orderBy('id', 'desc').first();
    if (row) return row as { subject: string; text_body: string };
    if (Date.now() > until) throw new Error(`No mail reached ${address}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe('staff', () => {
  it('invites a judge by e-mail: the mail with the link lands in the catcher, and the invitation is listed as pending', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const res = await setup.api('post', '/staff', { email: 'Rhian.Judge@Example.org', role: 'judge' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: 'rhian.judge@example.org', role: 'judge' });
    const mail = await caughtMailTo('rhian.judge@example.org');
    expect(mail.subject).toBe('You are invited to be a judge at Test Shoot');
    expect(mail.text_body).toMatch(/Olwen Organizer invites you to be a judge at Test Shoot/);
    const link = /(http:\/\/\S+\/invite\?token=\S+)/.exec(mail.text_body)?.[1];
    expect(link).toBeDefined();
    const list = await setup.api('get', '/staff');
    expect(list.body.staff).toEqual([
      expect.objectContaining({ role: 'organizer', name: 'Olwen Organizer' }),
    ]);
    expect(list.body.invitations).toEqual([
      expect.objectContaining({ email: 'rhian.judge@example.org', role: 'judge' }),
    ]);
    expect(
      await server.db('audit_log').where({ event_id: setup.eventId, action: 'staff.invited' }).first(),
    ).toBeTruthy();
  });

  it('grants nothing until the invitation is accepted, even to an existing account; accepting grants the role', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const judge = await makePerson(server.db, 'Existing Judge');
    await setup.api('post', '/staff', { email: judge.email, role: 'judge' });
    expect(
      await server.db('event_roles').where({ event_id: setup.eventId, user_id: judge.id }).first(),
    ).toBeUndefined();
    const mail = await caughtMailTo(judge.email);
    const token = decodeURIComponent(/invite\?token=(\S+)/.exec(mail.text_body)![1]!);
    const accept = await request(server.app).post('/api/invitations/accept').set(judge.auth).send({ token });
    expect(accept.status).toBe(200);
    const list = await setup.api('get', '/staff');
    expect(list.body.staff.map((s: { role: string; name: string }) => `${s.role}:${s.name}`)).toEqual([
      'organizer:Olwen Organizer',
      'judge:Existing Judge',
    ]);
    expect(list.body.invitations).toEqual([]);
    const again = await setup.api('post', '/staff', { email: judge.email, role: 'judge' });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already a judge/);
  });

  it('replaces an earlier invitation to the same address and role, and can cancel one', async () => {
    const setup = await setUpEvent(server.app, server.db);
    await setup.api('post', '/staff', { email: 'twice@example.org', role: 'organizer' });
    await setup.api('post', '/staff', { email: 'twice@example.org', role: 'organizer' });
    const list = await setup.api('get', '/staff');
    expect(list.body.invitations).toHaveLength(1);
    const cancel = await setup.api('delete', `/staff/invitations/${list.body.invitations[0].id}`);
    expect(cancel.status).toBe(204);
    expect((await setup.api('get', '/staff')).body.invitations).toEqual([]);
    expect((await setup.api('delete', `/staff/invitations/${list.body.invitations[0].id}`)).status).toBe(404);
  });

  it('removes a judge, and never the last organizer', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const judge = await makePerson(server.db);
    await giveRole(server.db, setup.eventId, judge, 'judge');
    expect((await setup.api('delete', `/staff/${judge.id}/judge`)).status).toBe(204);
    expect((await setup.api('delete', `/staff/${judge.id}/judge`)).status).toBe(404);
    const last = await setup.api('delete', `/staff/${setup.organizer.id}/organizer`);
    expect(last.status).toBe(409);
    expect(last.body.error.message).toMatch(/only organizer/);
    const second = await makePerson(server.db);
    await giveRole(server.db, setup.eventId, second, 'organizer');
    expect((await setup.api('delete', `/staff/${setup.organizer.id}/organizer`)).status).toBe(204);
    expect(
      (await request(server.app).get(`/api/events/${setup.eventId}/staff`).set(second.auth)).body.staff,
    ).toHaveLength(1);
    expect(
      (
        await request(server.app)
          .delete(`/api/events/${setup.eventId}/staff/${second.id}/archer`)
          .set(second.auth)
      ).status,
    ).toBe(404);
  });

  it('refuses a bad address or role', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const res = await setup.api('post', '/staff', { email: 'nobody', role: 'captain' });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/email: That does not look like an e-mail address/);
    expect(res.body.error.message).toMatch(/role: Choose organizer or judge/);
  });
});
