import request from 'supertest';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { roundEndCount, getRound, type ArrowValue } from '../../src/core';
import type { BracketDto, MatchDto } from '../../src/contract/matches';
import { PassThrough } from 'node:stream';
import { bracketPdf } from '../../server/services/matches/bracketPdf';
import { binary, pdfPageCount } from './support/eventSetup';
import { setUpField, writeAgreedEnds, type Field } from './support/fieldSetup';
import { waitForMail } from './support/mail';
import { startTestServer, type TestServer } from './support/testServer';

/*
 * Where the eliminations are seen besides the bracket page (docs/matches.md, docs/results.md):
 * the final places in the results CSV and PDF, in the "send results" mail, and the bracket PDF.
 * A four-archer recurve bracket is decided through the API: one semi-final by a no-show, the
 * other and the final by signed sets, the bronze match by a withdrawal.
 */

let server: TestServer;
let field: Field;
const divisions = new Map<string, number>();
const ENDS = roundEndCount(getRound('18m'));
const mailOf = (n: number) => `recurve.${n}@ringcall.example`;

beforeAll(async () => {
  server = await startTestServer();
  const names = [
    ...[1, 2, 3, 4].map((n) => ({ name: `Recurve Men ${n}`, division: 'Recurve Men', drop: n })),
    ...[1, 2].map((n) => ({ name: `Compound Women ${n}`, division: 'Compound Women', drop: n })),
  ];
  field = await setUpField(server.db, {
    divisions: [
      { name: 'Recurve Men', bowStyle: 'recurve', roundId: '18m' },
      { name: 'Compound Women', bowStyle: 'compound', roundId: '18m' },
    ],
    targets: [
      { number: 1, archers: names.slice(0, 4) },
      { number: 2, archers: names.slice(4) },
    ],
  });
  for (const d of (await server.db('divisions').where({ event_id: field.eventId })) as {
    id: number;
    name: string;
  }[])
    divisions.set(d.name, d.id);
  await writeAgreedEnds(server.db, field, ENDS, (a) => names.find((n) => n.name === a.name)!.drop);
  for (const n of [1, 2, 3, 4])
    await server
      .db('entries')
      .where({ event_id: field.eventId, name: `Recurve Men ${n}` })
      .update({ email: mailOf(n) });
});
afterAll(() => server.close());

const base = () => `/api/events/${field.eventId}`;
const org = () => field.organizer.auth;
const bracket = async (): Promise<BracketDto> => {
  const res = await request(server.app).get(`${base()}/brackets`).set(org());
  return (res.body.brackets as BracketDto[]).find((b) => b.divisionName === 'Recurve Men')!;
};
const matchAt = async (round: number, slot: number, bronze = false): Promise<MatchDto> =>
  (await bracket()).matches.find((m) => m.round === round && m.slot === slot && m.bronze === bronze)!;
const seeds = (m: MatchDto) => [m.sides.a?.seed ?? null, m.sides.b?.seed ?? null];
const v = (text: string) => text.split(' ') as ArrowValue[];
const pdf = (path: string) => request(server.app).get(path).set(org()).buffer(true).parse(binary);

async function win(match: MatchDto, winner: 'a' | 'b') {
  for (let i = 0; i < 3; i += 1) {
    const [a, b] = winner === 'a' ? ['10 10 10', '9 9 9'] : ['9 9 9', '10 10 10'];
    const res = await request(server.app)
      .put(`${base()}/matches/${match.id}/ends/${i}`)
      .set(field.judge.auth)
      .send({ a: v(a), b: v(b) });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
  }
  expect(
    (await request(server.app).post(`${base()}/matches/${match.id}/sign`).set(field.judge.auth).send({}))
      .status,
  ).toBe(200);
}
const walkover = async (match: MatchDto, side: 'a' | 'b', reason: 'no-show' | 'withdrawal') =>
  expect(
    (
      await request(server.app)
        .post(`${base()}/matches/${match.id}/walkover`)
        .set(org())
        .send({ side, reason })
    ).status,
  ).toBe(200);

let pagesBefore = 0;
let recurvePagesBefore = 0;
const recurvePdf = () => pdf(`/api/results/${field.eventId}/pdf?division=${divisions.get('Recurve Men')!}`);

