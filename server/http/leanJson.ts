import { gzip } from 'node:zlib';
import type { Request, RequestHandler, Response } from 'express';

/**
 * The headers a JSON answer needs (OWASP's REST list), set in one step: never stored, never
 * sniffed as another type, never framed, run or read by another origin. The app-wide security
 * headers (helmet, server/http/security.ts) are about pages; the field lane's answers are
 * only ever read by the app's own fetch.
 */
const HEADERS: [string, string][] = [
  ['Cache-Control', 'no-store'],
  ['Content-Security-Policy', "default-src 'none'; frame-ancestors 'none'"],
  ['X-Content-Type-Options', 'nosniff'],
  ['Cross-Origin-Resource-Policy', 'same-origin'],
  ['Referrer-Policy', 'no-referrer'],
];

export const leanHeaders: RequestHandler = (_req, res, next) => {
  for (const [name, value] of HEADERS) res.setHeader(name, value);
  next();
};

/**
 * Answers below this go as they are: a push's answer is a few hundred bytes to a few KiB, where
 * compressing costs the server more than the bytes cost the field network. A pull from the start
 * of a target or an event is far larger and is compressed.
 */
export const COMPRESS_FROM_BYTES = 16 * 1024;

/**
 * Sends `value` as JSON without Express's `res.json` (which hashes every answer for an ETag that
 * `no-store` answers never use), gzipped when large and the client takes gzip.
 */
export function sendJson(req: Request, res: Response, value: unknown, status = 200): void {
  const body = Buffer.from(JSON.stringify(value));
  res.statusCode = status;
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  if (body.length < COMPRESS_FROM_BYTES) {
    res.setHeader('Content-Length', body.length);
    res.end(body);
    return;
  }
  res.setHeader('Vary', 'Accept-Encoding');
  if (!req.acceptsEncodings('gzip')) {
    res.setHeader('Content-Length', body.length);
    res.end(body);
    return;
  }
  gzip(body, (error, zipped) => {
    if (error) {
      res.destroy(error);
      return;
    }
    res.setHeader('Content-Encoding', 'gzip');
    res.setHeader('Content-Length', zipped.length);
    res.end(zipped);
  });
}
