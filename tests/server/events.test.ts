import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { giveRole, makeEvent, makePerson } from './support/people';
import { addArchers, setUpEvent } from './support/eventSetup';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

const newEvent = {
  name: 'Harvest Moon Shoot',
  venue: 'Old orchard field',
  startsOn: '2027-09-18',
  endsOn: '2027-09-19',
  timeZone: 'Europe/Dublin',
};

describe('events', () => {
  it('lets any signed-in person create an event and makes them its organizer', async () => {
    const person = await makePerson(server.db, 'Niamh Founder');
    const res = await request(server.app).post('/api/events').set(person.auth).send(newEvent);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ ...newEvent, id: expect.any(Number) });
    const role = await server.db('event_roles').where({ event_id: res.body.id, user_id: person.id }).first();
    expect(role.role).toBe('organizer');
    const logged = await server
      .db('audit_log')
      .where({ event_id: res.body.id, action: 'event.created' })
      .first();
    expect(logged.user_id).toBe(person.id);
  });

  it('lists only the events the person holds a role in, with the roles', async () => {
    const a = await makePerson(server.db);
    const b = await makePerson(server.db);
    const mine = await makeEvent(server.db, a, 'Mine');
    const theirs = await makeEvent(server.db, b, 'Theirs');
    await giveRole(server.db, theirs, a, 'judge');
    await makeEvent(server.db, b, 'Not mine');
    const res = await request(server.app).get('/api/events').set(a.auth);
    expect(res.status).toBe(200);
    const byId = Object.fromEntries(
      res.body.events.map((e: { id: number; roles: string[] }) => [e.id, e.roles]),
    );
    expect(Object.keys(byId).map(Number).sort()).toEqual([mine, theirs].sort());
    expect(byId[mine]).toEqual(['organizer']);
    expect(byId[theirs]).toEqual(['judge']);
  });

  it('refuses a time zone that does not exist, and a last day before the first', async () => {
    const person = await makePerson(server.db);
    const zone = await request(server.app)
      .post('/api/events')
      .set(person.auth)
      .send({ ...newEvent, timeZone: 'Mars/Olympus_Mons' });
    expect(zone.status).toBe(400);
    expect(zone.body.error.message).toMatch(/time zone/);
    expect(zone.body.error.fields[0].path).toBe('timeZone');
    const days = await request(server.app)
      .post('/api/events')
      .set(person.auth)
      .send({ ...newEvent, endsOn: '2027-09-17' });
    expect(days.status).toBe(400);
    expect(days.body.error.message).toMatch(/last day cannot be before the first/);
    const bad = await request(server.app)
      .post('/api/events')
      .set(person.auth)
      .send({ ...newEvent, startsOn: '2027-02-30' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/does not exist/);
  });

  it('lets the organizer edit the details; checks the dates against the stored ones', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const res = await setup.api('patch', '', {
      name: 'Renamed Shoot',
      venue: 'North field',
      timeZone: 'America/Chicago',
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      name: 'Renamed Shoot',
      venue: 'North field',
      timeZone: 'America/Chicago',
      startsOn: '2026-12-12',
    });
    const before = await setup.api('patch', '', { endsOn: '2026-12-01' });
    expect(before.status).toBe(400);
    expect(before.body.error.message).toMatch(/last day/);
    const nothing = await setup.api('patch', '', {});
    expect(nothing.status).toBe(400);
    expect(
      await server.db('audit_log').where({ event_id: setup.eventId, action: 'event.updated' }).first(),
    ).toBeTruthy();
  });

  it('gives any role the summary with sessions, divisions and counts', async () => {
    const setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Women' }]);
    await addArchers(setup, 'Recurve Women', 3);
    await setup.api('post', '/sessions', {
      name: 'Morning',
      startsAt: '2026-12-12T09:00',
      rounds: [{ divisionId: setup.divisions['Recurve Women'], roundId: '70m' }],
    });
    const archer = await makePerson(server.db);
    await giveRole(server.db, setup.eventId, archer, 'archer');
    const res = await request(server.app).get(`/api/events/${setup.eventId}`).set(archer.auth);
    expect(res.status).toBe(200);
    expect(res.body.myRoles).toEqual(['archer']);
    expect(res.body.divisions).toEqual([
      {
        id: setup.divisions['Recurve Women'],
        bowStyle: 'recurve',
        className: 'Women',
        name: 'Recurve Women',
        entryCount: 3,
      },
    ]);
    expect(res.body.sessions[0]).toMatchObject({
      name: 'Morning',
      startsAt: '2026-12-12T09:00',
      closedAt: null,
      assignedCount: 0,
    });
    expect(res.body.sessions[0].rounds[0].round).toMatchObject({
      id: '70m',
      arrows: 72,
      ends: 12,
      maxScore: 720,
    });
    expect(res.body.counts).toMatchObject({
      entries: 3,
      divisions: 1,
      sessions: 1,
      organizers: 1,
      judges: 0,
    });
  });

  it('answers 404 for an event that does not exist', async () => {
    const person = await makePerson(server.db);
    const res = await request(server.app).get('/api/events/999999').set(person.auth);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('That event does not exist.');
  });
});