describe('a decided bracket', () => {
  it('is decided through the API', async () => {
    pagesBefore = pdfPageCount((await pdf(`/api/results/${field.eventId}/pdf`)).body as Buffer);
    recurvePagesBefore = pdfPageCount((await recurvePdf()).body as Buffer);
    const created = await request(server.app)
      .post(`${base()}/brackets`)
      .set(org())
      .send({ sessionId: field.sessionId, divisionId: divisions.get('Recurve Men')!, size: 'everyone' });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(seeds(await matchAt(0, 0))).toEqual([1, 4]);
    expect(seeds(await matchAt(0, 1))).toEqual([2, 3]);
    await walkover(await matchAt(0, 0), 'a', 'no-show'); // seed 4 through
    await win(await matchAt(0, 1), 'b'); // seed 3 beats 2
    expect(seeds(await matchAt(1, 0))).toEqual([4, 3]);
    expect(seeds(await matchAt(1, 0, true))).toEqual([1, 2]);
    await win(await matchAt(1, 0), 'b'); // seed 3 beats 4 in the final
    await walkover(await matchAt(1, 0, true), 'b', 'withdrawal'); // seed 1 takes bronze
    expect((await bracket()).places.map((p) => [p.place, p.seed])).toEqual([
      [1, 3],
      [2, 4],
      [3, 1],
      [4, 2],
    ]);
  });
});

describe('final places in the results exports', () => {
  it('CSV: after the standings, under their own heading, formula-safe', async () => {
    await server
      .db('entries')
      .where({ event_id: field.eventId, name: 'Recurve Men 4' })
      .update({ club: '=Club' });
    const res = await request(server.app).get(`/api/results/${field.eventId}/csv`).set(org());
    expect(res.status).toBe(200);
    const rows = Papa.parse<string[]>(res.text.trim()).data;
    const heading = rows.findIndex((r) => r[0] === 'Final places after the eliminations');
    // Six standings rows above it (the header, then one per archer) and a blank line.
    expect(heading).toBe(8);
    expect(rows[0]![0]).toBe('Session');
    expect(rows[heading - 1]).toEqual(['']);
    const clubs = new Map<string, string>();
    for (const e of (await server.db('entries').where({ event_id: field.eventId })) as {
      name: string;
      club: string;
    }[])
      clubs.set(e.name, e.club);
    const club = (n: number) => clubs.get(`Recurve Men ${n}`)!;
    expect(rows.slice(heading + 1)).toEqual([
      ['Division', 'Final place', 'Archer', 'Club', 'Seed'],
      ['Recurve Men', '1', 'Recurve Men 3', club(3), '3'],
      ['Recurve Men', '2', 'Recurve Men 4', "'=Club", '4'],
      ['Recurve Men', '3', 'Recurve Men 1', club(1), '1'],
      ['Recurve Men', '4', 'Recurve Men 2', club(2), '2'],
    ]);
    const other = await request(server.app)
      .get(`/api/results/${field.eventId}/csv?division=${divisions.get('Compound Women')!}`)
      .set(org());
    expect(other.text).not.toContain('Final places');
  });

  it('PDF: one more page after the division with the bracket', async () => {
    const whole = await pdf(`/api/results/${field.eventId}/pdf`);
    expect(whole.status).toBe(200);
    expect(pdfPageCount(whole.body as Buffer)).toBe(pagesBefore + 1);
    expect(pdfPageCount((await recurvePdf()).body as Buffer)).toBe(recurvePagesBefore + 1);
  });
});

describe('send results', () => {
  it('mails an archer who shot in a bracket their final place with the qualification place', async () => {
    const published = await request(server.app)
      .patch(`${base()}/results-settings`)
      .set(org())
      .send({ published: true });
    expect(published.status).toBe(200);
    const res = await request(server.app).post(`${base()}/results/send`).set(org()).send({});
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ sent: 4 });
    const third = await waitForMail(server.db, mailOf(3));
    expect(third.text_body).toMatch(/Recurve Men: place 3 of 4, total \d+/);
    expect(third.text_body).toContain('- Recurve Men, eliminations: final place 1 of 4');
    const first = await waitForMail(server.db, mailOf(1));
    expect(first.text_body).toMatch(/Recurve Men: place 1 of 4/);
    expect(first.text_body).toContain('- Recurve Men, eliminations: final place 3 of 4');
  });
});

