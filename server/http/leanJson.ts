import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Request, Response } from 'express';
import { COMPRESS_FROM_BYTES, compressLargeAnswers } from './compressAnswers';

/**
 * The headers a JSON answer needs (OWASP's REST list): never stored, never sniffed as another
 * type, never framed, run or read by another origin. The app-wide security headers (helmet,
 * server/http/security.ts) are about pages; the field lane's answers are only ever read by the
 * app's own fetch.
 */
const HEADERS = [
  'Cache-Control',
  'no-store',
  'Content-Security-Policy',
  "default-src 'none'; frame-ancestors 'none'",
  'X-Content-Type-Options',
  'nosniff',
  'Cross-Origin-Resource-Policy',
  'same-origin',
  'Referrer-Policy',
  'no-referrer',
  'Content-Type',
  'application/json; charset=utf-8',
];

/**
 * Answers `value` as JSON with the headers above, on Node's own request and answer (the field
 * lane runs before Express): no ETag (`no-store` answers never use one), and compressed only
 * from COMPRESS_FROM_BYTES (compressAnswers.ts), where compressing pays for itself.
 */
export function sendLeanJson(req: IncomingMessage, res: ServerResponse, value: unknown, status = 200): void {
  const body = Buffer.from(JSON.stringify(value));
  if (body.length < COMPRESS_FROM_BYTES) {
    // Handed to Node in one list: written as they are, without keeping each one by name.
    res.writeHead(status, [...HEADERS, 'Content-Length', String(body.length)]);
    res.end(body);
    return;
  }
  res.statusCode = status;
  for (let i = 0; i < HEADERS.length; i += 2) res.setHeader(HEADERS[i]!, HEADERS[i + 1]!);
  res.setHeader('Content-Length', body.length);
  // compression's middleware works on Node's own objects; it wraps `end` and decides by the headers.
  void compressLargeAnswers(req as Request, res as Response, () => res.end(body));
}
