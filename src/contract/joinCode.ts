import { z } from 'zod';

const letterMessage = 'A join code has 6 letters and digits, as printed on the target sheet.';

/**
 * A join code as typed on a phone: a target's or a match's. Any case, spaces anywhere (read off in
 * groups) and full-width letters (an East Asian keyboard, NFKC) are the same code; anything else
 * no code holds is refused here, so it never counts as a wrong guess nor comes back in a message.
 */
export const joinCodeSchema = z
  .string({ error: 'Enter the join code from the target sheet.' })
  .transform((typed) => typed.normalize('NFKC').replace(/\s+/g, '').toUpperCase())
  .pipe(
    z
      .string()
      .min(4, 'A join code has 6 characters.')
      .max(16, 'A join code has 6 characters.')
      .regex(/^[A-Z0-9]*$/, letterMessage),
  );
