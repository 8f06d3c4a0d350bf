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
