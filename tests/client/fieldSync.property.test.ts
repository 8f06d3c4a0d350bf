/**
 * The field path's promise, tested end to end with the real phone code (Dexie outbox and sync
 * engine on fake-indexeddb) against the real server services on a SQLite file: whatever the
 * network does (requests lost, answers lost, batches sent twice, split or reordered, batches
 * refused as too large), whatever happens to the phones (reloads) or the server (restarts), and
 * whatever a phone sends that this server cannot read (a newer app's kind of change, a time with
 * an offset, a value out of range), the server ends up with exactly what the writers entered,
 * each change applied or refused once, no change ever blocks the ones behind it, and every phone
 * converges on the server's cards.
 */
import 'fake-indexeddb/auto';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { endView, scoringValues, type ArrowValue } from '../../src/core';
import {
  type EndWriteArgs,
  pushRequestSchema,
  type PushRequest,
  type PushResponse,
  type MutationResult,
} from '../../src/contract/sync';
import { LocalDb, cardKeyOf, endKeyOf, targetKeyOf, type JoinedTarget } from '../../src/local/db';
import { recordChange } from '../../src/local/outbox';
import { syncOnce, type SyncTransport } from '../../src/local/syncEngine';
import { localEnd } from '../../src/local/endFacts';
import { ApiError } from '../../src/api/request';
import { openDb, type Db } from '../../server/db';
import { pushAndPull } from '../../server/services/sync/pushAndPull';
import { pullChanges } from '../../server/services/sync/pullChanges';
import { startTestServer, type TestServer } from '../server/support/testServer';
import { setUpField } from '../server/support/fieldSetup';
import { makePerson, type TestPerson } from '../server/support/people';
import { Phone } from '../server/support/phone';

const RUNS = Number(process.env.FIELD_SYNC_RUNS ?? 1000);

/** The server's copies of one end's writer records as a phone stored them (in its card's row). */
const storedRecords = async (db: LocalDb, sessionId: number, entryId: number, endIndex: number) =>
  ((await db.cardRecords.get(cardKeyOf(sessionId, entryId)))?.records ?? []).filter(
    (r) => r.endIndex === endIndex,
  );
const ARCHERS = 2;
const ENDS = 2;
const VALUES = scoringValues('full-122', 'recurve', 'outdoor');

type Who = 'w1' | 'w2' | 'caller';
type Fault = 'none' | 'drop-request' | 'drop-response' | 'duplicate' | 'split' | 'reorder' | 'too-large';
/** Changes a phone may hold that this server cannot read. */
type Unreadable = 'unknown-kind' | 'offset-at' | 'bad-slot';
type Action =
  | { type: 'write'; writer: 'w1' | 'w2'; archer: number; end: number; arrows: ArrowValue[] }
  | { type: 'unreadable'; writer: 'w1' | 'w2'; archer: number; end: number; variant: Unreadable }
  | { type: 'settle'; archer: number; end: number; picks: boolean[]; dispute: boolean }
  | { type: 'sync'; who: Who; fault: Fault }
  | { type: 'reload'; who: Who }
  | { type: 'restart' };

const action: fc.Arbitrary<Action> = fc.oneof(
  {
    weight: 5,
    arbitrary: fc.record({
      type: fc.constant('write' as const),
      writer: fc.constantFrom('w1' as const, 'w2' as const),
      archer: fc.nat(ARCHERS - 1),
      end: fc.nat(ENDS - 1),
      arrows: fc.array(fc.constantFrom(...VALUES), { maxLength: 6 }),
    }),
  },
  {
    weight: 2,
    arbitrary: fc.record({
      type: fc.constant('settle' as const),
      archer: fc.nat(ARCHERS - 1),
      end: fc.nat(ENDS - 1),
      picks: fc.array(fc.boolean(), { minLength: 6, maxLength: 6 }),
      dispute: fc.boolean(),
    }),
  },
  {
    weight: 4,
    arbitrary: fc.record({
      type: fc.constant('sync' as const),
      who: fc.constantFrom<Who>('w1', 'w2', 'caller'),
      fault: fc.constantFrom<Fault>(
        'none',
        'drop-request',
        'drop-response',
        'duplicate',
        'split',
        'reorder',
        'too-large',
      ),
    }),
  },
  {
    weight: 1,
    arbitrary: fc.record({
      type: fc.constant('unreadable' as const),
      writer: fc.constantFrom('w1' as const, 'w2' as const),
      archer: fc.nat(ARCHERS - 1),
      end: fc.nat(ENDS - 1),
      variant: fc.constantFrom<Unreadable>('unknown-kind', 'offset-at', 'bad-slot'),
    }),
  },
  {
    weight: 1,
    arbitrary: fc.record({
      type: fc.constant('reload' as const),
      who: fc.constantFrom<Who>('w1', 'w2', 'caller'),
    }),
  },
  { weight: 1, arbitrary: fc.constant({ type: 'restart' as const }) },
);

