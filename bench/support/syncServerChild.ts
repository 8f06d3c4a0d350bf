/**
 * The server of bench/sync-server.bench.ts, in a process of its own so the simulated phones and
 * the server never share an event loop. Opens the given database file, starts the real app on a
 * loopback port and prints `{"port": N}` on its first line of output. Answers the message `cpu`
 * (over the IPC channel) with its `process.cpuUsage()`.
 * Usage: node --import tsx bench/support/syncServerChild.ts <database file>
 */
import { dirname } from 'node:path';
import type { AddressInfo } from 'node:net';
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
const server = app.listen(0, '127.0.0.1', () => {
  process.stdout.write(`${JSON.stringify({ port: (server.address() as AddressInfo).port })}\n`);
});
// The bench asks for the CPU time used so far, to tell the server's own cost from a busy machine's.
process.on('message', (message) => {
  if (message === 'cpu') process.send!(process.cpuUsage());
});
process.on('SIGTERM', () => {
  server.close();
  server.closeAllConnections();
  void db.destroy().then(() => process.exit(0));
});
