import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { readConfig } from '../../server/config';
import { openDb, migrate } from '../../server/db';
import { seedDemoIfEmpty } from '../../server/demo/seedDemo';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

describe('health and errors', () => {
  it('answers GET /api/health with ok and the version', async () => {
    const res = await request(server.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, version: 'test' });
  });

  it('answers an unknown API path with the JSON 404 shape', async () => {
    const res = await request(server.app).get('/api/nothing-here').set('Accept', 'text/html');
    expect(res.status).toBe(404);
    expect(res.type).toBe('application/json');
    expect(res.body.error.code).toBe('not_found');
    expect(res.body.error.message).toMatch(/\/api\/nothing-here/);
  });

  it('answers broken JSON with a readable 400', async () => {
    const res = await request(server.app)
      .post('/api/health')
      .set('Content-Type', 'application/json')
      .send('{"a":');
    expect(res.status).toBe(400);
    expect(res.body.error).toEqual({ code: 'bad_json', message: 'The request body is not valid JSON.' });
  });

  it('answers a huge body with 413 and a message', async () => {
    const big = JSON.stringify({ blob: 'x'.repeat(400 * 1024) });
    const res = await request(server.app)
      .post('/api/health')
      .set('Content-Type', 'application/json')
      .send(big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
  });

  it('sends security headers with a content security policy', async () => {
    const res = await request(server.app).get('/api/health');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['content-security-policy']).toContain("worker-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('serving the client', () => {
  it('falls back to index.html for client routes but never for /api', async () => {
    const clientDir = join(server.dir, 'client');
    mkdirSync(clientDir, { recursive: true });
    writeFileSync(join(clientDir, 'index.html'), '<!doctype html><title>shell</title>');
    const withClient = await startTestServer({ clientDir });
    try {
      const page = await request(withClient.app).get('/some/screen').set('Accept', 'text/html');
      expect(page.status).toBe(200);
      expect(page.text).toContain('<title>shell</title>');
      const api = await request(withClient.app).get('/api/some/thing').set('Accept', 'text/html');
      expect(api.status).toBe(404);
      expect(api.body.error.code).toBe('not_found');
    } finally {
      await withClient.close();
    }
  });
});

describe('database', () => {
  it('runs every migration on a fresh database with WAL and foreign keys on', async () => {
    const tables = ['users', 'events', 'event_roles', 'divisions', 'entries'];
    for (const table of tables) expect(await server.db.schema.hasTable(table)).toBe(true);
    const [journal] = await server.db.raw('PRAGMA journal_mode');
    expect(journal.journal_mode).toBe('wal');
    const [fk] = await server.db.raw('PRAGMA foreign_keys');
    expect(fk.foreign_keys).toBe(1);
  });

  it('refuses to roll back a migration (forward-only)', async () => {
    await expect(server.db.migrate.rollback()).rejects.toThrow();
  });

  it('seeds the demo once, and never into a database that holds accounts', async () => {
    const file = join(server.dir, 'seed.sqlite');
    const db = openDb(file);
    try {
      await migrate(db);
      expect(await seedDemoIfEmpty(db, server.signingKeys)).toBe(true);
      const users = Number((await db('users').count({ n: '*' }).first())!.n);
      expect(users).toBeGreaterThanOrEqual(36 + 3);
      const divisions = await db('divisions').select('bow_style');
      expect(new Set(divisions.map((d) => d.bow_style))).toEqual(new Set(['recurve', 'compound', 'barebow']));
      expect(await seedDemoIfEmpty(db, server.signingKeys)).toBe(false);
      expect(Number((await db('users').count({ n: '*' }).first())!.n)).toBe(users);
    } finally {
      await db.destroy();
    }
  });
});

describe('configuration', () => {
  it('works out of the box', () => {
    const config = readConfig({});
    expect(config.port).toBe(3000);
    expect(config.databaseFile).toMatch(/data\/ringcall\.sqlite$/);
    expect(config.demoSeed).toBe(true);
  });

  it('names a bad setting clearly', () => {
    expect(() => readConfig({ PORT: 'eighty' })).toThrow(/PORT/);
  });
});
