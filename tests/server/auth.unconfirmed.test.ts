import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { makeEvent, makePerson } from './support/people';
import { waitForMail } from './support/mail';
import { createEmailToken } from '../../server/services/emailTokens';

/*
 * Signing up under someone else's address never locks its owner out: an account that was never
 * confirmed gives way to whoever reads the mailbox, and gains no role until it is confirmed.
 */

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

const signUp = (body: object) => request(server.app).post('/api/auth/sign-up').send(body);
const me = (res: request.Response) =>
  request(server.app).get('/api/me').set('Authorization', `Bearer ${res.body.accessToken}`);
const cookieOf = (res: request.Response) =>
  ([] as string[])
    .concat(res.headers['set-cookie'] ?? [])
    .find((c) => c.startsWith('rc_refresh='))!
    .split(';')[0]!;

describe('an unconfirmed account under my address', () => {
  it('gives way to the mailbox owner: signing up again mails a link, and using it takes the account over', async () => {
    const email = 'petra.loft@example.org';
    const squatter = await signUp({ email, password: 'i am not petra at all', displayName: 'Not Petra' });
    expect(squatter.status).toBe(201);

    const owner = await signUp({ email, password: 'petra shoots recurve', displayName: 'Petra Loft' });
    expect(owner.status).toBe(202);
    expect(owner.body).toEqual({ confirmByMail: true, email });
    // Nothing changed yet: the squatter's sign-in still works until the mailbox answers.
    expect((await me(squatter)).status).toBe(200);

    const mail = await waitForMail(server.db, email);
    expect(mail.subject).toBe('Finish creating your Ringcall account');
    const token = /\/reset-password\?token=([\w-]+)/.exec(mail.text_body)![1]!;
    const taken = await request(server.app)
      .post('/api/auth/reset-password')
      .send({ token, password: 'petra shoots recurve' });
    expect(taken.status).toBe(200);
    expect(taken.body.user).toMatchObject({ email, displayName: 'Petra Loft', emailVerified: true });

    expect((await me(squatter)).status).toBe(401);
    expect(
      (await request(server.app).post('/api/auth/refresh').set('Cookie', cookieOf(squatter))).status,
    ).toBe(401);
    const squatterAgain = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'i am not petra at all' });
    expect(squatterAgain.status).toBe(401);
    // Confirmed now: a further sign-up is told to sign in.
    expect((await signUp({ email, password: 'third time lucky', displayName: 'X' })).status).toBe(409);
  });

  it('gives way at once to the holder of an invitation to that address', async () => {
    const organizer = await makePerson(server.db, 'Org');
    const eventId = await makeEvent(server.db, organizer, 'County Shoot');
    const email = 'judge.hale@example.org';
    const squatter = await signUp({ email, password: 'squatting the judge', displayName: 'Fake Judge' });
    const inviteToken = await createEmailToken(server.db, {
      purpose: 'invite',
      email,
      eventId,
      role: 'judge',
      createdBy: organizer.id,
    });
    const judge = await signUp({
      email,
      password: 'the judge is here now',
      displayName: 'Judith Hale',
      inviteToken,
    });
    expect(judge.status).toBe(201);
    expect(judge.body.user).toMatchObject({ displayName: 'Judith Hale', emailVerified: true });
    expect((await me(judge)).body.roles).toEqual([{ eventId, eventName: 'County Shoot', role: 'judge' }]);
    expect((await me(squatter)).status).toBe(401);

    // The invitation screen asks once more after sign-up: the answer is the role, not "invalid".
    const accept = await request(server.app)
      .post('/api/invitations/accept')
      .set('Authorization', `Bearer ${judge.body.accessToken}`)
      .send({ token: inviteToken });
    expect(accept.status).toBe(200);
    expect(accept.body).toEqual({ eventId, eventName: 'County Shoot', role: 'judge' });
  });

  it('refuses a sign-up whose invitation was sent to another address, creating nothing', async () => {
    const organizer = await makePerson(server.db, 'Org');
    const eventId = await makeEvent(server.db, organizer);
    const inviteToken = await createEmailToken(server.db, {
      purpose: 'invite',
      email: 'invited@example.org',
      eventId,
      role: 'judge',
      createdBy: organizer.id,
    });
    const res = await signUp({
      email: 'someone.else@example.org',
      password: 'not the invited one',
      displayName: 'S',
      inviteToken,
    });
    expect(res.status).toBe(403);
    expect(await server.db('users').where({ email: 'someone.else@example.org' }).first()).toBeUndefined();
  });

  it('gains no archer role from an entry with its address until the address is confirmed', async () => {
    const organizer = await makePerson(server.db, 'Org');
    const eventId = await makeEvent(server.db, organizer, 'Entry Shoot');
    const division = await request(server.app)
      .post(`/api/events/${eventId}/divisions`)
      .set(organizer.auth)
      .send({ bowStyle: 'recurve', className: 'Women' });
    const email = 'entered.archer@example.org';
    const squatter = await signUp({ email, password: 'wants her signature', displayName: 'Entered Archer' });
    const entry = await request(server.app)
      .post(`/api/events/${eventId}/entries`)
      .set(organizer.auth)
      .send({ name: 'Entered Archer', club: 'Club', divisionId: division.body.id, email });
    expect(entry.status).toBe(201);
    expect((await me(squatter)).body.roles).toEqual([]);
    expect((await server.db('entries').where({ id: entry.body.id }).first()).user_id).toBeNull();
  });
});