let server: TestServer;
/** The server's database handle; a restart swaps it for a new connection to the same file. */
let serverDb: Db;
const extraDbs: Db[] = [];
beforeAll(async () => {
  server = await startTestServer();
  serverDb = server.db;
});
afterAll(async () => {
  for (const db of extraDbs) await db.destroy();
  await server.close();
});

const lost = () => new ApiError(0, 'network', 'No connection to the Ringcall server right now.');
/** What the server answers a batch over its limit (here: more than two changes), holding none of it. */
const TOO_LARGE_OVER = 2;
const tooLarge = () => new ApiError(413, 'too_large', 'Send at most 2 changes at once.');

/** Talks to the real server services, as JSON, with the network fault of this sync round. */
function transportFor(person: TestPerson, fault: Fault): SyncTransport {
  const send = async (body: PushRequest): Promise<PushResponse> =>
    pushAndPull(serverDb, person.id, pushRequestSchema.parse(JSON.parse(JSON.stringify(body))), {}, 7);
  return {
    async push(body) {
      switch (fault) {
        case 'drop-request':
          throw lost();
        case 'drop-response':
          await send(body);
          throw lost();
        case 'duplicate':
          await send(body);
          return send(body);
        case 'split': {
          const half = Math.ceil(body.mutations.length / 2);
          const a = await send({ ...body, mutations: body.mutations.slice(0, half) });
          if (half >= body.mutations.length) return a;
          const b = await send({ ...body, mutations: body.mutations.slice(half) });
          const results: MutationResult[] = [...a.results, ...b.results];
          return { ...b, results };
        }
        case 'reorder':
          return send({ ...body, mutations: [...body.mutations].reverse() });
        case 'too-large':
          if (body.mutations.length > TOO_LARGE_OVER) throw tooLarge();
          return send(body);
        case 'none':
          return send(body);
      }
    },
    pull: async (cursor) => pullChanges(serverDb, person.id, { cursor, limit: 7 }),
  };
}

let phoneCounter = 0;

type PhoneState = { who: Who; person: TestPerson; db: LocalDb; target: JoinedTarget };