describe('divisions', () => {
  it('names a division by bow style and class and refuses a second one of the same name', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const first = await setup.api('post', '/divisions', { bowStyle: 'barebow', className: 'Under 18' });
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({
      name: 'Barebow Under 18',
      bowStyle: 'barebow',
      className: 'Under 18',
      entryCount: 0,
    });
    const again = await setup.api('post', '/divisions', { bowStyle: 'barebow', className: 'under 18' });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already a division called Barebow under 18/);
    const badStyle = await setup.api('post', '/divisions', { bowStyle: 'longbow', className: 'Open' });
    expect(badStyle.status).toBe(400);
    expect(badStyle.body.error.message).toMatch(/recurve, compound or barebow/);
  });

  it('refuses to change a bow style the division’s round does not fit', async () => {
    const setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Men' }]);
    const divisionId = setup.divisions['Recurve Men']!;
    await setup.api('post', '/sessions', {
      name: 'Day one',
      startsAt: '2026-12-12T09:00',
      rounds: [{ divisionId, roundId: '70m' }],
    });
    const res = await setup.api('put', `/divisions/${divisionId}`, {
      bowStyle: 'compound',
      className: 'Men',
    });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/70 m round .* not shot with compound/);
    const rename = await setup.api('put', `/divisions/${divisionId}`, {
      bowStyle: 'recurve',
      className: 'Open',
    });
    expect(rename.status).toBe(200);
    expect(rename.body.name).toBe('Recurve Open');
  });

  it('refuses to delete a division that still has entries, and deletes an empty one', async () => {
    const setup = await setUpEvent(server.app, server.db, [
      { bowStyle: 'compound', className: 'Women' },
      { bowStyle: 'compound', className: 'Men' },
    ]);
    await addArchers(setup, 'Compound Women', 2);
    const full = await setup.api('delete', `/divisions/${setup.divisions['Compound Women']}`);
    expect(full.status).toBe(409);
    expect(full.body.error.message).toMatch(/still has 2 entries/);
    const empty = await setup.api('delete', `/divisions/${setup.divisions['Compound Men']}`);
    expect(empty.status).toBe(204);
    const missing = await setup.api('delete', `/divisions/${setup.divisions['Compound Men']}`);
    expect(missing.status).toBe(404);
  });

  it('will not touch a division of another event', async () => {
    const one = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Women' }]);
    const two = await setUpEvent(server.app, server.db);
    const res = await two.api('delete', `/divisions/${one.divisions['Recurve Women']}`);
    expect(res.status).toBe(404);
  });
});

