import type { Db } from '../../db';
import { signedByItsPhone } from './deviceKeys';

/** The block of `raw` (the file as it arrived) that the parsed block at `index` came from. */
function rawBlock(raw: unknown, index: number, parsed: { clientId: string; userId: number }) {
  const clients = (raw as { clients?: unknown } | null)?.clients;
  const block = Array.isArray(clients) ? (clients[index] as Record<string, unknown> | undefined) : undefined;
  if (!block || block.clientId !== parsed.clientId || block.userId !== parsed.userId) return undefined;
  if (!Array.isArray(block.mutations)) return undefined;
  return { ...parsed, mutations: block.mutations as unknown[], signature: block.signature };
}

/**
 * Whose changes a file's block is: the phone's person's own when its key signed them, otherwise
 * the importing judge's transcription (named, for the label the changes carry).
 */
export async function whoseChanges(
  db: Db,
  judgeId: number,
  client: { clientId: string; userId: number },
  raw: unknown,
  index: number,
): Promise<{ fromThePhone: boolean; transcribedBy?: string }> {
  const block = rawBlock(raw, index, client);
  if (block && (await signedByItsPhone(db, block))) return { fromThePhone: true };
  if (client.userId === judgeId) return { fromThePhone: false };
  const judge = await db('users').where({ id: judgeId }).first('display_name');
  return { fromThePhone: false, transcribedBy: String(judge?.display_name ?? '') };
}