async function runHistory(actions: Action[]): Promise<void> {
  const field = await setUpField(serverDb, {
    divisions: [{ name: 'Recurve Women', bowStyle: 'recurve', roundId: '70m' }],
    targets: [
      {
        number: 1,
        archers: [
          { name: 'Ada Fletcher', division: 'Recurve Women' },
          { name: 'Bea Quill', division: 'Recurve Women' },
        ],
      },
    ],
  });
  const code = field.targets.get(1)!.code;
  const phones = new Map<Who, PhoneState>();
  for (const [who, task] of [
    ['w1', 'writer1'],
    ['w2', 'writer2'],
    ['caller', 'caller'],
  ] as const) {
    const person = await makePerson(serverDb, who);
    const pkg = await new Phone(server.app, person).join(code, task);
    phoneCounter += 1;
    const db = new LocalDb(`field-${phoneCounter}`);
    const target: JoinedTarget = {
      ...pkg,
      key: targetKeyOf(person.id, pkg.session.id, 1),
      userId: person.id,
      joinedAt: new Date().toISOString(),
    };
    await db.targets.put(target);
    phones.set(who, { who, person, db, target });
  }
  const sessionId = field.sessionId;
  const entryIds = field.targets.get(1)!.archers.map((a) => a.entryId);
  const lastWrite = new Map<string, ArrowValue[]>();
  const unreadable = new Set<string>();

  try {
    for (const a of actions) {
      if (a.type === 'write') {
        const p = phones.get(a.writer)!;
        const slot = a.writer === 'w1' ? 1 : 2;
        await recordChange(p.db, p.person.id, {
          kind: 'end.write',
          args: {
            sessionId,
            entryId: entryIds[a.archer]!,
            endIndex: a.end,
            slot,
            arrows: a.arrows,
            flags: [],
          },
        });
        lastWrite.set(`${entryIds[a.archer]}:${a.end}:${slot}`, a.arrows);
      } else if (a.type === 'unreadable') {
        const p = phones.get(a.writer)!;
        const args = {
          sessionId,
          entryId: entryIds[a.archer]!,
          endIndex: a.end,
          slot: a.variant === 'bad-slot' ? 3 : a.writer === 'w1' ? 1 : 2,
          arrows: ['10'],
          flags: [],
        };
        const kind = a.variant === 'unknown-kind' ? 'end.erase' : 'end.write';
        const row = await recordChange(p.db, p.person.id, { kind, args } as unknown as Parameters<
          typeof recordChange
        >[2]);
        if (a.variant === 'offset-at')
          await p.db.outbox.update([row.clientId, row.seq], { at: row.at.replace('Z', '+00:00') });
        unreadable.add(row.id);
      } else if (a.type === 'settle') {
        const p = phones.get('caller')!;
        const key = endKeyOf(sessionId, entryIds[a.archer]!, a.end);
        const local = localEnd(
          await storedRecords(p.db, sessionId, entryIds[a.archer]!, a.end),
          await p.db.settlements.get(key),
          await p.db.outbox.where('endKey').equals(key).toArray(),
        );
        const view = endView(local.facts);
        if (view.state !== 'mismatch' || !local.slots[1] || !local.slots[2]) continue;
        const differing = view.check.arrows.filter((x) => !x.same).map((x) => x.index);
        const arrows = view.check.arrows
          .map((x) => (a.picks[x.index] ? (x.first ?? x.second) : (x.second ?? x.first)))
          .filter((v): v is ArrowValue => v !== undefined);
        await recordChange(p.db, p.person.id, {
          kind: 'end.settle',
          args: {
            sessionId,
            entryId: entryIds[a.archer]!,
            endIndex: a.end,
            arrows,
            disputed: a.dispute ? [differing[0]!] : [],
            basis: { first: local.slots[1].revision, second: local.slots[2].revision },
          },
        });
      } else if (a.type === 'sync') {
        const p = phones.get(a.who)!;
        await syncOnce(p.db, p.person.id, transportFor(p.person, a.fault)).catch((error: unknown) => {
          if (!(error instanceof ApiError && error.status === 0)) throw error;
        });
      } else if (a.type === 'reload') {
        const p = phones.get(a.who)!;
        p.db.close();
        p.db = new LocalDb(p.db.name);
      } else {
        // A server restart: a new connection to the same database file.
        const next = openDb(server.file);
        extraDbs.push(next);
        serverDb = next;
      }
    }

    // Signal returns for good: sync until nothing waits, then once more so everyone has pulled everything.
    for (let round = 0; round < 10; round += 1) {
      for (const p of phones.values()) await syncOnce(p.db, p.person.id, transportFor(p.person, 'none'));
      const waiting = await Promise.all(
        [...phones.values()].map((p) => p.db.outbox.where('status').equals('pending').count()),
      );
      if (waiting.every((n) => n === 0)) break;
    }
    for (const p of phones.values()) await syncOnce(p.db, p.person.id, transportFor(p.person, 'none'));

    await checkOutcome(phones, sessionId, entryIds, lastWrite, unreadable);
  } finally {
    for (const p of phones.values()) await p.db.delete();
  }
}

