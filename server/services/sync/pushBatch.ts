import type { Mutation, MutationResult, PushRequest, PushResponse } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { forbidden } from '../../http/httpError';
import { nowIso } from '../../time';
import type { SigningKeys } from '../../signing/serverKeys';
import { applyCardSign } from './applyCardSign';
import { applyEndSign } from './applyEndSign';
import { applyEndWrite } from './applyEndWrite';
import { applyRuling } from './applyRuling';
import { applySettlement } from './applySettlement';
import type { Author } from './effects';
import { FieldBatch } from './fieldBatch';
import { Refusal } from './fieldRules';

export type PushOptions = {
  /** The server's key: judges' and archers' signatures are made with it. */
  signingKeys?: SigningKeys;
  /**
   * Called once the push is committed with the cards it made final (both signatures), so the
   * final card can be mailed outside the transaction: a mail failure never loses a signature.
   */
  onFinalCards?: (cards: { sessionId: number; entryId: number }[]) => void;
};

type StoredOutcome = { mutation_uuid: string; status: 'applied' | 'rejected'; reason: string | null };

/** What a phone is told about a mutation the server already holds: its stored outcome, never a second application. */
function answerFromStore(m: Mutation, stored: StoredOutcome): MutationResult {
  return stored.status === 'rejected'
    ? { seq: m.seq, id: m.id, status: 'rejected', reason: stored.reason ?? 'This change was refused.' }
    : { seq: m.seq, id: m.id, status: 'duplicate' };
}

const numberReused = (m: Mutation): MutationResult => ({
  seq: m.seq,
  id: m.id,
  status: 'rejected',
  reason:
    `This phone sent change number ${m.seq} twice with different contents, so the second one was not kept. ` +
    'Export the unsynced changes from this phone and give them to a judge.',
});

function keysFor(options: PushOptions): SigningKeys {
  if (!options.signingKeys) throw new Error('pushBatch needs the signing keys to apply signatures.');
  return options.signingKeys;
}

/** Applies one mutation to the batch's state; a broken rule comes back as its reason, with nothing changed. */
async function applyOne(
  batch: FieldBatch,
  m: Mutation,
  by: Author,
  options: PushOptions,
): Promise<string | null> {
  try {
    switch (m.kind) {
      case 'end.write':
        applyEndWrite(batch, m.args, by);
        break;
      case 'end.settle':
        applySettlement(batch, m.args, by);
        break;
      case 'end.rule':
        applyRuling(batch, m.args, by);
        break;
      case 'end.sign':
        await applyEndSign(batch, m.args, by, keysFor(options));
        break;
      case 'card.sign':
        await applyCardSign(batch, m.args, by, keysFor(options));
        break;
    }
    return null;
  } catch (error) {
    if (error instanceof Refusal) return error.message;
    throw error;
  }
}

/**
 * Applies a phone's batch of mutations exactly once each, in seq order, in one transaction with
 * the append-only log row of each mutation and the phone's last seq, so effect, log and sequence
 * can never diverge (a failure rolls the whole batch back and the phone sends it again).
 *
 * - seq at or below the phone's last seq: a duplicate, answered from the stored outcome.
 * - seq beyond last seq + 1: a gap; the batch stops and the answer names the seq expected.
 * - a mutation that breaks a rule is logged as rejected with its reason and the batch goes on.
 *
 * The batch is sorted by seq first: the phone's order is its seq order, so a batch that arrived
 * reordered applies exactly as the ordered one would.
 */
