import { z } from 'zod';
import { clientIdSchema } from './clientId';

const coordinate = z.string().regex(/^[A-Za-z0-9_-]{43}$/, 'A P-256 key coordinate has 43 characters.');

/**
 * `POST /api/sync/device-key`: a phone registers the public half of its own signing key for one
 * client id (install id + person), signed in as that person. Only the public coordinates are
 * kept; anything else in the JWK is dropped.
 */
export const deviceKeyRequestSchema = z.object({
  clientId: clientIdSchema,
  publicJwk: z.object(
    { kty: z.literal('EC'), crv: z.literal('P-256'), x: coordinate, y: coordinate },
    { error: 'publicJwk must be the public half of an ECDSA P-256 key, as a JWK.' },
  ),
});
export type DeviceKeyRequest = z.infer<typeof deviceKeyRequestSchema>;
