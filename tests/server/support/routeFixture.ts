import request from 'supertest';
import type { TestServer } from './testServer';
import { giveRole, makeEvent, makePerson } from './people';
import { photo, type Caller, type Fixture, type RouteRule } from './routeRoles';

/** A fresh event: organizer, judge, an archer with an entry, a stranger; a session laid out on targets; a pending invitation. */
export async function makeRouteFixture(server: TestServer): Promise<Fixture> {
  const { db, app } = server;
  const people = {
    organizer: await makePerson(db, 'Table Organizer'),
    judge: await makePerson(db, 'Table Judge'),
    archer: await makePerson(db, 'Table Archer'),
    stranger: await makePerson(db, 'Table Stranger'),
  };
  const eventId = await makeEvent(db, people.organizer);
  await giveRole(db, eventId, people.judge, 'judge');
  const api = (method: 'post', path: string, body: object) =>
    request(app)[method](`/api/events/${eventId}${path}`).set(people.organizer.auth).send(body);
  const divisionId = (await api('post', '/divisions', { bowStyle: 'recurve', className: 'Women' })).body.id;
  const emptyDivisionId = (await api('post', '/divisions', { bowStyle: 'compound', className: 'Men' })).body
    .id;
  const entryIds: number[] = [];
  entryIds.push(
    (await api('post', '/entries', { name: 'Table Archer', email: people.archer.email, divisionId })).body.id,
  );
  for (const name of ['Second Archer', 'Third Archer'])
    entryIds.push((await api('post', '/entries', { name, divisionId })).body.id);
  const sessionId = (
    await api('post', '/sessions', {
      name: 'Morning',
      startsAt: '2026-12-12T09:00',
      rounds: [{ divisionId, roundId: '70m' }],
    })
  ).body.id;
  await api('post', `/sessions/${sessionId}/assign`, {});
  const closedSessionId = (
    await api('post', '/sessions', { name: 'Closed', startsAt: '2026-12-12T15:00', rounds: [] })
  ).body.id;
  await api('post', `/sessions/${closedSessionId}/close`, {});
  const invitationId = (
    await api('post', '/staff', { email: `pending.${eventId}@example.org`, role: 'organizer' })
  ).body.id;
  const joinCode = (
    await db('join_codes')
      .where({ session_id: sessionId, target_number: 1 })
      .whereNull('revoked_at')
      .first('code')
  ).code;
  const upload = photo().upload;
  const photoId = (
    await request(app)
      .post(`/api/events/${eventId}/photos`)
      .set(people.organizer.auth)
      .attach(upload.field, upload.content as Buffer, { filename: upload.filename, contentType: 'image/png' })
  ).body.photoId;
  return {
    people,
    eventId,
    photoId,
    divisionId,
    emptyDivisionId,
    sessionId,
    closedSessionId,
    entryIds,
    invitationId,
    joinCode,
  };
}

/** Calls the row's route as `caller`, with the row's body. */
export function callRoute(server: TestServer, rule: RouteRule, f: Fixture, caller: Caller) {
  let req = request(server.app)[rule.method](rule.path(f));
  if (caller !== 'anonymous') req = req.set(f.people[caller].auth);
  const body = rule.body?.(f);
  if (body && 'upload' in body) {
    const { field, content, filename, contentType } = body.upload;
    return req.attach(field, Buffer.from(content), contentType ? { filename, contentType } : filename);
  }
  return body ? req.send(body) : req;
}