export async function pushBatch(
  db: Db,
  userId: number,
  request: PushRequest,
  options: PushOptions = {},
): Promise<PushResponse> {
  const { clientId } = request;
  const mutations = [...request.mutations].sort((a, b) => a.seq - b.seq);

  let finalCards: { sessionId: number; entryId: number }[] = [];
  const response = await db.transaction(async (trx) => {
    const client = (await trx('sync_clients').where({ client_id: clientId }).first('user_id', 'last_seq')) as
      { user_id: number; last_seq: number } | undefined;
    if (client && client.user_id !== userId) {
      throw forbidden(
        'This phone’s changes belong to another account. Sign in as that person to send them, or ask a judge.',
      );
    }
    const startSeq = client?.last_seq ?? 0;

    // What the server already holds of this batch: by this phone's numbering, and by mutation id.
    const stored = (await trx('mutations')
      .where((w) =>
        w
          .where('client_id', clientId)
          .whereIn(
            'seq',
            mutations.map((m) => m.seq),
          )
          .orWhereIn(
            'mutation_uuid',
            mutations.map((m) => m.id),
          ),
      )
      .select('mutation_uuid', 'client_id', 'seq', 'status', 'reason')) as (StoredOutcome & {
      client_id: string;
      seq: number;
    })[];
    // A reference to a mutation's outcome: stored earlier, or filled in when this batch applies it.
    type Ref = { uuid: string; outcome?: StoredOutcome };
    const asRef = (s: StoredOutcome): Ref => ({ uuid: s.mutation_uuid, outcome: s });
    const bySeq = new Map<number, Ref>(
      stored.filter((s) => s.client_id === clientId).map((s) => [s.seq, asRef(s)]),
    );
    const byUuid = new Map<string, Ref>(stored.map((s) => [s.mutation_uuid, asRef(s)]));

    // The sequence decides each mutation's fate before any rule is looked at.
    type Step =
      { m: Mutation; apply: Ref } | { m: Mutation; sameAs: Ref } | { m: Mutation; answer: MutationResult };
    const steps: Step[] = [];
    let lastSeq = startSeq;
    let expectedSeq: number | undefined;
    for (const m of mutations) {
      if (m.seq <= lastSeq) {
        const same = bySeq.get(m.seq) ?? byUuid.get(m.id);
        steps.push(same && same.uuid === m.id ? { m, sameAs: same } : { m, answer: numberReused(m) });
        continue;
      }
      if (m.seq > lastSeq + 1) {
        expectedSeq = lastSeq + 1;
        break;
      }
      lastSeq = m.seq;
      const known = byUuid.get(m.id);
      if (known) {
        steps.push({ m, sameAs: known }); // the same change under a new number: never applied twice
        continue;
      }
      const ref: Ref = { uuid: m.id };
      bySeq.set(m.seq, ref);
      byUuid.set(m.id, ref);
      steps.push({ m, apply: ref });
    }

    const batch = await FieldBatch.load(
      trx,
      userId,
      steps.flatMap((s) => ('apply' in s ? [s.m] : [])),
    );
    const receivedAt = nowIso();
    const logRows: object[] = [];
    const results: MutationResult[] = [];
    for (const step of steps) results.push(await resultOf(step));
    async function resultOf(step: Step): Promise<MutationResult> {
      const { m } = step;
      if ('answer' in step) return step.answer;
      if ('sameAs' in step) return answerFromStore(m, step.sameAs.outcome!);
      const reason = await applyOne(batch, m, { userId, at: m.at, mutationId: m.id }, options);
      step.apply.outcome = { mutation_uuid: m.id, status: reason === null ? 'applied' : 'rejected', reason };
      logRows.push({
        ...step.apply.outcome,
        client_id: clientId,
        seq: m.seq,
        user_id: userId,
        kind: m.kind,
        args_json: JSON.stringify(m.args),
        at: m.at,
        received_at: receivedAt,
      });
      return reason === null
        ? { seq: m.seq, id: m.id, status: 'applied' }
        : { seq: m.seq, id: m.id, status: 'rejected', reason };
    }

    await batch.flush(trx);
    for (let i = 0; i < logRows.length; i += 200) await trx('mutations').insert(logRows.slice(i, i + 200));
    if (!client)
      await trx('sync_clients').insert({
        client_id: clientId,
        user_id: userId,
        last_seq: lastSeq,
        updated_at: receivedAt,
      });
    else if (lastSeq !== startSeq)
      await trx('sync_clients')
        .where({ client_id: clientId })
        .update({ last_seq: lastSeq, updated_at: receivedAt });
    finalCards = batch.finalCards;
    return { results, lastSeq, ...(expectedSeq !== undefined ? { expectedSeq } : {}) };
  });
  if (finalCards.length > 0) options.onFinalCards?.(finalCards);
  return response;
}
