import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { openDb, migrate } from '../../server/db';
import { loadAuthSecret } from '../../server/auth/secret';
import { loadSigningKeys } from '../../server/services/signing/serverKeys';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

describe('new passwords', () => {
  it.each([
    ['one repeated character', 'zzzzzzzzzzzz', /one repeated character/],
    ['the account’s own address', 'Hana.Reed@Example.org', /e-mail address/],
    ['the name part of the address', 'hana.reed', /e-mail address/],
    // 37 letters, 74 bytes in UTF-8: bcrypt would silently ignore the end.
    ['over 72 bytes', 'é'.repeat(37), /at most 72 bytes/],
  ])('refuses %s with a readable 400', async (_what, password, message) => {
    const res = await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email: 'hana.reed@example.org', password, displayName: 'Hana Reed' });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(message);
  });

  it('takes a password of exactly 72 bytes', async () => {
    const res = await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email: 'long.one@example.org', password: 'ab'.repeat(36), displayName: 'Long One' });
    expect(res.status).toBe(201);
  });
});

describe('files the server creates', () => {
  const dir = mkdtempSync(join(tmpdir(), 'ringcall-modes-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const mode = (path: string) => statSync(path).mode & 0o777;

  it('are readable by the server’s user only: data folder 0700, database, secret and key 0600', async () => {
    const data = join(dir, 'data');
    const db = openDb(join(data, 'db', 'ringcall.sqlite'));
    await migrate(db);
    await db.destroy();
    loadAuthSecret(join(data, 'secrets'));
    await loadSigningKeys(join(data, 'keys'));

    for (const folder of [join(data, 'db'), join(data, 'secrets'), join(data, 'keys')])
      expect(mode(folder)).toBe(0o700);
    for (const file of [
      join(data, 'db', 'ringcall.sqlite'),
      join(data, 'secrets', 'auth-secret'),
      join(data, 'keys', 'signing-key.json'),
    ])
      expect(mode(file), file).toBe(0o600);
  });
});
