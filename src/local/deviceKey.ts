import type { DeviceKeyRequest } from '../contract/deviceKeys';
import { DEVICE_KEY_ALGORITHM, DEVICE_SIGN_ALGORITHM, waitingSigningInput } from '../contract/waitingSigning';
import type { LocalDb } from './db';

/*
 * Each client id (install + person) has its own ECDSA P-256 key, made on first need. Its private
 * half is not extractable: it stays in this browser's IndexedDB (CryptoKey objects are stored as
 * they are) and can only sign here. Its public half is registered with the server for that
 * client id, so a file of waiting changes signed by it is provably from this phone.
 */

const keyName = (clientId: string) => `deviceKey:${clientId}`;
const registeredName = (clientId: string) => `deviceKeyRegistered:${clientId}`;

/** WebCrypto is only there in a secure context (HTTPS or localhost); without it nothing is signed. */
const subtle = (): SubtleCrypto | undefined => globalThis.crypto?.subtle;

async function storedKey(db: LocalDb, clientId: string): Promise<CryptoKeyPair | undefined> {
  return (await db.meta.get(keyName(clientId)))?.value as CryptoKeyPair | undefined;
}

async function keyFor(db: LocalDb, clientId: string, crypto: SubtleCrypto): Promise<CryptoKeyPair> {
  const held = await storedKey(db, clientId);
  if (held) return held;
  const made = await crypto.generateKey(DEVICE_KEY_ALGORITHM, false, ['sign', 'verify']);
  // Another tab may have made one meanwhile: the first stored wins, so the registered key is kept.
  return db.transaction('rw', db.meta, async () => {
    const raced = await storedKey(db, clientId);
    if (raced) return raced;
    await db.meta.put({ key: keyName(clientId), value: made });
    return made;
  });
}

/** What the server said to a key: kept, or refused for good (another account's id, another key). */
export type KeyRegistration = 'registered' | 'refused';

/**
 * Registers this client id's public key once (made now if there is none). A refusal is
 * remembered and never blocks sync: that phone's files then count as a judge's transcription.
 */
export async function ensureDeviceKeyRegistered(
  db: LocalDb,
  clientId: string,
  register: (body: DeviceKeyRequest) => Promise<KeyRegistration>,
): Promise<void> {
  const crypto = subtle();
  if (!crypto || (await db.meta.get(registeredName(clientId)))) return;
  const { publicKey } = await keyFor(db, clientId, crypto);
  const { x, y } = await crypto.exportKey('jwk', publicKey);
  const outcome = await register({ clientId, publicJwk: { kty: 'EC', crv: 'P-256', x: x!, y: y! } });
  await db.meta.put({ key: registeredName(clientId), value: outcome });
}

/** The signature of one block of a waiting-changes file by its client's key, if this phone has one. */
export async function signWaitingBlock(
  db: LocalDb,
  block: { clientId: string; userId: number; mutations: readonly unknown[] },
): Promise<string | undefined> {
  const crypto = subtle();
  const key = crypto && (await storedKey(db, block.clientId));
  if (!crypto || !key) return undefined;
  const signature = await crypto.sign(
    DEVICE_SIGN_ALGORITHM,
    key.privateKey,
    new TextEncoder().encode(waitingSigningInput(block)),
  );
  return base64url(new Uint8Array(signature));
}

function base64url(bytes: Uint8Array): string {
  let binary = '';
  for (const b of bytes) binary += String.fromCharCode(b);
  return btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}
