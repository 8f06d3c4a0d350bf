import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';

/**
 * What every server child of the benches does around its server: listen on a loopback port and
 * print `{"port": N}` on its first line, answer `cpu` over IPC with `process.cpuUsage()` (to tell
 * the server's own cost from a busy machine's), and on SIGTERM close and run `cleanUp`.
 */
export function serveBenchChild(server: Server, cleanUp: () => Promise<unknown> = async () => undefined): void {
  server.listen(0, '127.0.0.1', () => {
    process.stdout.write(`${JSON.stringify({ port: (server.address() as AddressInfo).port })}\n`);
  });
  process.on('message', (message) => {
    if (message === 'cpu') process.send!(process.cpuUsage());
  });
  process.on('SIGTERM', () => {
    server.close();
    server.closeAllConnections();
    void cleanUp().then(() => process.exit(0));
  });
}
