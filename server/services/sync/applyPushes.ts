import {
  isMatchMutation,
  isPracticeMutation,
  isUnreadable,
  type MutationResult,
  type PullQuery,
  type PushResponse,
  type ReceivedPush,
} from '../../../src/contract/sync';
import type { Db } from '../../db';
import { insertRows } from '../../rowInserts';
import type { Outcome } from '../../groupCommit';
import { forbidden } from '../../http/httpError';
import type { SigningKeys } from '../signing/serverKeys';
import { nowIso } from '../../time';
import { applyMatchChange } from '../matches/applyMatchChange';
import { applyPracticeChange } from '../practice/applyPracticeChange';
import { applyMutation } from './applyMutation';
import { pullMany } from './pullChanges';
import type { Author } from './effects';
import { FieldBatch } from './fieldBatch';
import { LateArrival } from './lateArrival';
import { storeHeld, type Held } from './lateValues';
import { KnownMutations, answerFromStore, type Sequenced, type Step } from './pushSequence';

/** One phone's push as one commit takes it in. */
export type Push = {
  userId: number;
  request: ReceivedPush;
  signingKeys?: SigningKeys;
  /** The judge whose transcription of a file this push is (see PushOptions). */
  transcribedBy?: { userId: number; name: string };
  /** The phone's pull, answered with the push (read in its commit, after its writes). */
  pull?: PullQuery;
};

export type CardRef = { sessionId: number; entryId: number };

/** A push's answer, and the cards it made final (mailed once it is committed). */
export type PushDone = { response: PushResponse; finalCards: CardRef[] };

type ClientState = { userId: number; lastSeq: number; storedSeq: number | undefined };

const notYours = () =>
  forbidden(
    'This phone’s changes belong to another account. Sign in as that person to send them, or ask a judge.',
  );

/**
 * Applies the pushes of one commit, in arrival order, each exactly as if it had been committed on
 * its own: a phone whose client id belongs to another account is refused before anything is
 * written; every other push is sequenced, its mutations applied to one shared FieldBatch, and
 * the effects, the log rows and each phone's last seq are written with a few multi-row
 * statements. Throws only when something unexpected fails (the caller then undoes it all).
 */
