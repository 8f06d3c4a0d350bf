import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { Mutation, PushResponse } from '../../src/contract/sync';
import { COMPRESS_FROM_BYTES } from '../../server/http/compressAnswers';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson, type TestPerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';
import { Phone } from './support/phone';

/*
 * The field lane (server/routes/syncLane.ts): the push and the pull are answered before Express, with the JSON answer's own headers, compression only for large answers, the
 * person remembered with their token — and still every refusal a role or a group asks for.
 */

let server: TestServer;
let field: Field;
let writer: TestPerson;
let judge: TestPerson;

beforeAll(async () => {
  server = await startTestServer();
  field = await setUpMixedField(server.db);
  writer = await makePerson(server.db, 'Lana Lane');
  judge = await makePerson(server.db, 'Judd Lane');
  await new Phone(server.app, writer).join(field.targets.get(1)!.code, 'writer1');
  await server.db('event_roles').insert({
    event_id: field.eventId,
    user_id: judge.id,
    role: 'judge',
    created_at: new Date().toISOString(),
  });
});
afterAll(async () => {
  await server.close();
});

const write = (phone: Phone, endIndex: number, arrows: ArrowValue[]): Mutation =>
  phone.write({
    sessionId: field.sessionId,
    entryId: field.archer(1, 'A').entryId,
    endIndex,
    slot: 1,
    arrows,
  });

const push = (person: TestPerson, phone: Phone, mutations: Mutation[], cursor = 0) =>
  request(server.app)
    .post('/api/sync/push')
    .set(person.auth)
    .set('Accept-Encoding', 'gzip, deflate, br')
    .send({ clientId: phone.clientId, mutations, cursor });

describe('the field lane', () => {
  it('answers a push with the JSON answer’s headers, uncompressed when small, without an ETag', async () => {
    const phone = new Phone(server.app, writer);
    const res = await push(writer, phone, [write(phone, 0, ['X'])]);
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toBe("default-src 'none'; frame-ancestors 'none'");
    expect(res.headers['cross-origin-resource-policy']).toBe('same-origin');
    expect(res.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.headers.etag).toBeUndefined();
    expect((res.body as PushResponse).results[0]!.status).toBe('applied');
  });

  it('compresses a large pull for a phone that takes gzip, and sends it whole to one that does not', async () => {
    const phone = new Phone(server.app, writer);
    // Each push is its own commit, so each of its twelve ends is a change of its own.
    for (let round = 0; round < 10; round += 1) {
      const ends = Array.from({ length: 12 }, (_, i) => write(phone, i, ['X', '10', '9', '8', '7', '6']));
      expect((await phone.push(ends)).results.map((r) => r.status)).toEqual(Array(12).fill('applied'));
    }
    const zipped = await request(server.app)
      .get('/api/sync/pull?cursor=0&limit=2000')
      .set(judge.auth)
      .set('Accept-Encoding', 'gzip');
    expect(zipped.status).toBe(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.headers.vary).toBe('Accept-Encoding');
    const plain = await request(server.app)
      .get('/api/sync/pull?cursor=0&limit=2000')
      .set(judge.auth)
      .set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(Number(plain.headers['content-length'])).toBeGreaterThan(COMPRESS_FROM_BYTES);
    expect(zipped.body).toEqual(plain.body);
  });

  it('answers a body that is not JSON with a readable 400 and the lane’s headers', async () => {
    const res = await request(server.app)
      .post('/api/sync/push')
      .set(writer.auth)
      .set('Content-Type', 'application/json')
      .send('{"clientId": ');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe('The request body is not valid JSON.');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });

  it('stops showing an event’s changes to a remembered judge at once when the role is taken away', async () => {
    const judgePhone = new Phone(server.app, judge);
    const writerPhone = new Phone(server.app, writer);
    await push(writer, writerPhone, [write(writerPhone, 11, ['9'])]);
    // A judge's own end.write is refused (no writer's task), but its answer carries the pull.
    const judgeWrite = () => write(judgePhone, 0, ['1']);
    // The judge's token is remembered after the first request; the role is read on each push.
    const before = (await push(judge, judgePhone, [judgeWrite()])).body as PushResponse;
    expect(before.pull!.changes.length).toBeGreaterThan(0);
    await server.db('event_roles').where({ event_id: field.eventId, user_id: judge.id }).delete();
    const after = await request(server.app).get('/api/sync/pull?cursor=0').set(judge.auth);
    expect(after.status).toBe(200);
    expect(after.body.changes).toEqual([]);
    const pushed = (await push(judge, judgePhone, [judgeWrite()])).body as PushResponse;
    expect(pushed.pull!.changes).toEqual([]);
  });

  it('refuses a remembered writer’s change at once when they have left the target', async () => {
    const leaver = await makePerson(server.db, 'Lee Leaver');
    const phone = new Phone(server.app, leaver);
    await phone.join(field.targets.get(2)!.code, 'writer1');
    const change = (endIndex: number) =>
      phone.write({
        sessionId: field.sessionId,
        entryId: field.archer(2, 'A').entryId,
        endIndex,
        slot: 1,
        arrows: ['10'],
      });
    expect((await push(leaver, phone, [change(0)])).body.results[0].status).toBe('applied');
    const left = await request(server.app).post(`/api/targets/${field.sessionId}/2/leave`).set(leaver.auth);
    expect(left.status).toBe(204);
    const refused = (await push(leaver, phone, [change(1)])).body as PushResponse;
    expect(refused.results[0]).toMatchObject({ status: 'rejected' });
    expect(refused.pull!.changes).toEqual([]);
  });
});

