import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { CardView, JudgeDeskItem, PhotoUploadResult } from '../../src/contract/judging';
import { startTestServer, type TestServer } from './support/testServer';
import {
  expectApplied,
  expectRejected,
  pushOne,
  setUpJudging,
  writeBoth,
  type JudgingField,
} from './support/judging';

/*
 * The judge desk (what waits for a judge, oldest first), the card view with who may sign it,
 * and photos of targets: images only, size-limited, stored by hash outside the web root and
 * served only to the event's judges and organizers.
 */

let server: TestServer;
let j: JudgingField;
beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
});
afterAll(async () => {
  await server.close();
});

const SIX: ArrowValue[] = ['X', '10', '9', '9', '8', '7'];
const desk = async (query = '', person = j.field.judge) => {
  const res = await request(server.app)
    .get(`/api/events/${j.field.eventId}/sessions/${j.sessionId}/judge-desk${query}`)
    .set(person.auth);
  return res;
};

/** The smallest PNG there is (1 × 1), and a JPEG and WebP header, for the magic-byte checks. */
const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==',
  'base64',
);
const JPEG = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(200, 1)]);
const WEBP = Buffer.concat([
  Buffer.from('RIFF'),
  Buffer.from([0, 0, 0, 0]),
  Buffer.from('WEBPVP8 '),
  Buffer.alloc(50),
]);

describe('the judge desk', () => {
  it('lists disputes, incidents, unsettled mismatches and ends waiting for a signature, oldest first', async () => {
    const bea = j.field.archer(1, 'B').entryId;
    const cora = j.field.archer(1, 'C').entryId;
    await writeBoth(j, bea, 0, SIX); // to sign
    await writeBoth(j, bea, 1, SIX, ['X', '9', '9', '9', '8', '7']); // mismatch
    await writeBoth(j, bea, 2, SIX, ['X', '10', '8', '9', '8', '7']);
    expectApplied([
      await pushOne(
        j.phones.caller,
        j.phones.caller.settle({
          sessionId: j.sessionId,
          entryId: bea,
          endIndex: 2,
          arrows: SIX,
          basis: { first: 1, second: 1 },
          disputed: [2],
        }),
      ),
    ]); // dispute
    await writeBoth(j, cora, 0, SIX, SIX, { first: [{ index: 5, flag: 'pass-through' }] }); // incident
    await writeBoth(j, cora, 1, ['X', '10', '9']); // partial: not yet anything
    const res = await desk();
    expect(res.status).toBe(200);
    const items = res.body as JudgeDeskItem[];
    expect(items.map((i) => [i.kind, i.entryId, i.endIndex])).toEqual([
      ['to-sign', bea, 0],
      ['mismatch', bea, 1],
      ['dispute', bea, 2],
      ['incident', cora, 0],
    ]);
    expect(items.map((i) => i.since)).toEqual([...items.map((i) => i.since)].sort());
    expect(items[0]).toMatchObject({ targetNumber: 1, position: 'B', archerName: 'Bea Quill', arrows: SIX });
    expect(items[0]!.detail).toBe('Agreed by the writers: X 10 9 9 8 7 (53).');
    expect(items[1]).toMatchObject({
      positions: [1],
      detail: expect.stringMatching(/differ at arrow 2; nobody/),
    });
    expect(items[2]).toMatchObject({
      positions: [2],
      detail: expect.stringMatching(/sent arrow 3 to a judge/),
    });
    expect(items[3]).toMatchObject({ positions: [5], detail: 'A pass-through on arrow 6.' });

    // A signed end leaves the desk; the filter by target works; a bad filter is refused.
    expectApplied([
      await pushOne(
        j.phones.judge,
        j.phones.judge.sign({ sessionId: j.sessionId, entryId: bea, endIndex: 0, arrows: SIX }),
      ),
    ]);
    expect(((await desk()).body as JudgeDeskItem[]).some((i) => i.kind === 'to-sign')).toBe(false);
    expect((await desk('?target=2')).body).toEqual([]);
    expect(((await desk('?target=1')).body as JudgeDeskItem[]).length).toBe(3);
    for (const bad of ['?target=0', '?target=abc', '?target=501', '?target=1&target=2']) {
      const refused = await desk(bad);
      expect(refused.status, bad).toBe(400);
      expect(refused.body.error.message).toMatch(/target must be a target number/);
    }
  });
});

