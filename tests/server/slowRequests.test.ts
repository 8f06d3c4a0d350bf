import { connect } from 'node:net';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createFieldServer, FIELD_LIMITS } from '../../server/http/fieldServer';
import { startTestServer, type TestServer } from './support/testServer';

/*
 * A laptop on the field network that opens connections and sends a byte now and then must not
 * keep them: the server answers 408 and closes once the limits pass (shortened here; the
 * product's own are in FIELD_LIMITS).
 */

let app: TestServer;
let server: Server;
let port: number;

beforeAll(async () => {
  app = await startTestServer();
  server = createFieldServer({ headersMs: 300, requestMs: 600, checkEveryMs: 50 });
  server.on('request', app.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  port = (server.address() as AddressInfo).port;
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
  await app.close();
});

/** Sends `first`, then one byte every 100 ms; resolves with what the server said and when it closed. */
function drip(first: string): Promise<{ answer: string; closedAfterMs: number }> {
  return new Promise((resolve) => {
    const started = Date.now();
    const socket = connect(port, '127.0.0.1', () => socket.write(first));
    const timer = setInterval(() => socket.writable && socket.write('a'), 100);
    let answer = '';
    socket.setEncoding('utf8');
    socket.on('data', (chunk: string) => (answer += chunk));
    socket.on('error', () => undefined);
    socket.on('close', () => {
      clearInterval(timer);
      resolve({ answer, closedAfterMs: Date.now() - started });
    });
  });
}

describe('requests that arrive too slowly', () => {
  it('headers sent a byte at a time are cut off after the headers limit', async () => {
    const { answer, closedAfterMs } = await drip('POST /api/sync/push HTTP/1.1\r\nHost: field\r\nX-Slow: ');
    expect(answer).toMatch(/^HTTP\/1\.1 408/);
    expect(closedAfterMs).toBeLessThan(3_000);
  });

  it('a sync push whose body drips in is cut off after the request limit, and not logged as a fault', async () => {
    const logged = vi.spyOn(console, 'error');
    const { answer, closedAfterMs } = await drip(
      'POST /api/sync/push HTTP/1.1\r\nHost: field\r\nContent-Type: application/json\r\nContent-Length: 100000\r\n\r\n{',
    );
    expect(answer).toMatch(/^HTTP\/1\.1 408/);
    expect(closedAfterMs).toBeLessThan(3_000);
    // Let the lane's handler hear of the cut first.
    await new Promise((resolve) => setTimeout(resolve, 100));
    expect(logged).not.toHaveBeenCalled();
    logged.mockRestore();
  });

  it('a request that arrives in time is answered as usual', async () => {
    const socket = connect(port, '127.0.0.1');
    const answer = await new Promise<string>((resolve) => {
      let text = '';
      socket.setEncoding('utf8');
      socket.on('data', (chunk: string) => (text += chunk));
      socket.on('end', () => resolve(text));
      socket.write('GET /api/health HTTP/1.1\r\nHost: field\r\nConnection: close\r\n\r\n');
    });
    expect(answer).toMatch(/^HTTP\/1\.1 200/);
  });

  it("the product's limits leave a weak phone time for a whole push", () => {
    // 256 KB (the push cap) at 50 kbit/s is ~42 s.
    expect(FIELD_LIMITS.requestMs).toBeGreaterThanOrEqual(45_000);
    expect(FIELD_LIMITS.headersMs).toBeLessThan(FIELD_LIMITS.requestMs);
  });
});
