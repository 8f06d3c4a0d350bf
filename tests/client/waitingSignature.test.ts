import 'fake-indexeddb/auto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LocalDb } from '../../src/local/db';
import { exportWaiting, recordChange } from '../../src/local/outbox';
import { syncOnce, type SyncTransport } from '../../src/local/syncEngine';
import type { WaitingChangesImport } from '../../src/contract/waitingChanges';
import { startTestServer, type TestServer } from '../server/support/testServer';
import { setUpJudging, type JudgingField } from '../server/support/judging';
import type { TestPerson } from '../server/support/people';

/*
 * The pad's side of a signed file of waiting changes, against the real server: syncing registers
 * the phone's key (WebCrypto, as in the browser), the saved file is signed by it, and a judge's
 * import counts the changes as the writer's own; a byte changed in the file makes them the
 * judge's transcription.
 */

let server: TestServer;
let j: JudgingField;
const db = new LocalDb('waiting-signature-test');

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
});
afterAll(async () => {
  await db.delete();
  await server.close();
});

const transportAs = (person: TestPerson): SyncTransport => ({
  push: async (body) => (await request(server.app).post('/api/sync/push').set(person.auth).send(body)).body,
  pull: async (cursor) =>
    (await request(server.app).get('/api/sync/pull').query({ cursor }).set(person.auth)).body,
  registerKey: async (body) => {
    const res = await request(server.app).post('/api/sync/device-key').set(person.auth).send(body);
    return res.status === 204 ? 'registered' : 'refused';
  },
});

async function importFile(file: unknown): Promise<WaitingChangesImport> {
  const res = await request(server.app)
    .post(`/api/events/${j.field.eventId}/waiting-changes`)
    .set(j.field.judge.auth)
    .send(file as object);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as WaitingChangesImport;
}

describe('a saved file of waiting changes', () => {
  it('is signed by the phone’s key registered when it synced, and counts as the writer’s own', async () => {
    const writer = j.people.writer1;
    await syncOnce(db, writer.id, transportAs(writer));
    const keys = await server.db('device_keys').where({ user_id: writer.id });
    expect(keys).toHaveLength(1);
    const stored = (await db.meta.get(`deviceKey:${keys[0].client_id}`))?.value as CryptoKeyPair;
    expect(stored.privateKey.extractable).toBe(false);

    // Offline now: two ends wait on the phone, saved as a file for the judge.
    for (const endIndex of [0, 1])
      await recordChange(db, writer.id, {
        kind: 'end.write',
        args: {
          sessionId: j.sessionId,
          entryId: j.ada.entryId,
          endIndex,
          slot: 1,
          arrows: ['X', '10', '9', '9', '8', '7'],
          flags: [],
        },
      });
    const file = JSON.parse((await exportWaiting(db, writer.id)).json);
    expect(file.clients[0].signature).toMatch(/^[A-Za-z0-9_-]{86}$/);

    const tampered = structuredClone(file);
    tampered.clients[0].mutations[1].args.arrows[5] = '8';
    const forged = await importFile(tampered);
    expect(forged.clients[0]).toMatchObject({ fromThePhone: false, transcribedBy: 'Field Judge' });

    const genuine = await importFile(file);
    expect(genuine.clients[0]).toMatchObject({ fromThePhone: true, applied: 2 });
    const rows = await server
      .db('end_entries')
      .where({ entry_id: j.ada.entryId, slot: 1 })
      .orderBy('end_index');
    expect(rows.map((r) => r.arrows_json)).toEqual([
      '["X","10","9","9","8","7"]',
      '["X","10","9","9","8","7"]',
    ]);
  });

  it('a key registration that fails never holds back the changes, and is tried again next time', async () => {
    const writer = j.people.writer2;
    const other = new LocalDb('waiting-signature-test-2');
    let calls = 0;
    const failing: SyncTransport = {
      ...transportAs(writer),
      registerKey: async () => {
        calls += 1;
        throw new Error('the server is busy');
      },
    };
    await recordChange(other, writer.id, {
      kind: 'end.write',
      args: {
        sessionId: j.sessionId,
        entryId: j.ada.entryId,
        endIndex: 5,
        slot: 2,
        arrows: ['9'],
        flags: [],
      },
    });
    const report = await syncOnce(other, writer.id, failing);
    expect(report).toMatchObject({ pushed: 1, applied: 1 });
    await syncOnce(other, writer.id, failing);
    expect(calls).toBe(2);
    await other.delete();
  });
});
