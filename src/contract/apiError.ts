import { z } from 'zod';

/** The one shape of every failed API answer, so the phone can always show a readable message. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
  }),
});

export type ApiErrorBody = z.infer<typeof apiErrorSchema>;
