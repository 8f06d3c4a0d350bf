import compression from 'compression';
import type { Request, Response } from 'express';

/**
 * Compresses answers built per request (API JSON, the small client files without a precompressed
 * copy) for browsers that accept it. Files the build compressed already carry their
 * Content-Encoding and pass untouched; a server-sent event stream is never held back by a
 * compressor's buffer. Answers under 1 KiB go as they are (compression's threshold).
 */
function worthCompressing(req: Request, res: Response): boolean {
  const type = String(res.getHeader('Content-Type') ?? '');
  if (type.startsWith('text/event-stream')) return false;
  return compression.filter(req, res);
}

export const compressAnswers = compression({ filter: worthCompressing });

/**
 * The field lane's compression (server/routes/syncLane.ts): a push's answer is a few hundred bytes
 * to a few KiB, where compressing costs the server more than the bytes cost the field network; a
 * pull from the start of a target or an event is far larger and is compressed.
 */
export const COMPRESS_FROM_BYTES = 16 * 1024;
export const compressLargeAnswers = compression({ filter: worthCompressing, threshold: COMPRESS_FROM_BYTES });