describe('the bracket PDF', () => {
  const bracketPdf = (query = '', auth?: { Authorization: string }) => {
    const req = request(server.app).get(`${base()}/brackets/pdf${query}`);
    return (auth ? req.set(auth) : req).buffer(true).parse(binary);
  };
  const hasTitle = (body: Buffer, title: string) => body.toString('latin1').includes(`(${title})`);

  it('prints each division’s bracket on a landscape page, for whoever may see the brackets', async () => {
    // Published above: anyone may read it.
    const res = await bracketPdf();
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toBe(
      `attachment; filename="eliminations-${field.eventId}.pdf"`,
    );
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdfPageCount(body)).toBe(1);
    // A4 landscape.
    expect(body.toString('latin1')).toMatch(/\/MediaBox \[0 0 841\.89 595\.28\]/);
    expect(hasTitle(body, 'Eliminations - Field Shoot - Recurve Men')).toBe(true);
    const one = await bracketPdf(`?division=${divisions.get('Recurve Men')!}`);
    expect(one.status).toBe(200);
    expect(one.headers['content-disposition']).toContain(`-division-${divisions.get('Recurve Men')!}.pdf`);
  });

  it('answers a division without a bracket or not a number with a readable 4xx', async () => {
    const none = await request(server.app).get(
      `${base()}/brackets/pdf?division=${divisions.get('Compound Women')!}`,
    );
    expect(none.status).toBe(404);
    expect(none.body.error.message).toMatch(/no bracket/);
    // Hostile forms of the same parameter: words, a number past any id, bytes that are not
    // UTF-8, and the parameter twice. Each is a 400 with the same sentence, never a 500.
    for (const query of ['abc', '99999999999999999999', '%FF%FE', '1&division=2', '-1', '1.5']) {
      const bad = await request(server.app).get(`${base()}/brackets/pdf?division=${query}`);
      expect(bad.status, query).toBe(400);
      expect(bad.body.error.message).toBe('division must be the number of one of the event’s divisions.');
    }
  });

  it('is for the event’s people only until the results are published', async () => {
    await request(server.app).patch(`${base()}/results-settings`).set(org()).send({ published: false });
    expect((await request(server.app).get(`${base()}/brackets/pdf`)).status).toBe(403);
    expect((await bracketPdf('', field.judge.auth)).status).toBe(200);
  });
});

describe('the bracket PDF of a large bracket', () => {
  /** An undecided bracket of `size` archers, as the API reads it. */
  const openBracket = (size: number): BracketDto => {
    const rounds = Math.log2(size);
    const matches: MatchDto[] = [];
    const side = (seed: number) => ({ seed, archers: [{ entryId: seed, name: `Archer ${seed}`, club: '' }] });
    for (let round = 0; round < rounds; round += 1)
      for (let slot = 0; slot < size / 2 ** (round + 1) + (round === rounds - 1 ? 1 : 0); slot += 1)
        matches.push({
          id: matches.length + 1,
          round,
          slot: round === rounds - 1 && slot === 1 ? 0 : slot,
          bronze: round === rounds - 1 && slot === 1,
          targetNumber: null,
          sides: round === 0 ? { a: side(slot + 1), b: side(size - slot) } : {},
          ends: [],
          shootOff: [],
          state: null,
          winner: null,
          decidedBy: null,
          signedAt: null,
        } as unknown as MatchDto);
    return {
      id: 1,
      divisionId: 1,
      divisionName: 'Recurve Women',
      sessionId: 1,
      format: 'sets',
      alternate: 'never',
      entrants: size,
      size,
      rounds,
      matches,
      places: [],
    };
  };
  const pages = async (size: number) => {
    const out = new PassThrough();
    const chunks: Buffer[] = [];
    out.on('data', (c: Buffer) => chunks.push(c));
    await bracketPdf([openBracket(size)], { name: 'Big Shoot', published: true }, out);
    await new Promise((resolve) => setImmediate(resolve));
    return pdfPageCount(Buffer.concat(chunks));
  };

  it('draws the last four rounds as a tree and lists the earlier ones, 16 matches a page, before it', async () => {
    expect(await pages(16)).toBe(1);
    // 1/16 round: 16 matches on one page, then the tree.
    expect(await pages(32)).toBe(2);
    // 1/32 round: 32 matches on two pages; 1/16 round: one; the tree.
    expect(await pages(64)).toBe(4);
  });
});
