import type { MutationResult, ReceivedChange } from '../../../src/contract/sync';
import type { Db } from '../../db';

export type StoredOutcome = {
  mutation_uuid: string;
  status: 'applied' | 'rejected' | 'held';
  reason: string | null;
};

/** A reference to a mutation's outcome: stored earlier, or filled in when this commit applies it. */
export type OutcomeRef = { uuid: string; outcome?: StoredOutcome };

/** What the sequence decided for one mutation: apply it, answer it as one already held, or answer it now. */
export type Step =
  | { m: ReceivedChange; apply: OutcomeRef }
  | { m: ReceivedChange; sameAs: OutcomeRef }
  | { m: ReceivedChange; answer: MutationResult };

/** What the sequence looks at of a change: its id and number (an unreadable change has them too). */
type Numbered = { id: string; seq: number };

export type Sequenced = { steps: Step[]; lastSeq: number; expectedSeq?: number };

const numberReused = (m: Numbered): MutationResult => ({
  seq: m.seq,
  id: m.id,
  status: 'rejected',
  reason:
    `This phone sent change number ${m.seq} twice with different contents, so the second one was not kept. ` +
    'Export the unsynced changes from this phone and give them to a judge.',
});

const seqKey = (clientId: string, seq: number) => `${clientId}\n${seq}`;

/**
 * The mutations the server already holds of the pushes in one commit, by each phone's numbering
 * and by mutation id: read in one query, then added to as the commit's own pushes are sequenced,
 * so a push sees the pushes before it in the same commit as if they had been stored. (Each
 * row read is a true fact, so reading more than a push needs is harmless.)
 */
export class KnownMutations {
  private readonly bySeq = new Map<string, OutcomeRef>();
  private readonly byUuid = new Map<string, OutcomeRef>();

  private constructor() {}

  /** `lastSeq` gives each phone's stored last seq: only numbers up to it can already be held. */
  static async load(
    trx: Db,
    pushes: readonly { clientId: string; mutations: readonly Numbered[] }[],
    lastSeq: (clientId: string) => number,
  ): Promise<KnownMutations> {
    const known = new KnownMutations();
    const held = pushes.flatMap(({ clientId, mutations }) =>
      mutations.filter((m) => m.seq <= lastSeq(clientId)).map((m) => [clientId, m.seq]),
    );
    const stored = (await trx('mutations')
      .where((w) => {
        w.whereIn(
          'mutation_uuid',
          pushes.flatMap((p) => p.mutations.map((m) => m.id)),
        );
        if (held.length > 0) w.orWhereIn(['client_id', 'seq'], held);
      })
      .select('mutation_uuid', 'client_id', 'seq', 'status', 'reason')) as (StoredOutcome & {
      client_id: string;
      seq: number;
    })[];
    for (const { client_id, seq, ...outcome } of stored) {
      const ref: OutcomeRef = { uuid: outcome.mutation_uuid, outcome };
      known.bySeq.set(seqKey(client_id, seq), ref);
      known.byUuid.set(outcome.mutation_uuid, ref);
    }
    return known;
  }

  /**
   * The sequence decides each mutation's fate before any rule is looked at (`mutations` in seq
   * order, `startSeq` the phone's last seq): at or below the last seq, a duplicate answered from
   * what is held (or a number reused for another change); beyond the next number, a gap that
   * stops the batch; the same mutation under a new number, a duplicate; otherwise applied.
   */
  sequence(clientId: string, mutations: readonly ReceivedChange[], startSeq: number): Sequenced {
    const steps: Step[] = [];
    let lastSeq = startSeq;
    for (const m of mutations) {
      if (m.seq <= lastSeq) {
        const same = this.bySeq.get(seqKey(clientId, m.seq)) ?? this.byUuid.get(m.id);
        steps.push(same && same.uuid === m.id ? { m, sameAs: same } : { m, answer: numberReused(m) });
        continue;
      }
      if (m.seq > lastSeq + 1) return { steps, lastSeq, expectedSeq: lastSeq + 1 };
      lastSeq = m.seq;
      const known = this.byUuid.get(m.id);
      if (known) {
        steps.push({ m, sameAs: known }); // the same change under a new number: never applied twice
        continue;
      }
      const ref: OutcomeRef = { uuid: m.id };
      this.bySeq.set(seqKey(clientId, m.seq), ref);
      this.byUuid.set(m.id, ref);
      steps.push({ m, apply: ref });
    }
    return { steps, lastSeq };
  }
}

/** What a phone is told about a mutation the server already holds: its stored outcome, never a second application. */
export function answerFromStore(m: Numbered, stored: StoredOutcome): MutationResult {
  if (stored.status === 'applied') return { seq: m.seq, id: m.id, status: 'duplicate' };
  return { seq: m.seq, id: m.id, status: stored.status, reason: stored.reason ?? 'This change was refused.' };
}
