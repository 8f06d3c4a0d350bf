import request from 'supertest';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { setUpEvent, type SetUpEvent } from './support/eventSetup';

/*
 * Names are shown, printed and mailed: bidirectional controls (a right-to-left override showed
 * "evil" as "live") and NUL/CR/LF are removed from every name on the way in.
 */

let server: TestServer;
let setup: SetUpEvent;
let divisionId: number;
const RLO = '\u202e';
const hidden = `${RLO}\u2066\u200f\u061c\u0000\r\n`;

beforeAll(async () => {
  server = await startTestServer();
  setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Women' }]);
  divisionId = setup.divisions['Recurve Women']!;
});
afterAll(async () => {
  await server.close();
});

it('removes bidirectional controls and NUL/CR/LF from names of people, clubs, events, sessions and divisions', async () => {
  const entry = await setup.api('post', '/entries', {
    name: `Ada ${RLO}live`,
    club: `Arrow${hidden} Club`,
    divisionId,
  });
  expect(entry.status).toBe(201);
  expect(entry.body).toMatchObject({ name: 'Ada live', club: 'Arrow Club' });

  const event = await setup.api('patch', '', { name: `Spring${hidden} Shoot`, venue: `Field${RLO}` });
  expect(event.status).toBe(200);
  expect(event.body).toMatchObject({ name: 'Spring Shoot', venue: 'Field' });

  const division = await setup.api('post', '/divisions', {
    bowStyle: 'barebow',
    className: `Under${RLO} 18`,
  });
  expect(division.body.className).toBe('Under 18');

  const session = await setup.api('post', '/sessions', {
    name: `Sunday${hidden}`,
    startsAt: '2026-12-13T09:00',
    rounds: [{ divisionId, roundId: '70m' }],
  });
  expect(session.body.name).toBe('Sunday');

  const person = await request(server.app)
    .post('/api/auth/sign-up')
    .send({
      email: 'names@ringcall.example',
      password: 'correct horse battery',
      displayName: `Bea${RLO} Quill`,
    });
  expect(person.body.user.displayName).toBe('Bea Quill');
});

it('refuses a name made of nothing but such characters', async () => {
  const res = await setup.api('post', '/entries', { name: hidden, divisionId });
  expect(res.status).toBe(400);
  expect(res.body.error.message).toMatch(/Enter the archer's name/);
});

it('removes them from names in an entry-list file too', async () => {
  const csv = `name,club,email,division\nCara${RLO} Bow,Club${RLO},,Recurve Women\n`;
  const res = await request(server.app)
    .post(`/api/events/${setup.eventId}/entries/import/preview`)
    .set(setup.organizer.auth)
    .attach('file', Buffer.from(csv), { filename: 'entries.csv', contentType: 'text/csv' });
  expect(res.status).toBe(200);
  expect(res.body.rows[0]).toMatchObject({ name: 'Cara Bow', club: 'Club' });
});

it('removes them from the corrected rows of an entry-list import too', async () => {
  const res = await request(server.app)
    .post(`/api/events/${setup.eventId}/entries/import`)
    .set(setup.organizer.auth)
    .send({
      rows: [{ row: 2, name: `Dara${RLO} Reed`, club: `Club${RLO}`, email: '', division: 'Recurve Women' }],
    });
  expect(res.status).toBe(201);
  const stored = await server.db('entries').where({ event_id: setup.eventId, name: 'Dara Reed' }).first();
  expect(stored).toMatchObject({ name: 'Dara Reed', club: 'Club' });
});