type ServerRecord = { arrows_json: string; flags_json: string; revision: number };
const asFacts = (row: ServerRecord | undefined) =>
  row && { arrows: JSON.parse(row.arrows_json), revision: row.revision, flags: JSON.parse(row.flags_json) };

async function checkOutcome(
  phones: Map<Who, PhoneState>,
  sessionId: number,
  entryIds: number[],
  lastWrite: Map<string, ArrowValue[]>,
  unreadable: Set<string>,
) {
  // Exactly once: the server's log holds each phone change once, with the phone's final status.
  for (const p of phones.values()) {
    const outbox = await p.db.outbox.orderBy('[clientId+seq]').toArray();
    expect(outbox.filter((r) => r.status === 'pending')).toEqual([]);
    const logged = await serverDb('mutations')
      .where({ user_id: p.person.id })
      .orderBy('seq')
      .select('seq', 'mutation_uuid', 'status');
    expect(logged.map((r) => [r.seq, r.mutation_uuid, r.status])).toEqual(
      outbox.map((r) => [r.seq, r.id, r.status]),
    );
    // Writers' readable changes are always valid here: none may be refused; every unreadable one is.
    for (const r of outbox) {
      if (unreadable.has(r.id)) expect(r.reason).toMatch(/^This change could not be read: /);
      else if (p.who !== 'caller') expect(r.status).toBe('applied');
    }
  }

  // No arrow lost: each writer record on the server is that writer's last entry; none counted twice:
  // its revision is the number of writes the writer made to it.
  const serverRecords = await serverDb('end_entries').where({ session_id: sessionId });
  for (const [key, arrows] of lastWrite) {
    const [entryId, endIndex, slot] = key.split(':').map(Number);
    const row = serverRecords.find(
      (r) => r.entry_id === entryId && r.end_index === endIndex && r.slot === slot,
    );
    expect(row, `server record ${key}`).toBeDefined();
    expect(JSON.parse(row.arrows_json)).toEqual(
      [...arrows].sort((x, y) => VALUES.indexOf(x) - VALUES.indexOf(y)),
    );
    const writer = phones.get(slot === 1 ? 'w1' : 'w2')!;
    const writes = (await writer.db.outbox.toArray()).filter(
      (r) =>
        !unreadable.has(r.id) &&
        r.kind === 'end.write' &&
        (r.args as EndWriteArgs).entryId === entryId &&
        (r.args as EndWriteArgs).endIndex === endIndex,
    ).length;
    expect(row.revision).toBe(writes);
  }
  expect(serverRecords).toHaveLength(lastWrite.size);

  // Every phone converges on the server's cards.
  const serverSettlements = await serverDb('end_settlements').where({ session_id: sessionId });
  for (const p of phones.values()) {
    for (const entryId of entryIds) {
      for (let endIndex = 0; endIndex < ENDS; endIndex += 1) {
        const key = endKeyOf(sessionId, entryId, endIndex);
        const local = localEnd(
          await storedRecords(p.db, sessionId, entryId, endIndex),
          await p.db.settlements.get(key),
          [],
        );
        const records = serverRecords.filter((r) => r.entry_id === entryId && r.end_index === endIndex);
        const settlement = serverSettlements.find((s) => s.entry_id === entryId && s.end_index === endIndex);
        const fromServer = {
          first: asFacts(records.find((r) => r.slot === 1)),
          second: asFacts(records.find((r) => r.slot === 2)),
          settlement: settlement && {
            arrows: JSON.parse(settlement.arrows_json),
            disputed: JSON.parse(settlement.disputed_json),
            basis: JSON.parse(settlement.basis_json),
          },
        };
        expect(local.facts).toEqual(fromServer);
        expect(endView(local.facts)).toEqual(endView(fromServer));
      }
    }
  }
}

describe('field sync: nothing lost, nothing doubled, everyone converges', () => {
  it(
    `holds over ${RUNS} random histories with faults, reloads and restarts`,
    async () => {
      await fc.assert(
        fc.asyncProperty(fc.array(action, { minLength: 1, maxLength: 24 }), (actions) => runHistory(actions)),
        { numRuns: RUNS },
      );
    },
    30 * 60_000,
  );
});
