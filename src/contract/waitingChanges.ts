import { z } from 'zod';
import { clientIdSchema } from './clientId';
import { receivedChangeSchema, type MutationResult } from './sync';

/**
 * The file a phone saves when it cannot sync ("Save waiting changes as a file"), which a judge
 * brings to the server. Each change keeps its phone's client id and number, so importing it
 * twice, or importing it and later syncing the phone, still applies it once.
 */
export const waitingChangesFileSchema = z.object({
  format: z.literal('ringcall-waiting-changes', {
    error: 'This is not a file of waiting changes saved by Ringcall.',
  }),
  version: z.literal(1, { error: 'This file comes from a newer Ringcall; update the server first.' }),
  exportedAt: z.string().max(40),
  clients: z
    .array(
      z.object({
        clientId: clientIdSchema,
        userId: z.number().int().positive(),
        mutations: z.array(receivedChangeSchema).min(1).max(2000),
        /**
         * The phone's own key's signature (ECDSA P-256, base64url) over `waitingSigningInput` of
         * this block. Without a valid one, the changes are the importing judge's transcription.
         */
        signature: z.string().max(200).optional(),
      }),
    )
    .min(1, 'The file holds no changes.')
    .max(20),
});
export type WaitingChangesFile = z.infer<typeof waitingChangesFileSchema>;

export type WaitingChangesImport = {
  clients: {
    clientId: string;
    userId: number;
    /** True when the block was signed by the phone's key registered for its client id. */
    fromThePhone: boolean;
    /** Otherwise the changes were taken in as this judge's transcription ("transcribed by …"). */
    transcribedBy?: string;
    applied: number;
    duplicates: number;
    results: MutationResult[];
  }[];
};