/** Sends a push as raw bytes in pieces (chunked, no Content-Length) to the app on a real port. */
async function streamPush(
  person: TestPerson,
  pieces: string[],
  headers: Record<string, string> = {},
): Promise<{ status: number; body: { error?: { code: string; message: string } } & Partial<PushResponse> }> {
  const listener = http.createServer(server.app).listen(0, '127.0.0.1');
  await new Promise((resolve) => listener.once('listening', resolve));
  try {
    return await new Promise((resolve, reject) => {
      const req = http.request(
        {
          port: (listener.address() as AddressInfo).port,
          host: '127.0.0.1',
          method: 'POST',
          path: '/api/sync/push',
          headers: { 'Content-Type': 'application/json', ...person.auth, ...headers },
        },
        (res) => {
          let text = '';
          res.setEncoding('utf8');
          res.on('data', (chunk: string) => (text += chunk));
          res.on('end', () => resolve({ status: res.statusCode!, body: JSON.parse(text) }));
        },
      );
      // The server may answer (413) and close before every piece is written.
      req.on('error', reject);
      for (const piece of pieces) req.write(piece);
      req.end();
    });
  } finally {
    listener.closeAllConnections();
    await new Promise((resolve) => listener.close(resolve));
  }
}

/** A push of these bytes with these headers, by the writer. */
const rawPush = (headers: Record<string, string>, body: string | Buffer) =>
  request(server.app).post('/api/sync/push').set(writer.auth).set(headers).send(body);

describe('the field lane reads the body itself', () => {
  it('takes a body that arrives in pieces', async () => {
    const phone = new Phone(server.app, writer);
    const text = JSON.stringify({ clientId: phone.clientId, mutations: [write(phone, 2, ['10'])] });
    const res = await streamPush(writer, [text.slice(0, 10), text.slice(10, 50), text.slice(50)]);
    expect(res.status).toBe(200);
    expect(res.body.results![0]!.status).toBe('applied');
  });

  it('refuses with 413 a body that grows past 256 KB without saying its length, storing nothing', async () => {
    const phone = new Phone(server.app, writer);
    const before = await server.db('mutations').count({ n: '*' }).first();
    const change = write(phone, 3, ['9']);
    const head = `{"clientId":"${phone.clientId}","mutations":[${JSON.stringify(change)}],"pad":"`;
    const res = await streamPush(writer, [head, 'x'.repeat(200 * 1024), 'x'.repeat(100 * 1024), '"}']);
    expect(res.status).toBe(413);
    expect(res.body.error).toEqual({
      code: 'too_large',
      message: 'The request is too large. Send fewer items at once.',
    });
    expect(await server.db('mutations').count({ n: '*' }).first()).toEqual(before);
  });

  it('refuses a compressed body or another charset with a readable 415', async () => {
    const phone = new Phone(server.app, writer);
    const body = JSON.stringify({ clientId: phone.clientId, mutations: [write(phone, 4, ['9'])] });
    const zipped = await rawPush(
      { 'Content-Type': 'application/json', 'Content-Encoding': 'gzip' },
      gzipSync(body),
    );
    expect(zipped.status).toBe(415);
    expect(zipped.body.error.message).toBe('The request uses an encoding the server does not read.');
    const latin = await rawPush({ 'Content-Type': 'application/json; charset=iso-8859-1' }, body);
    expect(latin.status).toBe(415);
  });

  it('reads a body of another type as no body: a 400 that names what is missing', async () => {
    const res = await rawPush(
      { 'Content-Type': 'text/plain' },
      '{"clientId":"phone-text-plain","mutations":[]}',
    );
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/^The request was not accepted\. clientId: /);
  });

  it('refuses a JSON value that is not an object as not JSON, like the API’s parser', async () => {
    const res = await rawPush({ 'Content-Type': 'application/json' }, '"a string"');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_json');
  });

  it('answers the pull’s bad query with the contract’s words', async () => {
    const res = await request(server.app).get('/api/sync/pull?cursor=-1').set(writer.auth);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(
      /^The request was not accepted\. cursor: cursor must be a whole number/,
    );
  });

  it('leaves every other request to Express: another method on the push’s address is a 404', async () => {
    const res = await request(server.app).get('/api/sync/push').set(writer.auth);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    const key = await request(server.app).post('/api/sync/device-key').set(writer.auth).send({});
    expect(key.status).toBe(400);
  });

  it('answers a server failure with a 500 in words, logged, and not a word of the cause', async () => {
    const logged = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      const phone = new Phone(server.app, writer);
      await server.db.schema.renameTable('sync_clients', 'sync_clients_away');
      const res = await push(writer, phone, [write(phone, 5, ['8'])]);
      expect(res.status).toBe(500);
      expect(res.body.error.code).toBe('internal');
      expect(JSON.stringify(res.body)).not.toMatch(/sync_clients/);
      expect(logged).toHaveBeenCalledWith(
        expect.stringMatching(/^Unexpected error on POST \/api\/sync\/push/),
        expect.anything(),
      );
    } finally {
      await server.db.schema.renameTable('sync_clients_away', 'sync_clients');
      logged.mockRestore();
    }
  });
});
