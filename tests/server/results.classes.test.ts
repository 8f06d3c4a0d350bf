import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { EventResults } from '../../src/contract/results';
import { agreeEnds, setUpJudging, type JudgingField } from './support/judging';
import { startTestServer, type TestServer } from './support/testServer';

let server: TestServer;
let j: JudgingField;
const ids = { ada: 0, bea: 0, cora: 0 };

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
  ids.ada = j.ada.entryId;
  ids.bea = j.field.archer(1, 'B').entryId;
  ids.cora = j.field.archer(1, 'C').entryId;
});
afterAll(() => server.close());

const api = (method: 'patch' | 'get', path: string) =>
  request(server.app)[method](`/api/events/${j.field.eventId}${path}`).set(j.field.organizer.auth);
const recurve = (body: EventResults) => body.sessions[0]!.divisions.find((d) => d.name === 'Recurve Women')!;
const end = (v: '10' | '9' | '8') => [v, v, v, v, v, v];

describe('results: classes inside a division', () => {
  it('keeps an entry’s class, refusing one that is too long', async () => {
    const res = await api('patch', `/entries/${ids.ada}`).send({ className: 'Under 21' });
    expect(res.status).toBe(200);
    expect(res.body.className).toBe('Under 21');
    const long = await api('patch', `/entries/${ids.cora}`).send({ className: 'x'.repeat(61) });
    expect(long.status).toBe(400);
    expect((await api('patch', `/entries/${ids.cora}`).send({ className: 'Under 21' })).status).toBe(200);
    const list = await api('get', '/entries');
    const classOf = (id: number) => list.body.entries.find((e: { id: number }) => e.id === id).className;
    expect([classOf(ids.ada), classOf(ids.bea), classOf(ids.cora)]).toEqual(['Under 21', '', 'Under 21']);
  });

  it('ranks each class on its own beside the division', async () => {
    await agreeEnds(j, ids.bea, [end('10')]);
    await agreeEnds(j, ids.ada, [end('9')]);
    await agreeEnds(j, ids.cora, [end('8')]);
    const res = await request(server.app).get(`/api/results/${j.field.eventId}`).set(j.field.organizer.auth);
    expect(res.status).toBe(200);
    const division = recurve(res.body);
    expect(division.rows.map((r) => [r.entryId, r.place, r.className])).toEqual([
      [ids.bea, 1, ''],
      [ids.ada, 2, 'Under 21'],
      [ids.cora, 3, 'Under 21'],
    ]);
    expect(division.classes).toHaveLength(1);
    expect(division.classes[0]!.name).toBe('Under 21');
    expect(division.classes[0]!.rows.map((r) => [r.entryId, r.place])).toEqual([
      [ids.ada, 1],
      [ids.cora, 2],
    ]);
    // Divisions without classes have none.
    expect(
      res.body.sessions[0].divisions.find((d: { name: string }) => d.name === 'Compound Men').classes,
    ).toEqual([]);
    const csv = await request(server.app)
      .get(`/api/results/${j.field.eventId}/csv`)
      .set(j.field.organizer.auth);
    expect(csv.text.split('\r\n')[0]).toMatch(/^Session,Division,Class,Place/);
    expect(csv.text).toContain('Qualification,Recurve Women,Under 21,2,');
  });

  it('reads a class column from an entry list: preview, then the rows imported as previewed', async () => {
    const csv = 'name,division,Age class\nNell Fletch,Recurve Women,50+\nOwen Nock,Recurve Women,\n';
    const preview = await request(server.app)
      .post(`/api/events/${j.field.eventId}/entries/import/preview`)
      .set(j.field.organizer.auth)
      .attach('file', Buffer.from(csv), { filename: 'entries.csv', contentType: 'text/csv' });
    expect(preview.status).toBe(200);
    const rows = preview.body.rows as { className: string; problems: string[] }[];
    expect(rows.map((r) => [r.className, r.problems])).toEqual([
      ['50+', []],
      ['', []],
    ]);
    const res = await request(server.app)
      .post(`/api/events/${j.field.eventId}/entries/import`)
      .set(j.field.organizer.auth)
      .send({ rows: rows.map(({ problems: _, ...row }) => row) });
    expect(res.status).toBe(201);
    const list = await api('get', '/entries');
    const byName = (name: string) => list.body.entries.find((e: { name: string }) => e.name === name);
    expect(byName('Nell Fletch').className).toBe('50+');
    expect(byName('Owen Nock').className).toBe('');
  });

  it('refuses a class longer than 60 characters in the corrected rows, naming the row', async () => {
    const res = await request(server.app)
      .post(`/api/events/${j.field.eventId}/entries/import`)
      .set(j.field.organizer.auth)
      .send({
        rows: [
          {
            row: 2,
            name: 'Long Class',
            club: '',
            email: '',
            division: 'Recurve Women',
            className: 'x'.repeat(61),
          },
        ],
      });
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual([
      { path: 'row 2', message: 'Use at most 60 characters for the class.' },
    ]);
  });
});