export async function applyPushes(trx: Db, pushes: readonly Push[]): Promise<Outcome<PushDone>[]> {
  const clients = await readClients(trx, pushes);
  const known = await KnownMutations.load(
    trx,
    pushes.map((p) => p.request),
    (clientId) => clients.get(clientId)?.lastSeq ?? 0,
  );

  const plans: (Sequenced & { push: Push; done: PushDone })[] = [];
  const outcomes: Outcome<PushDone>[] = pushes.map((push) => {
    const { clientId } = push.request;
    const client = clients.get(clientId);
    if (client && client.userId !== push.userId) return { error: notYours() };
    const mutations = [...push.request.mutations].sort((a, b) => a.seq - b.seq);
    const sequenced = known.sequence(clientId, mutations, client?.lastSeq ?? 0);
    const done: PushDone = { response: { results: [], lastSeq: sequenced.lastSeq }, finalCards: [] };
    clients.set(clientId, { userId: push.userId, lastSeq: sequenced.lastSeq, storedSeq: client?.storedSeq });
    plans.push({ ...sequenced, push, done });
    return { value: done };
  });

  const batch = await FieldBatch.load(
    trx,
    plans.flatMap((p) =>
      p.steps.flatMap((s) =>
        'apply' in s && !isUnreadable(s.m) && !isMatchMutation(s.m) && !isPracticeMutation(s.m) ? [s.m] : [],
      ),
    ),
    [...new Set(plans.map((p) => p.push.userId))],
  );
  const receivedAt = nowIso();
  const logRows: object[] = [];
  /** Changes that reached a closed session, held for a judge (lateValues.ts). */
  const held: Held[] = [];
  for (const { push, done, steps, lastSeq, expectedSeq } of plans) {
    const finalBefore = batch.finalCards.length;
    const results: MutationResult[] = [];
    for (const step of steps) results.push(await resultOf(step, push));
    done.response = { results, lastSeq, ...(expectedSeq !== undefined ? { expectedSeq } : {}) };
    done.finalCards = batch.finalCards.slice(finalBefore);
  }

  async function resultOf(step: Step, push: Push): Promise<MutationResult> {
    const { m } = step;
    if ('answer' in step) return step.answer;
    if ('sameAs' in step) return answerFromStore(m, step.sameAs.outcome!);
    // An unreadable change is logged as refused with its reason, like a broken rule: the phone's
    // sequence moves past it and the changes behind it go on.
    let reason: string | null;
    let status: 'applied' | 'rejected' | 'held';
    if (isUnreadable(m)) {
      reason = m.unreadable.reason;
      status = 'rejected';
    } else {
      try {
        const by: Author = {
          userId: push.userId,
          at: m.at,
          mutationId: m.id,
          ...(push.transcribedBy ? { transcribedBy: push.transcribedBy } : {}),
        };
        reason = isMatchMutation(m)
          ? await applyMatchChange(trx, m, by)
          : isPracticeMutation(m)
            ? await applyPracticeChange(trx, m, by, push.request.clientId)
            : await applyMutation(batch, m, by, push.signingKeys);
        status = reason === null ? 'applied' : 'rejected';
      } catch (error) {
        if (!(error instanceof LateArrival)) throw error;
        reason = error.message;
        status = 'held';
        held.push({ m, userId: push.userId, placement: error.placement, receivedAt });
      }
    }
    step.apply.outcome = { mutation_uuid: m.id, status, reason };
    logRows.push({
      ...step.apply.outcome,
      client_id: push.request.clientId,
      seq: m.seq,
      user_id: push.userId,
      transcribed_by: push.transcribedBy?.userId ?? null,
      ...(isUnreadable(m)
        ? { kind: m.unreadable.kind, args_json: m.unreadable.argsJson, at: m.unreadable.at }
        : { kind: m.kind, args_json: JSON.stringify(m.args), at: m.at }),
      received_at: receivedAt,
    });
    return reason === null
      ? { seq: m.seq, id: m.id, status: 'applied' }
      : { seq: m.seq, id: m.id, status: status === 'held' ? 'held' : 'rejected', reason };
  }

  await batch.flush(trx);
  await insertRows(trx, 'mutations', logRows);
  await storeHeld(trx, held);
  await writeClients(trx, clients, receivedAt);
  // Read after every write of the commit and answered only once it is committed, so each pull
  // holds its own push's effects (and those of the pushes before it in the commit).
  const pulling = plans.filter((p) => p.push.pull !== undefined);
  const pulls = await pullMany(
    trx,
    pulling.map(({ push }) => ({ userId: push.userId, ...push.pull! })),
  );
  pulling.forEach((p, i) => (p.done.response.pull = pulls[i]));
  return outcomes;
}

/** Each phone's account and last seq as stored (`storedSeq`); phones new to the server are missing. */
async function readClients(trx: Db, pushes: readonly Push[]): Promise<Map<string, ClientState>> {
  const rows = (await trx('sync_clients')
    .whereIn('client_id', [...new Set(pushes.map((p) => p.request.clientId))])
    .select('client_id', 'user_id', 'last_seq')) as {
    client_id: string;
    user_id: number;
    last_seq: number;
  }[];
  return new Map(
    rows.map((r) => [r.client_id, { userId: r.user_id, lastSeq: r.last_seq, storedSeq: r.last_seq }]),
  );
}

/** Stores each new phone, and the last seq of each phone whose sequence moved, in one statement. */
async function writeClients(trx: Db, clients: Map<string, ClientState>, at: string): Promise<void> {
  const rows = [...clients]
    .filter(([, c]) => c.lastSeq !== c.storedSeq)
    .map(([clientId, c]) => ({
      client_id: clientId,
      user_id: c.userId,
      last_seq: c.lastSeq,
      updated_at: at,
    }));
  await insertRows(trx, 'sync_clients', rows, { conflict: ['client_id'], merge: ['last_seq', 'updated_at'] });
}
