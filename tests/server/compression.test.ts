import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import request from 'supertest';
import express from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';
import { precompressDir } from '../../scripts/precompress';
import { compressAnswers } from '../../server/http/compressAnswers';

/** The test client decodes what it receives (br, gzip), so a body is checked as the browser reads it. */
const get = (app: express.Express, path: string, encodings: string) =>
  request(app).get(path).set('Accept', 'text/html').set('Accept-Encoding', encodings);
const wireBytes = (res: request.Response) => Number(res.headers['content-length']);

const script = `export const pad = ${JSON.stringify('arrow '.repeat(2000))};\n`;
const shell = `<!doctype html><title>shell</title><p>${'The scorecard. '.repeat(100)}</p>`;

let server: TestServer;
let withClient: TestServer;
beforeAll(async () => {
  server = await startTestServer();
  const clientDir = join(server.dir, 'client');
  mkdirSync(join(clientDir, 'assets'), { recursive: true });
  writeFileSync(join(clientDir, 'index.html'), shell);
  writeFileSync(join(clientDir, 'sw.js'), `self.version = ${JSON.stringify('v'.repeat(2000))};`);
  writeFileSync(join(clientDir, 'assets', 'pad-abc123.js'), script);
  writeFileSync(join(clientDir, 'assets', 'tiny-abc123.js'), 'export {};');
  await precompressDir(clientDir);
  withClient = await startTestServer({ clientDir });
});
afterAll(async () => {
  await withClient.close();
  await server.close();
});

describe('client files on the wire', () => {
  it('sends a hashed script as its brotli copy, cached for a year', async () => {
    const res = await get(withClient.app, '/assets/pad-abc123.js', 'gzip, deflate, br');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['vary']).toMatch(/Accept-Encoding/);
    expect(res.headers['content-type']).toMatch(/^(text|application)\/javascript/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(wireBytes(res)).toBeLessThan(script.length / 10);
    expect(res.text).toBe(script);
  });

  it('sends the gzip copy to a browser without brotli, and the file itself to one without either', async () => {
    const gz = await get(withClient.app, '/assets/pad-abc123.js', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(wireBytes(gz)).toBeLessThan(script.length / 10);
    expect(gz.text).toBe(script);
    const plain = await get(withClient.app, '/assets/pad-abc123.js', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(wireBytes(plain)).toBe(Buffer.byteLength(script));
  });

  it('keeps the shell and the service worker revalidated, compressed too', async () => {
    for (const path of ['/index.html', '/pad/3', '/sw.js']) {
      const res = await get(withClient.app, path, 'br');
      expect(res.status, path).toBe(200);
      expect(res.headers['cache-control'], path).toBe('no-cache');
      expect(res.headers['content-encoding'], path).toBe('br');
      expect(res.headers['vary'], path).toMatch(/Accept-Encoding/);
    }
    expect((await get(withClient.app, '/pad/3', 'br')).text).toBe(shell);
  });

  it('writes no compressed copy of a file too small to gain from one', async () => {
    const res = await get(withClient.app, '/assets/tiny-abc123.js', 'br, gzip');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.text).toBe('export {};');
  });
});

describe('API answers on the wire', () => {
  it('compresses a large JSON answer of the real API and keeps it no-store', async () => {
    const res = await get(server.app, `/api/${'x'.repeat(1500)}`, 'br');
    expect(res.status).toBe(404);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.body.error.code).toBe('not_found');
  });

  it('leaves a small JSON answer as it is (the compressed copy would not be smaller)', async () => {
    const res = await get(server.app, '/api/health', 'br, gzip');
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.body.ok).toBe(true);
  });

  it('never compresses a server-sent event stream, nor a body that is compressed already', async () => {
    const app = express();
    app.use(compressAnswers);
    app.get('/events', (_req, res) => {
      res.setHeader('Content-Type', 'text/event-stream');
      res.end(`data: ${'x'.repeat(4000)}\n\n`);
    });
    const packedJson = JSON.stringify({ rows: 'already packed '.repeat(200) });
    app.get('/packed', (_req, res) => {
      res.setHeader('Content-Type', 'application/json');
      res.setHeader('Content-Encoding', 'gzip');
      res.end(gzipSync(packedJson));
    });
    const events = await get(app, '/events', 'gzip, br');
    expect(events.headers['content-encoding']).toBeUndefined();
    expect(events.text).toMatch(/^data: x{4000}/);
    // Compressed twice, one decoding would leave gzip bytes, not the JSON.
    const packed = await get(app, '/packed', 'br, gzip');
    expect(packed.headers['content-encoding']).toBe('gzip');
    expect(packed.body).toEqual(JSON.parse(packedJson));
  });
});
