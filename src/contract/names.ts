import { z } from 'zod';
import { cleanText } from '../core';

/**
 * The one schema for names people read: of people, clubs, events, venues, sessions and divisions.
 * Bidirectional controls and NUL/CR/LF are removed (cleanText) before trimming and counting.
 */
export const nameText = (what: string, max: number, message = `Enter ${what}.`) =>
  z
    .string({ error: message })
    .overwrite(cleanText)
    .trim()
    .min(1, message)
    .max(max, `Use at most ${max} characters for ${what}.`);

/** The same for a name that may be left empty (a club, a venue). */
export const optionalNameText = (what: string, max: number) =>
  z
    .string({ error: `${what} must be text.` })
    .overwrite(cleanText)
    .trim()
    .max(max, `Use at most ${max} characters for ${what}.`);
