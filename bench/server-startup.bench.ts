/**
 * Server start-up and plain request latency on loopback: migrating a fresh database, seeding
 * the demo, and 2,000 health requests from 100 concurrent clients. Figures only.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { AddressInfo } from 'node:net';
import { createApp } from '../server/app';
import { migrate, openDb } from '../server/db';
import { seedDemoIfEmpty } from '../server/demo/seedDemo';
import { loadSigningKeys } from '../server/services/signing/serverKeys';
import { percentile } from './support/stats';

const dir = mkdtempSync(join(tmpdir(), 'ringcall-bench-'));
const db = openDb(join(dir, 'bench.sqlite'));

let t = performance.now();
await migrate(db);
console.log(`migrate fresh database: ${(performance.now() - t).toFixed(1)} ms`);
const signingKeys = await loadSigningKeys(dir);
t = performance.now();
await seedDemoIfEmpty(db, signingKeys);
console.log(`seed demo event:        ${(performance.now() - t).toFixed(1)} ms`);

const app = createApp({
  db,
  version: 'bench',
  secret: new TextEncoder().encode('bench-secret-bench-secret-bench-secret'),
  mailer: { send: async () => undefined },
  linkAddress: { url: 'http://127.0.0.1', from: 'HOST', phonesCanOpen: false },
  dataDir: dir,
  signingKeys,
  logRequests: false,
});
const server = app.listen(0, '127.0.0.1');
await new Promise((resolve) => server.once('listening', resolve));
const { port } = server.address() as AddressInfo;

const latencies: number[] = [];
const clients = 100;
const perClient = 20;
const started = performance.now();
await Promise.all(
  Array.from({ length: clients }, async () => {
    for (let i = 0; i < perClient; i += 1) {
      const s = performance.now();
      const res = await fetch(`http://127.0.0.1:${port}/api/health`);
      await res.arrayBuffer();
      latencies.push(performance.now() - s);
    }
  }),
);
const seconds = (performance.now() - started) / 1000;
console.log(
  `GET /api/health, ${clients} concurrent clients: ${(latencies.length / seconds).toFixed(0)} req/s, ` +
    `p50 ${percentile(latencies, 50).toFixed(1)} ms, p99 ${percentile(latencies, 99).toFixed(1)} ms`,
);

server.close();
await db.destroy();
rmSync(dir, { recursive: true, force: true });