describe('sessions and rounds', () => {
  const custom = {
    id: 'club-30m',
    name: 'Club 30 m round',
    venue: 'outdoor',
    bowStyles: ['recurve', 'barebow'],
    distances: [
      { label: '30 m', distanceM: 30, faceId: 'full-80', arrows: 36, arrowsPerEnd: 6, secondsPerEnd: 240 },
    ],
  };

  it('stores a catalog round per division as a snapshot, and a custom round checked by the core', async () => {
    const setup = await setUpEvent(server.app, server.db, [
      { bowStyle: 'recurve', className: 'Women' },
      { bowStyle: 'barebow', className: 'Women' },
    ]);
    const res = await setup.api('post', '/sessions', {
      name: 'Saturday',
      startsAt: '2026-12-12T09:30',
      rounds: [
        { divisionId: setup.divisions['Recurve Women'], roundId: '70m' },
        { divisionId: setup.divisions['Barebow Women'], customRound: custom },
      ],
    });
    expect(res.status).toBe(201);
    expect(
      res.body.rounds.map((r: { round: { name: string; custom: boolean } }) => [
        r.round.name,
        r.round.custom,
      ]),
    ).toEqual([
      ['70 m round', false],
      ['Club 30 m round', true],
    ]);
    const stored = await server
      .db('session_divisions')
      .where({ session_id: res.body.id })
      .orderBy('division_id');
    expect(stored.map((r) => r.round_id)).toEqual(['70m', 'custom']);
    expect(JSON.parse(stored[0].round_json).distances).toHaveLength(2);
    expect(JSON.parse(stored[1].round_json).name).toBe('Club 30 m round');
  });

  it('refuses a catalog round that does not fit the division’s bow style', async () => {
    const setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'compound', className: 'Men' }]);
    const res = await setup.api('post', '/sessions', {
      name: 'S',
      startsAt: '2026-12-12T09:00',
      rounds: [{ divisionId: setup.divisions['Compound Men'], roundId: '70m' }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(
      /70 m round is shot with recurve, but Compound Men shoot compound/,
    );
    const unknown = await setup.api('post', '/sessions', {
      name: 'S',
      startsAt: '2026-12-12T09:00',
      rounds: [{ divisionId: setup.divisions['Compound Men'], roundId: '999m' }],
    });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.message).toMatch(/not a round in Ringcall's catalog/);
  });

  it('refuses a broken custom round with every problem listed', async () => {
    const setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Men' }]);
    const res = await setup.api('post', '/sessions', {
      name: 'S',
      startsAt: '2026-12-12T09:00',
      rounds: [
        {
          divisionId: setup.divisions['Recurve Men'],
          customRound: { ...custom, distances: [{ ...custom.distances[0], arrows: 35, faceId: 'round-99' }] },
        },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/custom round for Recurve Men is not complete/);
    expect(res.body.error.fields.map((f: { message: string }) => f.message).join(' ')).toMatch(
      /not a known target face/,
    );
  });

  it('refuses a division of another event, a division twice, a duplicate name and a bad start', async () => {
    const setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Men' }]);
    const other = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Men' }]);
    const foreign = await setup.api('post', '/sessions', {
      name: 'S',
      startsAt: '2026-12-12T09:00',
      rounds: [{ divisionId: other.divisions['Recurve Men'], roundId: '70m' }],
    });
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.message).toMatch(/not part of this event/);
    const id = setup.divisions['Recurve Men'];
    const twice = await setup.api('post', '/sessions', {
      name: 'S',
      startsAt: '2026-12-12T09:00',
      rounds: [
        { divisionId: id, roundId: '70m' },
        { divisionId: id, roundId: '18m' },
      ],
    });
    expect(twice.status).toBe(400);
    expect(twice.body.error.message).toMatch(/listed twice/);
    expect(
      (await setup.api('post', '/sessions', { name: 'Same', startsAt: '2026-12-12T09:00', rounds: [] }))
        .status,
    ).toBe(201);
    const dup = await setup.api('post', '/sessions', {
      name: 'same',
      startsAt: '2026-12-12T13:00',
      rounds: [],
    });
    expect(dup.status).toBe(409);
    const start = await setup.api('post', '/sessions', {
      name: 'Late',
      startsAt: '2026-12-12T25:00',
      rounds: [],
    });
    expect(start.status).toBe(400);
  });

  it('edits, closes, refuses changes while closed, reopens and deletes a session', async () => {
    const setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'barebow', className: 'Men' }]);
    const divisionId = setup.divisions['Barebow Men'];
    const created = await setup.api('post', '/sessions', {
      name: 'Afternoon',
      startsAt: '2026-12-12T13:00',
      rounds: [],
    });
    const path = `/sessions/${created.body.id}`;
    const edited = await setup.api('patch', path, {
      startsAt: '2026-12-12T14:00',
      rounds: [{ divisionId, roundId: '50m-barebow' }],
    });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({
      startsAt: '2026-12-12T14:00',
      rounds: [{ divisionId, round: { id: '50m-barebow' } }],
    });
    const closed = await setup.api('post', `${path}/close`);
    expect(closed.status).toBe(200);
    expect(closed.body.closedAt).toEqual(expect.any(String));
    expect((await setup.api('post', `${path}/close`)).status).toBe(409);
    const whileClosed = await setup.api('patch', path, { name: 'Evening' });
    expect(whileClosed.status).toBe(409);
    expect(whileClosed.body.error.message).toMatch(/closed. Reopen it/);
    expect((await setup.api('delete', path)).status).toBe(409);
    expect((await setup.api('post', `${path}/reopen`)).body.closedAt).toBeNull();
    expect((await setup.api('delete', path)).status).toBe(204);
    expect((await setup.api('patch', path, { name: 'Gone' })).status).toBe(404);
    const actions = (await server.db('audit_log').where({ event_id: setup.eventId }).select('action')).map(
      (r) => r.action,
    );
    expect(actions).toEqual(
      expect.arrayContaining([
        'session.created',
        'session.updated',
        'session.closed',
        'session.reopened',
        'session.deleted',
      ]),
    );
  });
});

