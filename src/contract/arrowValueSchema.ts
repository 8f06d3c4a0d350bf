import { z } from 'zod';
import { ARROW_VALUES, type ArrowValue } from '../core';

/** The refused value as the message quotes it: text or a number only, never via the value's own toString. */
const shown = (input: unknown): string =>
  typeof input === 'string'
    ? `"${input.slice(0, 12)}" is`
    : typeof input === 'number'
      ? `${input} is`
      : 'That is';

export const arrowValueSchema = z.enum(ARROW_VALUES as unknown as [ArrowValue, ...ArrowValue[]], {
  error: (issue) => `${shown(issue.input)} not an arrow value. Use X, 10 to 1, or M.`,
});
