import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson, giveRole } from './support/people';
import { addArchers, binary, setUpEvent, type SetUpEvent } from './support/eventSetup';

let server: TestServer;
let setup: SetUpEvent;
beforeAll(async () => {
  server = await startTestServer();
  setup = await setUpEvent(server.app, server.db, [
    { bowStyle: 'recurve', className: 'Women' },
    { bowStyle: 'compound', className: 'Men' },
  ]);
  await addArchers(setup, 'Recurve Women', 1, 'Existing');
});
afterAll(async () => {
  await server.close();
});

const upload = (
  path: 'import' | 'import/preview',
  csv: string | Buffer,
  filename = 'entries.csv',
  contentType = 'text/csv',
) =>
  request(server.app)
    .post(`/api/events/${setup.eventId}/entries/${path}`)
    .set(setup.organizer.auth)
    .attach('file', Buffer.isBuffer(csv) ? csv : Buffer.from(csv), { filename, contentType });

const entryCount = async () =>
  Number((await server.db('entries').where({ event_id: setup.eventId }).count({ n: '*' }).first())!.n);

const clean = [
  'name,club,email,division',
  'Saoirse Quill,Riverside,saoirse@example.org,Recurve Women',
  'Bram Oakes,,bram@example.org,compound men',
].join('\n');

describe('CSV template', () => {
  it('downloads the column names and two invented example rows in the event’s divisions', async () => {
    const res = await request(server.app)
      .get(`/api/events/${setup.eventId}/entries/template.csv`)
      .set(setup.organizer.auth)
      .buffer(true)
      .parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename=".*\.csv"/);
    const lines = (res.body as Buffer).toString('utf8').trim().split('\r\n');
    expect(lines[0]).toBe('name,club,email,division,class');
    expect(lines).toHaveLength(3);
    const divisions = (await server
      .db('divisions')
      .where({ event_id: setup.eventId })
      .orderBy('id')
      .pluck('name')) as string[];
    expect(lines[1]).toBe(`Example Archer One,Example Bowmen,archer.one@example.org,${divisions[0]},`);
    expect(lines[2]!.split(',')[0]).toBe('Example Archer Two');
  });
});

describe('CSV preview', () => {
  it('lists every row with every problem and stores nothing', async () => {
    const csv = [
      'name,club,email,division',
      'Saoirse Quill,Riverside,saoirse@example.org,Recurve Women', // row 2: fine
      ',Riverside,,Recurve Women', // row 3: no name
      'Tomasz Reed,,tomasz-at-example,Recurve Women', // row 4: bad e-mail
      'Ivo Brandt,,,Longbow Gents', // row 5: unknown division
      'saoirse quill,Other club,,recurve women', // row 6: same archer as row 2
      'Existing archer 1,,,Recurve Women', // row 7: already entered
      'Nadia Pell,,,', // row 8: no division
    ].join('\r\n');
    const before = await entryCount();
    const res = await upload('import/preview', csv);
    expect(res.status).toBe(200);
    expect(res.body.readyCount).toBe(1);
    expect(res.body.problemCount).toBe(6);
    const problems = Object.fromEntries(
      res.body.rows.map((r: { row: number; problems: string[] }) => [r.row, r.problems.join(' ')]),
    );
    expect(problems[2]).toBe('');
    expect(problems[3]).toMatch(/name is missing/);
    expect(problems[4]).toMatch(/"tomasz-at-example" is not an e-mail address/);
    expect(problems[5]).toMatch(/no division "Longbow Gents".*Recurve Women, Compound Men/);
    expect(problems[6]).toMatch(/same archer is on row 2/);
    expect(problems[7]).toMatch(/Existing archer 1 is already entered in Recurve Women/);
    expect(problems[8]).toMatch(/division is missing/);
    expect(await entryCount()).toBe(before);
  });

  it('reads semicolon files, a byte-order mark, header spellings, blank lines and Windows-1252 text', async () => {
    const text = '\uFEFFName;Club;E-mail;Division\r\n\r\nZoë Ashby;;;Recurve Women\r\n';
    const utf8 = await upload('import/preview', text);
    expect(utf8.status).toBe(200);
    expect(utf8.body.rows).toEqual([
      {
        row: 3,
        name: 'Zoë Ashby',
        club: '',
        email: '',
        division: 'Recurve Women',
        className: '',
        problems: [],
      },
    ]);
    const latin1 = await upload(
      'import/preview',
      Buffer.from('name,division\nZo\xeb Ashby,Recurve Women\n', 'latin1'),
    );
    expect(latin1.body.rows[0].name).toBe('Zoë Ashby');
  });

  it('refuses a file without the needed columns, an empty file, a non-CSV file and a missing file', async () => {
    const columns = await upload('import/preview', 'archer_name,bow\nA,B\n');
    expect(columns.status).toBe(400);
    expect(columns.body.error.message).toMatch(/no "name" or "division" column/);
    const empty = await upload('import/preview', '');
    expect(empty.status).toBe(400);
    expect(empty.body.error.message).toMatch(/file is empty/);
    const headerOnly = await upload('import/preview', 'name,club,email,division\n');
    expect(headerOnly.status).toBe(400);
    expect(headerOnly.body.error.message).toMatch(/no archers/);
    const pdf = await upload('import/preview', '%PDF-1.4', 'entries.pdf', 'application/pdf');
    expect(pdf.status).toBe(415);
    expect(pdf.body.error.message).toMatch(/Upload a CSV file/);
    const none = await request(server.app)
      .post(`/api/events/${setup.eventId}/entries/import/preview`)
      .set(setup.organizer.auth)
      .field('note', 'x');
    expect(none.status).toBe(400);
    expect(none.body.error.message).toMatch(/Choose a CSV file/);
    const json = await request(server.app)
      .post(`/api/events/${setup.eventId}/entries/import/preview`)
      .set(setup.organizer.auth)
      .send({ file: 'x' });
    expect(json.status).toBe(400);
  });

  it('refuses a file over the size limit with 413', async () => {
    const big = `name,division\n${'A very long name indeed,Recurve Women\n'.repeat(20000)}`;
    const res = await upload('import/preview', big);
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/larger than 512 KB/);
  });
});

