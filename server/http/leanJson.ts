import type { RequestHandler, Response } from 'express';

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
 * Sends `value` as JSON without Express's `res.json`, which hashes every answer for an ETag that
 * `no-store` answers never use.
 */
export function sendJson(res: Response, value: unknown, status = 200): void {
  const body = Buffer.from(JSON.stringify(value));
  res.statusCode = status;
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.setHeader('Content-Length', body.length);
  res.end(body);
}
