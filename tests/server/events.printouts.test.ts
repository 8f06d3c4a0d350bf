import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { addArchers, binary, pdfPageCount, setUpEvent, type SetUpEvent } from './support/eventSetup';

let server: TestServer;
let setup: SetUpEvent;
let sessionId: number;
beforeAll(async () => {
  server = await startTestServer();
  setup = await setUpEvent(server.app, server.db, [
    { bowStyle: 'recurve', className: 'Women' },
    { bowStyle: 'compound', className: 'Men' },
  ]);
  await addArchers(setup, 'Recurve Women', 5);
  await addArchers(setup, 'Compound Men', 2);
  // A name outside the basic Latin font file must still print.
  await setup.api('post', '/entries', { name: 'Łucja Dvořák', divisionId: setup.divisions['Compound Men'] });
  const session = await setup.api('post', '/sessions', {
    name: 'Sunday 1440',
    startsAt: '2026-12-13T09:00',
    rounds: [
      { divisionId: setup.divisions['Recurve Women'], roundId: '1440-women' },
      { divisionId: setup.divisions['Compound Men'], roundId: '50m-compound' },
    ],
  });
  sessionId = session.body.id;
});
afterAll(async () => {
  await server.close();
});

const download = (path: string) =>
  request(server.app)
    .get(`/api/events/${setup.eventId}/sessions/${sessionId}/${path}`)
    .set(setup.organizer.auth)
    .buffer(true)
    .parse(binary);

describe('printouts', () => {
  it('refuses to print before anyone is on a target, saying what to do', async () => {
    const res = await request(server.app)
      .get(`/api/events/${setup.eventId}/sessions/${sessionId}/scorecards.pdf`)
      .set(setup.organizer.auth);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/Assign targets first/);
  });

  it('prints one scorecard page per assigned archer', async () => {
    await setup.api('post', `/sessions/${sessionId}/assign`);
    const res = await download('scorecards.pdf');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toBe('attachment; filename="scorecards-sunday-1440.pdf"');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdfPageCount(pdf)).toBe(8);
    // The Atkinson Hyperlegible files are embedded (both the Latin and the Latin Extended parts).
    expect(pdf.toString('latin1')).toMatch(/AtkinsonHyperlegible/);
    expect((pdf.toString('latin1').match(/\/FontFile2?/g) ?? []).length).toBeGreaterThanOrEqual(2);
  });

  it('prints one target sheet per target with its join code', async () => {
    const res = await download('target-sheets.pdf');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    // Recurve Women 4 + 1, Compound Men 3: three targets.
    expect(pdfPageCount(res.body as Buffer)).toBe(3);
  });

  it('follows moves: an archer taken off a target has no card', async () => {
    const list = (await setup.api('get', `/sessions/${sessionId}/targets`)).body;
    const someone = list.targets[0].archers[0].entryId;
    await setup.api('delete', `/sessions/${sessionId}/assignments/${someone}`);
    expect(pdfPageCount((await download('scorecards.pdf')).body as Buffer)).toBe(7);
  });
});
