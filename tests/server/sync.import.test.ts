import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { Mutation } from '../../src/contract/sync';
import type { CardView } from '../../src/contract/judging';
import type { WaitingChangesImport } from '../../src/contract/waitingChanges';
import {
  DEVICE_KEY_ALGORITHM,
  DEVICE_SIGN_ALGORITHM,
  waitingSigningInput,
} from '../../src/contract/waitingSigning';
import { startTestServer, type TestServer } from './support/testServer';
import { giveRole, makePerson } from './support/people';
import { expectRejected, setUpJudging, type JudgingField } from './support/judging';
import { Phone } from './support/phone';

/*
 * A phone that cannot sync saves its changes to a file; a judge of the event imports it. Only a
 * file signed by the phone's own key (registered for its client id by its person) counts as that
 * person's; anything else is the judge's transcription, labelled so, and never carries a
 * signature.
 */

let server: TestServer;
let j: JudgingField;
/** Writer 1's phone key, registered in the first test. */
let writer1Key: Awaited<ReturnType<typeof keyOf>>;
const SIX: ArrowValue[] = ['X', '10', '9', '9', '8', '7'];

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
});
afterAll(async () => {
  await server.close();
});

type Block = { clientId: string; userId: number; mutations: object[]; signature?: string };

/** A phone's own key, registered for its client id as its person; signs blocks as the pad does. */
async function keyOf(phone: Phone) {
  const keys = await crypto.subtle.generateKey(DEVICE_KEY_ALGORITHM, false, ['sign', 'verify']);
  const { kty, crv, x, y } = await crypto.subtle.exportKey('jwk', keys.publicKey);
  const res = await request(server.app)
    .post('/api/sync/device-key')
    .set(phone.person.auth)
    .send({ clientId: phone.clientId, publicJwk: { kty, crv, x, y } });
  expect(res.status, JSON.stringify(res.body)).toBe(204);
  return {
    publicJwk: { kty, crv, x, y },
    sign: async (block: Block): Promise<Block> => {
      const signature = await crypto.subtle.sign(
        DEVICE_SIGN_ALGORITHM,
        keys.privateKey,
        new TextEncoder().encode(waitingSigningInput(block)),
      );
      return { ...block, signature: Buffer.from(signature).toString('base64url') };
    },
  };
}

const blockOf = (phone: Phone, mutations: Mutation[]): Block => ({
  clientId: phone.clientId,
  userId: phone.person.id,
  mutations: mutations.map((m) => ({ ...m, status: 'pending' })),
});

async function importFile(...clients: Block[]): Promise<WaitingChangesImport> {
  const res = await request(server.app)
    .post(`/api/events/${j.field.eventId}/waiting-changes`)
    .set(j.field.judge.auth)
    .send({ format: 'ringcall-waiting-changes', version: 1, exportedAt: new Date().toISOString(), clients });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as WaitingChangesImport;
}

const end = (endIndex: number, slot: 1 | 2, entryId = j.ada.entryId) => ({
  sessionId: j.sessionId,
  entryId,
  endIndex,
  slot,
  arrows: SIX,
});

