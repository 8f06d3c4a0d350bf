import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { makePrivateDir } from '../../privateFiles';
import {
  exportJWK,
  generateKeyPair,
  importJWK,
  calculateJwkThumbprint,
  type JWK,
  type CryptoKey,
} from 'jose';

const ALG = 'ES256';

export type SigningKeys = {
  alg: typeof ALG;
  kid: string;
  privateKey: CryptoKey;
  publicJwk: JWK;
  publicKey: CryptoKey;
};

/** The file in the data folder that keeps the key pair made on first start. */
export const SIGNING_KEY_FILE = 'signing-key.json';

/** A private P-256 key as JWK, or a readable reason why the text is not one. */
function parsePrivateJwk(text: string, from: string): JWK {
  let jwk: unknown;
  try {
    jwk = JSON.parse(text);
  } catch {
    throw new Error(`${from} is not valid JSON. It must hold the server's private EC P-256 key as a JWK.`);
  }
  const k = jwk as JWK;
  if (!k || typeof k !== 'object' || k.kty !== 'EC' || k.crv !== 'P-256' || !k.x || !k.y || !k.d) {
    throw new Error(
      `${from} must be a private EC P-256 key as a JWK (kty "EC", crv "P-256", with x, y and d).`,
    );
  }
  return k;
}

/**
 * The server's own key pair for signatures on ends and cards: from SIGNING_KEY_JWK, or created
 * once in the data folder. Its public half is published at /.well-known/jwks.json so a printed
 * or mailed card can be checked later, by anyone. Losing the key means old signatures can no
 * longer be checked, so back up the data folder (or keep SIGNING_KEY_JWK) with the database.
 */
export async function loadSigningKeys(dataDir: string, fromEnv?: string): Promise<SigningKeys> {
  let privateJwk: JWK;
  if (fromEnv) {
    privateJwk = parsePrivateJwk(fromEnv, 'SIGNING_KEY_JWK');
  } else {
    const file = join(dataDir, SIGNING_KEY_FILE);
    if (!existsSync(file)) {
      makePrivateDir(dataDir);
      const { privateKey } = await generateKeyPair(ALG, { extractable: true });
      writeFileSync(file, JSON.stringify(await exportJWK(privateKey)), { mode: 0o600 });
    }
    privateJwk = parsePrivateJwk(readFileSync(file, 'utf8'), file);
  }
  // Only the public members: a JWK given by configuration may carry key_ops or other extras.
  const publicPart: JWK = { kty: privateJwk.kty, crv: privateJwk.crv, x: privateJwk.x, y: privateJwk.y };
  const kid = await calculateJwkThumbprint(publicPart);
  const publicJwk: JWK = { ...publicPart, kid, alg: ALG, use: 'sig' };
  const { kty, crv, x, y, d } = privateJwk;
  return {
    alg: ALG,
    kid,
    privateKey: (await importJWK({ kty, crv, x, y, d }, ALG)) as CryptoKey,
    publicKey: (await importJWK(publicJwk, ALG)) as CryptoKey,
    publicJwk,
  };
}
