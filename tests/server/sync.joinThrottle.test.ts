import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { makePerson } from './support/people';
import { setUpMixedField, type Field } from './support/fieldSetup';

/* Wrong join codes slow down the next try: a script cannot walk through the codes. */

let server: TestServer;
let field: Field;
beforeAll(async () => {
  server = await startTestServer();
  field = await setUpMixedField(server.db);
});
afterAll(async () => {
  await server.close();
});
afterEach(() => {
  vi.useRealTimers();
});

const join = (auth: { Authorization: string }, code: string) =>
  request(server.app).post('/api/join').set(auth).send({ code, task: 'follower' });

describe('join code guessing', () => {
  it('lets ten wrong codes pass, then makes each next try wait, and the right code works after the wait', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const guesser = await makePerson(server.db, 'Guesser');
    for (let i = 0; i < 10; i += 1)
      expect((await join(guesser.auth, `ZZZZZ${'ACDEFGHJKM'[i]}`)).status).toBe(404);
    const held = await join(guesser.auth, field.targets.get(1)!.code);
    expect(held.status).toBe(429);
    expect(held.headers['retry-after']).toBe('1');
    expect(held.body.error.message).toMatch(/Too many wrong join codes/);
    vi.setSystemTime(Date.now() + 1_000);
    expect((await join(guesser.auth, field.targets.get(1)!.code)).status).toBe(200);
  });

  it('stops a script: without waiting it gets ten guesses, and waiting as told costs more each time', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const script = await makePerson(server.db, 'Script');
    const guess = (i: number) =>
      join(script.auth, `QQ${'ACDEFGHJKMNPQRSTUVWXYZ2345679'[i % 29]}Q${i < 29 ? 'Q' : 'R'}Q`);
    const statuses = [];
    for (let i = 0; i < 40; i += 1) statuses.push((await guess(i)).status);
    expect(statuses.filter((s) => s === 404)).toHaveLength(10);
    expect(statuses.filter((s) => s === 429)).toHaveLength(30);

    const waits = [];
    for (let i = 40; i < 48; i += 1) {
      const held = await guess(i);
      expect(held.status).toBe(429);
      waits.push(Number(held.headers['retry-after']));
      vi.setSystemTime(Date.now() + waits.at(-1)! * 1000);
      expect((await guess(i)).status).toBe(404);
    }
    expect(waits).toEqual([1, 2, 4, 8, 16, 32, 64, 128]);
  });
});
