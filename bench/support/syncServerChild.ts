/**
 * The server of bench/sync-server.bench.ts, in a process of its own so the simulated phones and
 * the server never share an event loop. Opens the given database file, starts the real app on a
 * loopback port and prints `{"port": N}` on its first line of output. Answers the message `cpu`
 * (over the IPC channel) with its `process.cpuUsage()`.
 * Usage: node --import tsx bench/support/syncServerChild.ts <database file>
 */
import { dirname } from 'node:path';
import http from 'node:http';
import { serveBenchChild } from './benchServerChild';
import { createApp } from '../../server/app';
import { migrate, openDb } from '../../server/db';
import { loadSigningKeys } from '../../server/services/signing/serverKeys';
import { BENCH_SECRET } from './syncField';

const file = process.argv[2];
if (!file) throw new Error('Give the database file as the first argument.');
const db = openDb(file);
await migrate(db);
const app = createApp({
  db,
  version: 'bench',
  secret: BENCH_SECRET,
  mailer: { send: async () => undefined },
  linkAddress: { url: 'http://127.0.0.1', from: 'HOST', phonesCanOpen: false },
  dataDir: dirname(file),
  signingKeys: await loadSigningKeys(dirname(file)),
  // As deployed (LOG_REQUESTS defaults to on; the push and the pull are not in the request log).
  logRequests: true,
});
serveBenchChild(http.createServer(app), () => db.destroy());