describe('importing a phone’s waiting changes', () => {
  it('a file signed by the phone’s registered key applies as its person, once, however often it is imported or the phone syncs later', async () => {
    const phone = j.phones.writer1;
    const key = (writer1Key = await keyOf(phone));
    const changes = [0, 1].map((endIndex) => phone.write(end(endIndex, 1)));
    const file = await key.sign(blockOf(phone, changes));

    const first = await importFile(file);
    expect(first.clients[0]).toMatchObject({ fromThePhone: true, applied: 2, duplicates: 0 });
    expect(first.clients[0]).not.toHaveProperty('transcribedBy');
    expect((await importFile(file)).clients[0]).toMatchObject({ applied: 0, duplicates: 2 });
    const pushed = await phone.push(changes);
    expect(pushed.results.map((r) => r.status)).toEqual(['duplicate', 'duplicate']);

    const rows = await server
      .db('end_entries')
      .where({ entry_id: j.ada.entryId, slot: 1 })
      .orderBy('end_index');
    expect(rows.map((r) => [r.revision, r.written_by])).toEqual([
      [1, j.people.writer1.id],
      [1, j.people.writer1.id],
    ]);
    const logged = await server.db('mutations').whereIn(
      'mutation_uuid',
      changes.map((c) => c.id),
    );
    expect(logged.map((m) => [m.client_id, m.transcribed_by])).toEqual([
      [phone.clientId, null],
      [phone.clientId, null],
    ]);
  });

  it('an unsigned file is the judge’s transcription: applied under the judge’s name, labelled, and the phone’s own changes still count later', async () => {
    const phone = j.phones.writer2;
    const forged = phone.write(end(0, 2));
    const result = await importFile(blockOf(phone, [forged]));
    expect(result.clients[0]).toMatchObject({
      fromThePhone: false,
      transcribedBy: 'Field Judge',
      applied: 1,
      results: [{ seq: forged.seq, id: forged.id, status: 'applied' }],
    });

    const logged = await server.db('mutations').where({ transcribed_by: j.field.judge.id });
    expect(logged).toHaveLength(1);
    expect(logged[0]).toMatchObject({ user_id: j.people.writer2.id, kind: 'end.write' });
    expect(logged[0].client_id).toMatch(/^transcribed\./);
    expect(logged[0].mutation_uuid).not.toBe(forged.id);
    // The phone's own numbering is untouched.
    expect(await server.db('sync_clients').where({ client_id: phone.clientId }).first()).toBeUndefined();

    // Labelled wherever shown: on the phones (pull) and on the card.
    const pulled = await phone.pull();
    const record = pulled.changes.find((c) => c.type === 'end' && c.record.slot === 2)!;
    expect(record.record).toMatchObject({ transcribedBy: 'Field Judge' });
    const card = (
      await request(server.app).get(`/api/cards/${j.sessionId}/${j.ada.entryId}`).set(j.field.judge.auth)
    ).body as CardView;
    expect(card.ends[0]).toMatchObject({ transcribedBy: 'Field Judge' });
    expect(card.ends[1]).not.toHaveProperty('transcribedBy');

    // The real phone later sends the change with that id and number: it counts as its own.
    const own = await phone.push([
      { ...forged, args: { ...forged.args, arrows: ['10', '10', '9', '9', '8', '7'] } } as Mutation,
    ]);
    expect(own.results[0]).toMatchObject({ status: 'applied' });
    const row = await server
      .db('end_entries')
      .where({ entry_id: j.ada.entryId, end_index: 0, slot: 2 })
      .first();
    expect(row).toMatchObject({ revision: 2, written_by: j.people.writer2.id });
    const after = (
      await request(server.app).get(`/api/cards/${j.sessionId}/${j.ada.entryId}`).set(j.field.judge.auth)
    ).body as CardView;
    expect(after.ends[0]).not.toHaveProperty('transcribedBy');
  });

  it('an unsigned file can never carry another person’s countersignature, signature or ruling', async () => {
    const otherJudge = await makePerson(server.db, 'Other Judge');
    await giveRole(server.db, j.field.eventId, otherJudge, 'judge');
    const judgePhone = new Phone(server.app, otherJudge);
    const ada = j.phones.ada;
    const where = { sessionId: j.sessionId, entryId: j.ada.entryId };
    const result = await importFile(
      blockOf(ada, [ada.signCard({ ...where, role: 'archer', total: 0 })]),
      blockOf(judgePhone, [
        judgePhone.sign({ ...where, endIndex: 1, arrows: SIX }),
        judgePhone.rule({ ...where, endIndex: 1, arrows: SIX, reason: 'Looked at the face' }),
      ]),
    );
    const [archer, judge] = result.clients;
    expectRejected(archer!.results[0]!, /A signature on a card counts only from its maker’s own phone/);
    expectRejected(
      judge!.results[0]!,
      /A judge’s signature on an end counts only from its maker’s own phone/,
    );
    expectRejected(judge!.results[1]!, /A ruling counts only from its maker’s own phone/);
    expect(await server.db('card_signatures')).toHaveLength(0);
    expect(await server.db('end_signatures')).toHaveLength(0);
    expect(await server.db('end_rulings')).toHaveLength(0);
  });

  it('a file with its person’s practice in it: signed, the practice is theirs; transcribed, it is refused with words', async () => {
    const phone = j.phones.caller;
    const key = await keyOf(phone);
    const session = {
      id: randomUUID(),
      startedAt: '2026-11-30T09:00:00.000Z',
      bowStyle: 'recurve' as const,
      venue: 'indoor' as const,
      distanceM: 18,
      faceId: 'full-40' as const,
      arrowsPerEnd: 3,
      plannedEnds: null,
      shaftDiameterMm: 5.5,
    };
    const signed = await importFile(
      await key.sign(blockOf(phone, [phone.practice({ kind: 'practice.session', args: session })])),
    );
    expect(signed.clients[0]).toMatchObject({ fromThePhone: true, applied: 1 });
    expect(await server.db('practice_sessions').where({ id: session.id }).first()).toMatchObject({
      user_id: j.people.caller.id,
    });

    const other = { ...session, id: randomUUID() };
    const transcribed = await importFile(
      blockOf(phone, [phone.practice({ kind: 'practice.session', args: other })]),
    );
    expectRejected(transcribed.clients[0]!.results[0]!, /Practice counts only from its archer’s own phone/);
    expect(await server.db('practice_sessions').where({ id: other.id })).toHaveLength(0);
  });

  it('a signed file changed after signing, or signed by another phone’s key, is not the phone’s', async () => {
    const phone = j.phones.writer1;
    const stranger = j.phones.stranger;
    const key = await keyOf(stranger);
    const signed = await writer1Key.sign(blockOf(phone, [phone.write(end(2, 1))]));
    const tampered = JSON.parse(JSON.stringify(signed)) as Block;
    (tampered.mutations[0] as { args: { arrows: string[] } }).args.arrows[0] = '10';
    // Signed with a key registered for another client id, by another person.
    const foreign = await key.sign(blockOf(phone, [phone.write(end(3, 1))]));
    const result = await importFile(tampered, foreign);
    for (const client of result.clients)
      expect(client).toMatchObject({ fromThePhone: false, transcribedBy: 'Field Judge', applied: 1 });
  });

  it('a phone’s key is registered only by its own person and never replaced', async () => {
    const phone = j.phones.writer1; // has pushed and registered a key above
    const key = await keyOf(new Phone(server.app, j.people.caller, phone.clientId + '-other'));
    const register = (as: { Authorization: string }, publicJwk: object) =>
      request(server.app).post('/api/sync/device-key').set(as).send({ clientId: phone.clientId, publicJwk });
    const stolen = await register(j.people.stranger.auth, key.publicJwk);
    expect(stolen.status).toBe(403);
    expect(stolen.body.error.message).toMatch(/belong to another account/);
    const replaced = await register(j.people.writer1.auth, key.publicJwk);
    expect(replaced.status).toBe(409);
    expect(replaced.body.error.message).toMatch(/cannot be replaced/);
    const held = await server.db('device_keys').where({ client_id: phone.clientId }).first();
    expect(held.user_id).toBe(j.people.writer1.id);
  });

  it('is for the event’s judges only', async () => {
    const phone = j.phones.writer1;
    const change = phone.write(end(0, 1, j.field.archer(1, 'B').entryId));
    const denied = await request(server.app)
      .post(`/api/events/${j.field.eventId}/waiting-changes`)
      .set(j.field.organizer.auth)
      .send({
        format: 'ringcall-waiting-changes',
        version: 1,
        exportedAt: new Date().toISOString(),
        clients: [blockOf(phone, [change])],
      });
    expect(denied.status).toBe(403);
    expect(denied.body.error.message).toMatch(/judge/);
    expect(await server.db('end_entries').where({ entry_id: j.field.archer(1, 'B').entryId })).toHaveLength(
      0,
    );
  });

  it('refuses a file that is not one, with a readable message, and stores nothing', async () => {
    const res = await request(server.app)
      .post(`/api/events/${j.field.eventId}/waiting-changes`)
      .set(j.field.judge.auth)
      .send({ format: 'something-else', version: 1, exportedAt: '', clients: [] });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/not a file of waiting changes/);
  });
});