const importRows = (body: object, auth = setup.organizer.auth) =>
  request(server.app).post(`/api/events/${setup.eventId}/entries/import`).set(auth).send(body);

type Row = { row: number; name: string; club: string; email: string; division: string };
const cleanRows: Row[] = [
  {
    row: 2,
    name: 'Saoirse Quill',
    club: 'Riverside',
    email: 'saoirse@example.org',
    division: 'Recurve Women',
  },
  { row: 3, name: 'Bram  Oakes', club: '', email: 'Bram@Example.org', division: 'compound men' },
];

describe('CSV import of the corrected rows', () => {
  it('checks every row it receives again: one bad row and nothing is stored, with the problems named', async () => {
    const before = await entryCount();
    const res = await importRows({
      rows: [...cleanRows, { row: 4, name: 'No Division Person', club: '', email: '', division: '' }],
    });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/Nothing was imported: 1 row has a problem/);
    expect(res.body.error.fields).toEqual([
      { path: 'row 4', message: expect.stringMatching(/division is missing/) },
    ]);
    const badMail = await importRows({
      rows: [
        { row: 5, name: 'Tomasz Reed', club: '', email: 'tomasz-at-example', division: 'Recurve Women' },
      ],
    });
    expect(badMail.status).toBe(422);
    expect(badMail.body.error.fields[0].message).toMatch(/"tomasz-at-example" is not an e-mail address/);
    expect(await entryCount()).toBe(before);
  });

  it('refuses a body that is not a list of rows, an empty list and a file upload', async () => {
    const notRows = await importRows({ rows: 'all of them' });
    expect(notRows.status).toBe(400);
    expect(notRows.body.error.message).toMatch(/rows/);
    const empty = await importRows({ rows: [] });
    expect(empty.status).toBe(400);
    expect(empty.body.error.message).toMatch(/keep at least one/);
    const file = await upload('import', clean);
    expect(file.status).toBe(400);
  });

  it('is for organizers only', async () => {
    const judgePerson = await makePerson(server.db, 'Jude Judge');
    await giveRole(server.db, setup.eventId, judgePerson, 'judge');
    const judge = await importRows({ rows: cleanRows }, judgePerson.auth);
    expect(judge.status).toBe(403);
    const stranger = await request(server.app)
      .post(`/api/events/${setup.eventId}/entries/import`)
      .send({ rows: cleanRows });
    expect(stranger.status).toBe(401);
  });

  it('imports the rows as corrected (a fixed division, a dropped row left out) and audits it; the same rows again are refused as duplicates', async () => {
    // The file had a bad division on row 3 and a bad row 4; the organizer fixed row 3 and dropped row 4.
    const preview = await upload(
      'import/preview',
      `${clean}\nUnwanted Row,,,Nowhere\n`.replace('compound men', 'Longbow'),
    );
    expect(preview.body.problemCount).toBe(2);
    const before = await entryCount();
    const res = await importRows({ rows: cleanRows });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ imported: 2 });
    expect(await entryCount()).toBe(before + 2);
    const bram = await server.db('entries').where({ event_id: setup.eventId, name: 'Bram Oakes' }).first();
    expect(bram.email).toBe('bram@example.org');
    expect(
      await server.db('entries').where({ event_id: setup.eventId, name: 'Unwanted Row' }).first(),
    ).toBeUndefined();
    expect(
      await server.db('audit_log').where({ event_id: setup.eventId, action: 'entries.imported' }).first(),
    ).toBeTruthy();
    const again = await importRows({ rows: cleanRows });
    expect(again.status).toBe(422);
    expect(again.body.error.fields).toHaveLength(2);
    expect(await entryCount()).toBe(before + 2);
  });
});
