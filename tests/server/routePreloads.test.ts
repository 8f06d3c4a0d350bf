import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './support/testServer';

/** A build's manifest in small: the entry shares react with the pad; the pad has its own core. */
const manifest = {
  'index.html': { file: 'assets/index-e1.js', isEntry: true, imports: ['_react.js'] },
  '_react.js': { file: 'assets/react-r1.js' },
  '_core.js': { file: 'assets/core-c1.js' },
  'src/features/pad/PadScreen.tsx': { file: 'assets/PadScreen-p1.js', imports: ['_core.js', '_react.js'] },
  'src/features/home/HomeScreen.tsx': { file: 'assets/HomeScreen-h1.js', imports: ['_react.js'] },
  'src/app/ServerData.tsx': { file: 'assets/ServerData-s1.js' },
};

let server: TestServer;
let withClient: TestServer;
beforeAll(async () => {
  server = await startTestServer();
  const clientDir = join(server.dir, 'client');
  mkdirSync(join(clientDir, '.vite'), { recursive: true });
  writeFileSync(join(clientDir, 'index.html'), '<!doctype html><title>shell</title>');
  writeFileSync(join(clientDir, '.vite', 'manifest.json'), JSON.stringify(manifest));
  withClient = await startTestServer({ clientDir });
});
afterAll(async () => {
  await withClient.close();
  await server.close();
});

const open = (path: string) => request(withClient.app).get(path).set('Accept', 'text/html');

describe('screen chunks fetched with the page', () => {
  it("names the entry first, then the pad's own chunks, not those the entry brings", async () => {
    const res = await open('/pad/3/12');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<title>shell</title>');
    expect(res.headers['link']).toBe(
      '</assets/index-e1.js>; rel=modulepreload, </assets/PadScreen-p1.js>; rel=modulepreload, </assets/core-c1.js>; rel=modulepreload',
    );
  });

  it('names the home screen and the query cache for the home page', async () => {
    const res = await open('/');
    expect(res.headers['link']).toBe(
      '</assets/index-e1.js>; rel=modulepreload, </assets/HomeScreen-h1.js>; rel=modulepreload, </assets/ServerData-s1.js>; rel=modulepreload',
    );
  });

  it('sends no hint for other screens, files or the API', async () => {
    for (const path of ['/events/4', '/pad/3', '/index.html', '/api/health']) {
      expect((await open(path)).headers['link'], path).toBeUndefined();
    }
  });
});