describe('the card view', () => {
  it('shows the archer their card and running totals; writers, judges and organizers see it too; others do not', async () => {
    await writeBoth(j, j.ada.entryId, 0, SIX);
    await writeBoth(j, j.ada.entryId, 1, ['10', '10', '9', '8', '8', '6']);
    const res = await request(server.app)
      .get(`/api/cards/${j.sessionId}/${j.ada.entryId}`)
      .set(j.people.ada.auth);
    expect(res.status).toBe(200);
    const card = res.body as CardView;
    expect(card).toMatchObject({
      archer: { name: 'Ada Fletcher', targetNumber: 1, position: 'A', division: 'Recurve Women' },
      round: { id: '70m', maxScore: 720 },
      totals: { total: 104, tens: 4, xs: 1, hits: 12 },
      signedEnds: 0,
      totalEnds: 12,
      state: 'running',
      final: false,
      canCountersign: null,
    });
    expect(card.ends[1]).toMatchObject({ state: 'agreed', total: 51, runningTotal: 104 });
    expect(card.ends[2]).toMatchObject({ state: 'open', arrows: null, total: null });
    expect(card.countersignNote).toMatch(/still has to sign 12 of the 12 ends/);
    for (const person of [j.people.writer1, j.people.caller, j.field.judge, j.field.organizer]) {
      const seen = await request(server.app)
        .get(`/api/cards/${j.sessionId}/${j.ada.entryId}`)
        .set(person.auth);
      expect(seen.status).toBe(200);
    }
    const refused = await request(server.app)
      .get(`/api/cards/${j.sessionId}/${j.ada.entryId}`)
      .set(j.people.stranger.auth);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/^Only Ada Fletcher, the group of target 1/);
    const none = await request(server.app).get(`/api/cards/${j.sessionId}/999999`).set(j.people.ada.auth);
    expect(none.status).toBe(404);
    expect(none.body.error.message).toBe('That archer has no card in this session.');
  });
});

