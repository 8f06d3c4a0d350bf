import { webcrypto } from 'node:crypto';
import type { DeviceKeyRequest } from '../../../src/contract/deviceKeys';
import {
  DEVICE_KEY_ALGORITHM,
  DEVICE_SIGN_ALGORITHM,
  waitingSigningInput,
} from '../../../src/contract/waitingSigning';
import type { Db } from '../../db';
import { conflict, forbidden } from '../../http/httpError';
import { nowIso } from '../../time';

const taken = () =>
  forbidden('This phone’s changes belong to another account, so it cannot register a key for them.');

/**
 * Registers a phone's public key for one of its client ids, for the signed-in person only: a
 * client id already used or keyed by another account is refused, and a key once registered is
 * never replaced (a phone that lost its key has a new install id, so a new client id). The same
 * key again is fine, so a phone may register as often as it likes.
 */
export async function registerDeviceKey(db: Db, userId: number, request: DeviceKeyRequest): Promise<void> {
  const { clientId, publicJwk } = request;
  const jwk = JSON.stringify({ kty: 'EC', crv: 'P-256', x: publicJwk.x, y: publicJwk.y });
  const client = await db('sync_clients').where({ client_id: clientId }).first('user_id');
  if (client && client.user_id !== userId) throw taken();
  const held = await db('device_keys').where({ client_id: clientId }).first('user_id', 'public_jwk');
  if (held) {
    if (held.user_id !== userId) throw taken();
    if (held.public_jwk !== jwk)
      throw conflict('This phone already registered another key. Its key cannot be replaced.');
    return;
  }
  await db('device_keys')
    .insert({ client_id: clientId, user_id: userId, public_jwk: jwk, created_at: nowIso() })
    .onConflict('client_id')
    .ignore();
}

/**
 * Whether one client's block of a waiting-changes file (as it arrived, before any parsing) was
 * signed by the key its person registered for that client id. Anything else (no signature, no
 * key, a key of another person, a changed byte) is false.
 */
export async function signedByItsPhone(
  db: Db,
  block: { clientId: string; userId: number; mutations: readonly unknown[]; signature?: unknown },
): Promise<boolean> {
  if (typeof block.signature !== 'string') return false;
  const held = await db('device_keys').where({ client_id: block.clientId }).first('user_id', 'public_jwk');
  if (!held || held.user_id !== block.userId) return false;
  try {
    const key = await webcrypto.subtle.importKey(
      'jwk',
      JSON.parse(held.public_jwk as string) as webcrypto.JsonWebKey,
      DEVICE_KEY_ALGORITHM,
      false,
      ['verify'],
    );
    return await webcrypto.subtle.verify(
      DEVICE_SIGN_ALGORITHM,
      key,
      Buffer.from(block.signature, 'base64url'),
      new TextEncoder().encode(waitingSigningInput(block)),
    );
  } catch {
    // Content that has no canonical form, or a damaged key: not provably the phone's.
    return false;
  }
}
