import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson } from './support/people';
import { endAllSessions } from '../../server/services/sessionsEnd';

/*
 * The sync routes remember the person with their token rather than reading the account on every
 * request; ending the account's sign-ins (a password reset) must still refuse the token at once.
 */

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

describe('a person remembered with their token on the sync routes', () => {
  it('is refused at once when their sign-ins are ended', async () => {
    const person = await makePerson(server.db, 'Remy Remembered');
    const pull = () => request(server.app).get('/api/sync/pull?cursor=0').set(person.auth);
    expect((await pull()).status).toBe(200);
    expect((await pull()).status).toBe(200);
    await endAllSessions(server.db, person.id);
    const refused = await pull();
    expect(refused.status).toBe(401);
    expect(refused.body.error.message).toBe('Your sign-in has ended. Please sign in again.');
    const push = await request(server.app)
      .post('/api/sync/push')
      .set(person.auth)
      .send({ clientId: 'phone-remembered-1', mutations: [] });
    expect(push.status).toBe(401);
  });
});
