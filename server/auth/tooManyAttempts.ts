import type { Response } from 'express';
import { HttpError } from '../http/httpError';
import { waitSeconds } from './failureThrottle';

/** A 429 that says how long to wait, in words and in Retry-After. */
export function tooManyAttempts(
  res: Response,
  waitMs: number,
  message: (seconds: string) => string,
): HttpError {
  const seconds = waitSeconds(waitMs);
  res.set('Retry-After', String(seconds));
  const words = seconds < 120 ? `${seconds} seconds` : `${Math.ceil(seconds / 60)} minutes`;
  return new HttpError(429, 'too_many_attempts', message(words));
}
