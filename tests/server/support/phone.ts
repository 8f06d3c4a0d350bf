import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type { Express } from 'express';
import type {
  EndSettleArgs,
  EndWriteArgs,
  Mutation,
  PullResponse,
  PushResponse,
  Task,
  TargetPackage,
} from '../../../src/contract/sync';
import type { CardSignArgs, EndRuleArgs, EndSignArgs } from '../../../src/contract/judging';
import type { ShootOffRecordArgs } from '../../../src/contract/results';
import type {
  MatchCountersignArgs,
  MatchEndArgs,
  MatchEndSignArgs,
  MatchFirstShooterArgs,
  MatchShootOffArgs,
  MatchSignArgs,
  MatchWriteArgs,
} from '../../../src/contract/matches';
import type { Db } from '../../../server/db';
import type { TestPerson } from './people';

type WriteInput = Omit<EndWriteArgs, 'flags'> & { flags?: EndWriteArgs['flags'] };
type SettleInput = Omit<EndSettleArgs, 'disputed'> & { disputed?: number[] };
type ShootOffInput = Omit<ShootOffRecordArgs, 'closer'> & { closer?: boolean };

/**
 * A simulated phone: one person, one client id, its own sequence of mutations. Making a
 * mutation only numbers it (like writing it to the outbox); push sends whatever it is given.
 */
export class Phone {
  readonly clientId: string;
  private seq = 0;

  constructor(
    readonly app: Express,
    readonly person: TestPerson,
    clientId?: string,
  ) {
    this.clientId = clientId ?? `phone-${randomUUID()}`;
  }

  write(args: WriteInput): Mutation {
    this.seq += 1;
    return {
      id: randomUUID(),
      seq: this.seq,
      at: new Date().toISOString(),
      kind: 'end.write',
      args: { ...args, flags: args.flags ?? [] },
    };
  }

  settle(args: SettleInput): Mutation {
    this.seq += 1;
    return {
      id: randomUUID(),
      seq: this.seq,
      at: new Date().toISOString(),
      kind: 'end.settle',
      args: { ...args, disputed: args.disputed ?? [] },
    };
  }

  /** A judge's ruling on an end. */
  rule(args: EndRuleArgs): Mutation {
    return this.next({ kind: 'end.rule', args });
  }

  /** A judge's signature on an end, naming the values the judge saw. */
  sign(args: EndSignArgs): Mutation {
    return this.next({ kind: 'end.sign', args });
  }

  /** The archer's or the scorer's signature on a whole card. */
  signCard(args: CardSignArgs): Mutation {
    return this.next({ kind: 'card.sign', args });
  }

  /** A judge's shoot-off arrow. */
  shootOff(args: ShootOffInput): Mutation {
    return this.next({ kind: 'shootoff.record', args: { ...args, closer: args.closer ?? false } });
  }

  /** A judge's match end, shoot-off arrows or signature (eliminations). */
  matchEnd(args: MatchEndArgs): Mutation {
    return this.next({ kind: 'match.end', args });
  }

  matchShootOff(args: MatchShootOffArgs): Mutation {
    return this.next({ kind: 'match.shootoff', args });
  }

  matchSign(args: MatchSignArgs): Mutation {
    return this.next({ kind: 'match.sign', args });
  }

  /** A judge's signature on one set or end of a match. */
  matchEndSign(args: MatchEndSignArgs): Mutation {
    return this.next({ kind: 'match.endSign', args });
  }

  /** A change to this person's own practice log (`practice.session`, `practice.end`, `practice.delete`). */
  practice(change: Pick<Extract<Mutation, { kind: `practice.${string}` }>, 'kind' | 'args'>): Mutation {
    return this.next(change);
  }

  /** A match writer's end and an archer's countersignature on the match card. */
  matchWrite(args: MatchWriteArgs): Mutation {
    return this.next({ kind: 'match.write', args });
  }

  matchCountersign(args: MatchCountersignArgs): Mutation {
    return this.next({ kind: 'match.countersign', args });
  }

  /** Who shoots first in an alternating match (a writer of the match or a judge). */
  matchFirstShooter(args: MatchFirstShooterArgs): Mutation {
    return this.next({ kind: 'match.firstShooter', args });
  }

  private next(change: Pick<Mutation, 'kind' | 'args'>): Mutation {
    this.seq += 1;
    return { id: randomUUID(), seq: this.seq, at: new Date().toISOString(), ...change } as Mutation;
  }

  async push(mutations: Mutation[]): Promise<PushResponse> {
    const res = await request(this.app)
      .post('/api/sync/push')
      .set(this.person.auth)
      .send({ clientId: this.clientId, mutations });
    if (res.status !== 200) throw new Error(`push: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body as PushResponse;
  }

  async pull(cursor = 0, limit?: number): Promise<PullResponse> {
    const res = await request(this.app)
      .get('/api/sync/pull')
      .query(limit === undefined ? { cursor } : { cursor, limit })
      .set(this.person.auth);
    if (res.status !== 200) throw new Error(`pull: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body as PullResponse;
  }

  async join(code: string, task: Task): Promise<TargetPackage> {
    const res = await request(this.app).post('/api/join').set(this.person.auth).send({ code, task });
    if (res.status !== 200) throw new Error(`join: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body as TargetPackage;
  }
}

/** Row counts of every table a push could touch, to show a refused request stored nothing. */
export async function fieldTableCounts(db: Db): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const table of [
    'mutations',
    'sync_clients',
    'end_entries',
    'end_settlements',
    'end_rulings',
    'end_signatures',
    'card_signatures',
    'changes',
  ]) {
    const row = await db(table).count({ n: '*' }).first();
    counts[table] = Number(row?.n ?? 0);
  }
  return counts;
}
