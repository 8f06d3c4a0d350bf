import { z } from 'zod';

/**
 * A phone's client id (install id + person, `src/local/outbox.ts`): visible ASCII only. Text a
 * keyboard cannot type (a lone surrogate half, a NUL) is not kept by the database as it was sent,
 * so the phone's sequence would never be found again.
 */
export const clientIdSchema = z
  .string({ error: 'clientId must be this phone’s id (8 to 100 letters, digits or marks, no spaces).' })
  .regex(
    /^[\x21-\x7e]{8,100}$/,
    'clientId must be this phone’s id (8 to 100 letters, digits or marks, no spaces).',
  );