describe('entries by form', () => {
  it('adds, edits and removes an entry; a duplicate archer in the same division is refused', async () => {
    const setup = await setUpEvent(server.app, server.db, [
      { bowStyle: 'recurve', className: 'Women' },
      { bowStyle: 'barebow', className: 'Women' },
    ]);
    const add = await setup.api('post', '/entries', {
      name: 'Ffion Marlowe',
      club: 'Vale Bowmen',
      email: 'Ffion@Example.org',
      divisionId: setup.divisions['Recurve Women'],
    });
    expect(add.status).toBe(201);
    expect(add.body).toMatchObject({
      name: 'Ffion Marlowe',
      email: 'ffion@example.org',
      divisionName: 'Recurve Women',
      linked: false,
    });
    const dup = await setup.api('post', '/entries', {
      name: ' ffion  marlowe ',
      divisionId: setup.divisions['Recurve Women'],
    });
    expect(dup.status).toBe(409);
    expect(dup.body.error.message).toMatch(/already entered in Recurve Women/);
    // The same archer may shoot a second bow style.
    expect(
      (
        await setup.api('post', '/entries', {
          name: 'Ffion Marlowe',
          divisionId: setup.divisions['Barebow Women'],
        })
      ).status,
    ).toBe(201);
    const edit = await setup.api('patch', `/entries/${add.body.id}`, { club: 'Hill Archers' });
    expect(edit.status).toBe(200);
    expect(edit.body.club).toBe('Hill Archers');
    const badMail = await setup.api('post', '/entries', {
      name: 'X',
      email: 'not-an-address',
      divisionId: setup.divisions['Recurve Women'],
    });
    expect(badMail.status).toBe(400);
    expect(badMail.body.error.message).toMatch(/e-mail address/);
    expect((await setup.api('delete', `/entries/${add.body.id}`)).status).toBe(204);
    const list = await setup.api('get', '/entries');
    expect(list.body.entries.map((e: { name: string }) => e.name)).toEqual(['Ffion Marlowe']);
  });

  it('links an entry to a verified account with that address and makes them an archer; removing it takes the role back', async () => {
    const setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'compound', className: 'Men' }]);
    const archer = await makePerson(server.db, 'Cormac Linked');
    const add = await setup.api('post', '/entries', {
      name: 'Cormac Linked',
      email: archer.email,
      divisionId: setup.divisions['Compound Men'],
    });
    expect(add.body.linked).toBe(true);
    const summary = await request(server.app).get(`/api/events/${setup.eventId}`).set(archer.auth);
    expect(summary.status).toBe(200);
    expect(summary.body.myRoles).toEqual(['archer']);
    await setup.api('delete', `/entries/${add.body.id}`);
    expect((await request(server.app).get(`/api/events/${setup.eventId}`).set(archer.auth)).status).toBe(403);
  });

  it('refuses a division of another event', async () => {
    const one = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Men' }]);
    const two = await setUpEvent(server.app, server.db);
    const res = await two.api('post', '/entries', {
      name: 'Stray',
      divisionId: one.divisions['Recurve Men'],
    });
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/division does not exist in this event/);
  });
});