describe('photos', () => {
  const upload = (person = j.field.judge, bytes: Buffer = PNG, name = 'target.png') =>
    request(server.app)
      .post(`/api/events/${j.field.eventId}/photos`)
      .set(person.auth)
      .attach('photo', bytes, { filename: name, contentType: 'image/png' });

  it('keeps an image by its hash, once, and serves it to judges and organizers, and to those its ruling is shown to', async () => {
    const res = await upload();
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const { photoId, sha256 } = res.body as PhotoUploadResult;
    expect(sha256).toMatch(/^[0-9a-f]{64}$/);
    const again = await upload(j.field.organizer);
    expect(again.status).toBe(200);
    expect(again.body).toEqual({ photoId, sha256 });
    const row = await server.db('photos').where({ id: photoId }).first();
    expect(row).toMatchObject({
      mime_type: 'image/png',
      stored_name: `${sha256}.png`,
      size_bytes: PNG.length,
    });

    for (const person of [j.field.judge, j.field.organizer]) {
      const served = await request(server.app)
        .get(`/api/photos/${photoId}`)
        .set(person.auth)
        .buffer(true)
        .parse((r, done) => {
          const chunks: Buffer[] = [];
          r.on('data', (c: Buffer) => chunks.push(c));
          r.on('end', () => done(null, Buffer.concat(chunks)));
        });
      expect(served.status).toBe(200);
      expect(served.headers['content-type']).toBe('image/png');
      expect(served.headers['cache-control']).toBe('private, no-store');
      expect(served.headers['x-content-type-options']).toBe('nosniff');
      expect(Buffer.compare(served.body as Buffer, PNG)).toBe(0);
    }
    for (const person of [j.people.ada, j.people.writer1, j.people.stranger]) {
      const refused = await request(server.app).get(`/api/photos/${photoId}`).set(person.auth);
      expect(refused.status).toBe(403);
      expect(refused.body.error.message).toMatch(/^Only the event's judges and organizers/);
    }
    expect((await request(server.app).get(`/api/photos/${photoId}`)).status).toBe(401);
    // Not reachable as a file of the web app either.
    expect((await request(server.app).get(`/photos/${sha256}.png`)).status).toBe(404);

    // A ruling may name the photo.
    await writeBoth(j, j.ada.entryId, 5, SIX, ['X', '10', '9', '9', '8', '6']);
    expectApplied([
      await pushOne(
        j.phones.judge,
        j.phones.judge.rule({
          sessionId: j.sessionId,
          entryId: j.ada.entryId,
          endIndex: 5,
          arrows: SIX,
          reason: 'Photo shows arrow 6 touching the line',
          photoId,
        }),
      ),
    ]);
    expect(await server.db('end_rulings').where({ photo_id: photoId })).toHaveLength(1);
    // Once a ruling shows it, the ruled archer's target group and the archer see it; others still do not.
    for (const person of [j.people.writer1, j.people.caller, j.people.ada])
      expect((await request(server.app).get(`/api/photos/${photoId}`).set(person.auth)).status).toBe(200);
    expect((await request(server.app).get(`/api/photos/${photoId}`).set(j.people.stranger.auth)).status).toBe(
      403,
    );
    // The card shows the ruling: who, when, why, the photo, and the two cards it decided between.
    const card = (
      await request(server.app).get(`/api/cards/${j.sessionId}/${j.ada.entryId}`).set(j.people.ada.auth)
    ).body as CardView;
    expect(card.ends[5]!.rulings).toEqual([
      {
        judgedByName: expect.any(String),
        judgedAt: expect.any(String),
        reason: 'Photo shows arrow 6 touching the line',
        photoId,
        arrows: SIX,
        before: { by: 'cards', first: SIX, second: ['X', '10', '9', '9', '8', '6'] },
      },
    ]);
    expect(card.ends[5]!.rulings[0]!.judgedByName).not.toBe('');
    expect(card.ends[4]!.rulings).toEqual([]);
    expectRejected(
      await pushOne(
        j.phones.judge,
        j.phones.judge.rule({
          sessionId: j.sessionId,
          entryId: j.ada.entryId,
          endIndex: 5,
          arrows: SIX,
          reason: 'No such photo',
          photoId: 424242,
        }),
      ),
      /not one of this event's photos/,
    );
  });

  it('accepts JPEG and WebP by their first bytes; refuses other files, big files and other roles', async () => {
    expect((await upload(j.field.judge, JPEG, 'a.jpg')).body).toHaveProperty('photoId');
    expect((await upload(j.field.judge, WEBP, 'a.webp')).body).toHaveProperty('photoId');
    const kinds = await server.db('photos').pluck('mime_type');
    expect(new Set(kinds)).toEqual(new Set(['image/png', 'image/jpeg', 'image/webp']));

    const html = await upload(j.field.judge, Buffer.from('<html><script>alert(1)</script></html>'), 'x.png');
    expect(html.status).toBe(415);
    expect(html.body.error.message).toMatch(/not a photo Ringcall can keep.*JPEG, PNG or WebP/);
    const big = await upload(j.field.judge, Buffer.concat([PNG, Buffer.alloc(5 * 1024 * 1024)]), 'big.png');
    expect(big.status).toBe(413);
    expect(big.body.error.message).toMatch(/larger than 5 MB/);
    for (const person of [j.people.ada, j.people.writer1, j.people.stranger]) {
      const refused = await upload(person);
      expect(refused.status).toBe(403);
      expect(refused.body.error.message).toMatch(/Only an event organizer or judge/);
    }
    const none = await request(server.app)
      .post(`/api/events/${j.field.eventId}/photos`)
      .set(j.field.judge.auth)
      .field('note', 'no file');
    expect(none.status).toBe(400);
    expect(none.body.error.message).toBe('Choose a photo to upload.');
    const json = await request(server.app)
      .post(`/api/events/${j.field.eventId}/photos`)
      .set(j.field.judge.auth)
      .send({ photo: 'data' });
    expect(json.status).toBe(400);
    expect(json.body.error.message).toMatch(/form upload in the field "photo"/);
    const wrongField = await request(server.app)
      .post(`/api/events/${j.field.eventId}/photos`)
      .set(j.field.judge.auth)
      .attach('picture', PNG, 'target.png');
    expect(wrongField.status).toBe(400);
    expect(wrongField.body.error.message).toMatch(/exactly one photo in the field "photo"/);
  });
});
