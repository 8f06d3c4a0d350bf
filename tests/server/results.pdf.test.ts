import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { binary, pdfPageCount } from './support/eventSetup';
import { agreeEnds, setUpJudging, twelveEnds, type JudgingField } from './support/judging';
import { startTestServer, type TestServer } from './support/testServer';

let server: TestServer;
let j: JudgingField;
let eventName = '';
const divisions: Record<string, number> = {};

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
  const { db } = server;
  eventName = ((await db('events').where({ id: j.field.eventId }).first('name')) as { name: string }).name;
  for (const d of (await db('divisions').where({ event_id: j.field.eventId }).select('id', 'name')) as {
    id: number;
    name: string;
  }[])
    divisions[d.name] = d.id;
  // 40 more compound women on targets 11–20: more than one page of rows.
  for (let i = 0; i < 40; i += 1) {
    const [entry] = await db('entries')
      .insert({
        event_id: j.field.eventId,
        division_id: divisions['Compound Women'],
        name: `Extra Archer ${i}`,
        club: `Club ${i % 5}`,
        created_at: new Date().toISOString(),
      })
      .returning('id');
    await db('target_assignments').insert({
      session_id: j.sessionId,
      entry_id: (entry as { id: number }).id,
      target_number: 11 + Math.floor(i / 4),
      position: 'ABCD'[i % 4],
    });
  }
  await agreeEnds(j, j.ada.entryId, twelveEnds());
});
afterAll(() => server.close());

const pdf = (query = '', auth?: { Authorization: string }) => {
  const req = request(server.app).get(`/api/results/${j.field.eventId}/pdf${query}`);
  return (auth ? req.set(auth) : req).buffer(true).parse(binary);
};
/** The document's title, a plain string object in the PDF (the pages themselves are compressed). */
const hasTitle = (body: Buffer, title: string) => body.toString('latin1').includes(`(${title})`);

describe('results as PDF', () => {
  it('prints unpublished results for the organizers only', async () => {
    for (const who of [undefined, j.field.judge.auth, j.people.ada.auth, j.people.stranger.auth]) {
      const res = await request(server.app)
        .get(`/api/results/${j.field.eventId}/pdf`)
        .set(who ?? {});
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/not published yet; until then only its organizers can print/);
    }
    const res = await pdf('', j.field.organizer.auth);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toBe(`attachment; filename="results-${j.field.eventId}.pdf"`);
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString()).toBe('%PDF-');
    expect(hasTitle(body, `Results - ${eventName}`)).toBe(true);
    // Recurve Women: archers 1 page, Field Club's team 1; Compound Men 1 (two archers, no team);
    // Compound Women: 41 archers on 2 pages, the teams of five clubs on 1.
    expect(pdfPageCount(body)).toBe(6);
  });

  it('prints one division, and anyone may once the results are published', async () => {
    const published = await request(server.app)
      .patch(`/api/events/${j.field.eventId}/results-settings`)
      .set(j.field.organizer.auth)
      .send({ published: true });
    expect(published.status).toBe(200);
    const whole = await pdf();
    expect(whole.status).toBe(200);
    expect(pdfPageCount(whole.body as Buffer)).toBe(6);
    const one = await pdf(`?division=${divisions['Compound Women']}`);
    expect(one.status).toBe(200);
    expect(one.headers['content-disposition']).toContain(`-division-${divisions['Compound Women']}.pdf`);
    expect(pdfPageCount(one.body as Buffer)).toBe(3);
    expect(hasTitle(one.body as Buffer, `Results - ${eventName} - Compound Women`)).toBe(true);
  });

  it('answers a division that is not a number, or not of this event, with a readable 4xx', async () => {
    const bad = await request(server.app).get(`/api/results/${j.field.eventId}/pdf?division=abc`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/division must be the number/);
    const unknown = await request(server.app).get(`/api/results/${j.field.eventId}/pdf?division=999999`);
    expect(unknown.status).toBe(404);
    expect((await request(server.app).get('/api/results/999999/pdf')).status).toBe(404);
  });
});
