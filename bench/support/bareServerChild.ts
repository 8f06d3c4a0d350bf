/**
 * The floor of bench/sync-server.bench.ts (a): a bare node:http server that does what any server
 * must do for a push and nothing more. It reads the body, parses the JSON and answers with JSON
 * of the same shape and about the size of the real answer (each change's result, and a pull of
 * two end records), with no routing, checks, authentication or database. Prints `{"port": N}` and
 * answers `cpu` over IPC like syncServerChild.ts, so both are measured the same way.
 * Usage: node --import tsx bench/support/bareServerChild.ts
 */
import http from 'node:http';
import { serveBenchChild } from './benchServerChild';

type Change = { id: string; seq: number; args: object };

const server = http.createServer((req, res) => {
  let text = '';
  req.setEncoding('utf8');
  req.on('data', (chunk: string) => (text += chunk));
  req.on('end', () => {
    // The phones' first pull (a GET, no body) is answered as an empty page.
    if (req.method === 'GET') return answer(res, { changes: [], cursor: 0, hasMore: false });
    const push = JSON.parse(text) as { mutations: Change[]; cursor?: number };
    const last = push.mutations.at(-1)!;
    const record = { ...last.args, revision: 6, writtenBy: 1, writtenAt: new Date().toISOString() };
    answer(res, {
      results: push.mutations.map((m) => ({ seq: m.seq, id: m.id, status: 'applied' })),
      lastSeq: last.seq,
      pull: {
        changes: [1, 2].map((n) => ({ version: (push.cursor ?? 0) + n, type: 'end', record })),
        cursor: (push.cursor ?? 0) + 2,
        hasMore: false,
      },
    });
  });
});

function answer(res: http.ServerResponse, value: object): void {
  const body = JSON.stringify(value);
  res.writeHead(200, { 'content-type': 'application/json', 'content-length': Buffer.byteLength(body) });
  res.end(body);
}
serveBenchChild(server);
