import { z } from 'zod';
import { ARROW_VALUES, type ArrowValue } from '../core';

export const arrowValueSchema = z.enum(ARROW_VALUES as unknown as [ArrowValue, ...ArrowValue[]], {
  error: (issue) => `"${String(issue.input)}" is not an arrow value. Use X, 10 to 1, or M.`,
});
