import { createHash } from 'node:crypto';
import type { MutationResult, ReceivedChange, ReceivedPush } from '../../../src/contract/sync';
import type { Db } from '../../db';

const sha256 = (text: string) => createHash('sha256').update(text).digest();

/**
 * A judge's transcription of changes from a file no phone signed is kept apart from the phone's
 * own numbering: under a client id of its own (per judge and phone), numbered after what that
 * transcription already holds, each change under an id derived from the judge and the original.
 * So a forged file can never take a number or an id the real phone will send later (its own
 * changes still arrive and count as its own), while importing the same file twice still applies
 * each change once.
 */
export const transcriptionClientId = (judgeId: number, clientId: string): string =>
  `transcribed.${judgeId}.${sha256(clientId).toString('base64url').slice(0, 32)}`;

/** A UUID (version 5 layout) from the judge and the original change's id. */
export function transcribedMutationId(judgeId: number, id: string): string {
  const b = sha256(`transcribed:${judgeId}:${id}`).subarray(0, 16);
  b[6] = (b[6]! & 0x0f) | 0x50;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = b.toString('hex');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

export type Transcription = {
  request: ReceivedPush;
  /** Answers in the file's own terms (its seq and id), so the judge sees which change is which. */
  answer: (results: MutationResult[]) => MutationResult[];
};

export async function transcriptionOf(
  db: Db,
  judgeId: number,
  client: { clientId: string; mutations: readonly ReceivedChange[] },
): Promise<Transcription> {
  const clientId = transcriptionClientId(judgeId, client.clientId);
  const held = await db('sync_clients').where({ client_id: clientId }).first('last_seq');
  const lastSeq = Number(held?.last_seq ?? 0);
  const original = new Map<string, ReceivedChange>();
  const mutations = [...client.mutations]
    .sort((a, b) => a.seq - b.seq)
    .map((m, i) => {
      const id = transcribedMutationId(judgeId, m.id);
      original.set(id, m);
      return { ...m, id, seq: lastSeq + 1 + i };
    });
  return {
    request: { clientId, mutations },
    answer: (results) =>
      results.map((r) => {
        const m = original.get(r.id);
        return m ? { ...r, seq: m.seq, id: m.id } : r;
      }),
  };
}
