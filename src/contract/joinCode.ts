import { z } from 'zod';

/** A join code as typed on a phone: a target's or a match's (any case, spaces around ignored). */
export const joinCodeSchema = z
  .string({ error: 'Enter the join code from the target sheet.' })
  .trim()
  .toUpperCase()
  .min(4, 'A join code has 6 characters.')
  .max(16, 'A join code has 6 characters.');
