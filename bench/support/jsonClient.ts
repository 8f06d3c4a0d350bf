import http from 'node:http';

/**
 * JSON over node:http with kept-alive connections: the bench's phones. fetch (undici) costs the
 * load generator about five times the CPU per request, and the phones share this machine's two
 * cores with the server, so fetch would measure the phones more than the server.
 */
export function jsonClient(port: number) {
  // Idle connections are let go before the server's 5 s keep-alive ends: without a timeout Node 20's
  // agent keeps them for ever, and a request sent as the server closes one fails (ECONNRESET).
  const agent = new http.Agent({ keepAlive: true, timeout: 4000 });
  const call = (method: 'GET' | 'POST', path: string, token: string, body?: unknown) =>
    new Promise<{ status: number; body: unknown }>((resolve, reject) => {
      const payload = body === undefined ? undefined : JSON.stringify(body);
      const req = http.request(
        {
          host: '127.0.0.1',
          port,
          path,
          method,
          agent,
          headers: {
            authorization: `Bearer ${token}`,
            ...(payload === undefined
              ? {}
              : { 'content-type': 'application/json', 'content-length': Buffer.byteLength(payload) }),
          },
        },
        (res) => {
          let text = '';
          res.setEncoding('utf8');
          res.on('data', (chunk: string) => (text += chunk));
          res.on('end', () =>
            resolve({ status: res.statusCode ?? 0, body: text ? JSON.parse(text) : undefined }),
          );
          res.on('error', reject);
        },
      );
      req.on('error', reject);
      req.end(payload);
    });
  return {
    get: (path: string, token: string) => call('GET', path, token),
    post: (path: string, token: string, body: unknown) => call('POST', path, token, body),
    close: () => agent.destroy(),
  };
}
