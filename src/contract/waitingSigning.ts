import { canonicalJson } from '../core/canonicalJson';

/**
 * What a phone's key signs when it saves its waiting changes as a file, and what the server
 * checks: the canonical JSON of one client's block, each change reduced to what is pushed (id,
 * seq, kind, args, at; not its local status). No zod here, so the pad can use it without
 * loading the schemas.
 */
export function waitingSigningInput(client: {
  clientId: unknown;
  userId: unknown;
  mutations: readonly unknown[];
}): string {
  return canonicalJson({
    typ: 'ringcall-waiting-changes',
    clientId: client.clientId,
    userId: client.userId,
    mutations: client.mutations.map((m) => {
      const { id, seq, kind, args, at } = (m ?? {}) as Record<string, unknown>;
      return { id, seq, kind, args, at };
    }),
  });
}

/** The signature algorithm of phones' keys (WebCrypto names), on both sides. */
export const DEVICE_KEY_ALGORITHM = { name: 'ECDSA', namedCurve: 'P-256' } as const;
export const DEVICE_SIGN_ALGORITHM = { name: 'ECDSA', hash: 'SHA-256' } as const;
