import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CardView, VerifyResult } from '../../src/contract/judging';
import type { Mutation } from '../../src/contract/sync';
import { startTestServer, type TestServer } from './support/testServer';
import {
  agreeEnds,
  expectApplied,
  expectRejected,
  pushOne,
  setUpJudging,
  signEnds,
  twelveEnds,
  type JudgingField,
} from './support/judging';

/*
 * An archer with no account (no e-mail address) cannot countersign on a phone, so a judge records
 * the countersignature made on the paper card, with a photo of it. It goes through the outbox
 * like any judge's action and is labelled as made on paper in the card and in the signature.
 */

let server: TestServer;
let j: JudgingField;
let bo: { entryId: number; name: string };
let total: number;
let photoId: number;

const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==',
  'base64',
);

const cardAs = async (auth: { Authorization: string }): Promise<CardView> =>
  (await request(server.app).get(`/api/cards/${j.sessionId}/${bo.entryId}`).set(auth)).body as CardView;

const onPaper = (extra: Partial<{ role: 'archer' | 'scorer'; photoId: number }> = {}) => ({
  sessionId: j.sessionId,
  entryId: bo.entryId,
  role: extra.role ?? ('archer' as const),
  total,
  paper: { photoId: extra.photoId ?? photoId },
});

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
  const archer = j.field.archer(1, 'B');
  await server.db('entries').where({ id: archer.entryId }).update({ user_id: null, email: null });
  bo = {
    entryId: archer.entryId,
    name: (await server.db('entries').where({ id: archer.entryId }).first()).name,
  };
  await agreeEnds(j, bo.entryId, twelveEnds());
  expectApplied(await signEnds(server, j, bo.entryId, [...Array(12).keys()]));
  total = (await cardAs(j.field.judge.auth)).totals.total;
  const upload = await request(server.app)
    .post(`/api/events/${j.field.eventId}/photos`)
    .set(j.field.judge.auth)
    .attach('photo', PNG, { filename: 'paper-card.png', contentType: 'image/png' });
  expect(upload.status).toBe(201);
  photoId = upload.body.photoId;
});
afterAll(async () => {
  await server.close();
});

describe('a countersignature made on paper', () => {
  it('the card tells a judge (only) that it can be recorded, once every end is signed', async () => {
    expect((await cardAs(j.field.judge.auth)).canRecordPaperCountersign).toBe(true);
    expect((await cardAs(j.field.organizer.auth)).canRecordPaperCountersign).toBe(false);
    expect((await cardAs(j.people.writer1.auth)).canRecordPaperCountersign).toBe(false);
    // The judge desk lists the cards waiting for it.
    const cards = await request(server.app)
      .get(`/api/events/${j.field.eventId}/sessions/${j.sessionId}/cards`)
      .set(j.field.judge.auth);
    const waiting = cards.body.cards.filter(
      (c: { needsPaperCountersign: boolean }) => c.needsPaperCountersign,
    );
    expect(waiting.map((c: { entryId: number }) => c.entryId)).toEqual([bo.entryId]);
  });

  it('is refused to anyone but a judge, for an archer with an account, for the scorer and without a photo of the event', async () => {
    const attempt = (phone: (typeof j.phones)[keyof typeof j.phones], args: object) =>
      pushOne(phone, phone.signCard(args as Parameters<typeof phone.signCard>[0]));
    expectRejected(await attempt(j.phones.writer1, onPaper()), /Only a judge of the event can record/);
    expectRejected(
      await attempt(j.phones.judge, { ...onPaper(), entryId: j.ada.entryId }),
      /Ada Fletcher has an account and countersigns on their own phone/,
    );
    expectRejected(
      await attempt(j.phones.judge, onPaper({ role: 'scorer' })),
      /Only the archer’s countersignature can be recorded from paper/,
    );
    expectRejected(
      await attempt(j.phones.judge, onPaper({ photoId: photoId + 1000 })),
      /not one of this event’s photos/,
    );
    expect(await server.db('card_signatures')).toHaveLength(0);
  });

  it('a judge records it; the card and the signature say it was made on paper and who recorded it', async () => {
    const mutation: Mutation = j.phones.judge.signCard(onPaper());
    expectApplied([await pushOne(j.phones.judge, mutation)]);
    expectApplied([
      await pushOne(
        j.phones.writer2,
        j.phones.writer2.signCard({ sessionId: j.sessionId, entryId: bo.entryId, role: 'scorer', total }),
      ),
    ]);

    const card = await cardAs(j.field.judge.auth);
    expect(card).toMatchObject({ state: 'final', canRecordPaperCountersign: false });
    const archer = card.signatures.find((s) => s.role === 'archer')!;
    expect(archer).toMatchObject({
      name: bo.name,
      onPaper: 'countersigned on paper, recorded by judge Field Judge',
    });
    const row = await server.db('card_signatures').where({ entry_id: bo.entryId, role: 'archer' }).first();
    expect(row).toMatchObject({ user_id: j.field.judge.id, photo_id: photoId });
    const photo = await server.db('photos').where({ id: photoId }).first();
    expect(JSON.parse(row.content_json)).toMatchObject({
      countersigned: 'countersigned on paper, recorded by judge Field Judge',
      paperPhotoSha256: photo.sha256,
    });

    const claim = JSON.parse(Buffer.from(archer.jws.split('.')[1]!, 'base64url').toString());
    expect(claim).toMatchObject({ countersigned: 'countersigned on paper, recorded by judge Field Judge' });
    const verified = (await request(server.app).get('/api/verify').query({ sig: archer.jws }))
      .body as VerifyResult;
    expect(verified).toMatchObject({
      signatureValid: true,
      unchanged: true,
      countersigned: 'countersigned on paper, recorded by judge Field Judge',
    });
    if (verified.signatureValid)
      expect(verified.signers).toContainEqual({
        name: bo.name,
        role: 'archer, countersigned on paper, recorded by judge Field Judge',
      });

    // Phones pull it with its label.
    const pulled = await j.phones.writer1.pull();
    const change = pulled.changes.find((c) => c.type === 'card-signature' && c.record.role === 'archer');
    expect(change?.record).toMatchObject({ name: bo.name, onPaper: expect.stringMatching(/on paper/) });
  });
});
