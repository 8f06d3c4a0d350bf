import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { LocalDb, type OutboxRow } from '../../src/local/db';
import { recordChange } from '../../src/local/outbox';
import { syncOnce, type SyncTransport } from '../../src/local/syncEngine';
import { waitingInWords } from '../../src/local/waitingInWords';
import type { EventResults, ShootOffRecordArgs, StandingRow } from '../../src/contract/results';
import { equalAt, shootOffGroups } from '../../src/features/desk/shootOffGroups';

const dbs: LocalDb[] = [];
afterEach(async () => {
  for (const db of dbs.splice(0)) await db.delete();
});

const row = (entryId: number, place: number, extra: Partial<StandingRow> = {}): StandingRow => ({
  entryId,
  name: `Archer ${entryId}`,
  club: 'Club',
  targetNumber: 5,
  total: 700,
  tens: 50,
  second: 20,
  hits: 72,
  endsShot: 12,
  totalEnds: 12,
  place,
  tied: true,
  shootOff: true,
  decidedByShootOff: false,
  shootOffArrows: [],
  trust: 'signed',
  className: '',
  ...extra,
});

/** Ada (1) and Bea (2) level on 700 for first place; Cy (3) alone behind. */
const results = (rows: StandingRow[], cut: number | null = null): EventResults => ({
  event: { id: 1, name: 'Cup', venue: 'Field', published: true, teamSize: 3 },
  computedAt: '2026-12-02T10:00:00.000Z',
  finalCards: 0,
  totalCards: 3,
  sessions: [
    {
      sessionId: 9,
      name: 'Morning',
      divisions: [
        {
          divisionId: 4,
          name: 'Compound',
          roundName: '50 m',
          venue: 'outdoor',
          classes: [],
          secondCount: 'Xs',
          cut,
          teams: [],
          rows,
        },
      ],
    },
  ],
});
const level = [row(1, 1), row(2, 1), row(3, 3, { total: 650, tied: false, shootOff: false })];

let seq = 0;
const change = (
  args: Omit<ShootOffRecordArgs, 'sessionId' | 'closer'> & { closer?: boolean },
  status: OutboxRow['status'] = 'pending',
): OutboxRow => ({
  clientId: 'phone.1',
  seq: ++seq,
  id: `c${seq}`,
  userId: 1,
  kind: 'shootoff.record',
  args: { sessionId: 9, closer: false, ...args },
  at: '2026-12-02T10:01:00.000Z',
  endKey: `9:${args.entryId}:shootoff:${args.arrowIndex}`,
  status,
});

describe('the judge’s shoot-offs on the phone', () => {
  it('lists the tie that decides a medal and leaves archers who are not level out', () => {
    const [group, ...others] = shootOffGroups(results(level), []);
    expect(others).toEqual([]);
    expect(group!.archers.map((a) => [a.entryId, a.place, a.level])).toEqual([
      [1, 1, true],
      [2, 1, true],
    ]);
    expect(group!.nextArrow).toBe(0);
    expect(group!.settled).toBe(false);
  });

  it('orders the archers by arrows still waiting to sync, equal values by the measured distance', () => {
    const waiting = [
      change({ entryId: 1, arrowIndex: 0, value: '9' }),
      change({ entryId: 2, arrowIndex: 0, value: '9' }),
    ];
    const equal = shootOffGroups(results(level), waiting)[0]!;
    expect(equal.settled).toBe(false);
    expect([...equalAt(equal, 0)].sort()).toEqual([1, 2]);
    expect(equal.archers[0]!.arrows).toEqual([{ value: '9', state: 'waiting' }]);

    const measured = [
      ...waiting,
      change({ entryId: 1, arrowIndex: 0, value: '9', distanceMm: 40 }),
      change({ entryId: 2, arrowIndex: 0, value: '9', distanceMm: 25 }),
    ];
    const decided = shootOffGroups(results(level), measured)[0]!;
    expect(decided.settled).toBe(true);
    expect(decided.archers.map((a) => [a.entryId, a.place])).toEqual([
      [2, 1],
      [1, 2],
    ]);
  });

  it('uses the server’s arrows, skips refused changes, and keeps X and 10 equal', () => {
    const server = [
      row(1, 1, { shootOffArrows: [{ value: 'X' }] }),
      row(2, 1, { shootOffArrows: [{ value: '10' }] }),
    ];
    const group = shootOffGroups(results(server), [
      change({ entryId: 1, arrowIndex: 0, value: 'M' }, 'rejected'),
    ])[0]!;
    expect(group.archers.find((a) => a.entryId === 1)!.arrows).toEqual([{ value: 'X', state: 'synced' }]);
    expect(equalAt(group, 0).size).toBe(2);
    expect(group.nextArrow).toBe(1);
  });

  it('applies the cut from where the group starts: a tie below the cut is not shot off', () => {
    // Places 2 and 3 level, cut 2: one goes through. Bea wins the arrow.
    const rows = [row(7, 1, { total: 720, tied: false, shootOff: false }), row(1, 2), row(2, 2)];
    const group = shootOffGroups(results(rows, 2), [
      change({ entryId: 1, arrowIndex: 0, value: '8' }),
      change({ entryId: 2, arrowIndex: 0, value: '10' }),
    ])[0]!;
    expect(group.archers.map((a) => [a.entryId, a.place, a.level])).toEqual([
      [2, 2, false],
      [1, 3, false],
    ]);
  });

  it('keeps a shoot-off arrow in the outbox until the server takes it, in the judge’s words', async () => {
    const db = new LocalDb('shootoff-outbox');
    dbs.push(db);
    const stored = await recordChange(db, 3, {
      kind: 'shootoff.record',
      args: { sessionId: 9, entryId: 2, arrowIndex: 0, value: '9', distanceMm: 25, closer: false },
    });
    expect(stored.endKey).toBe('9:2:shootoff:0');
    expect(await waitingInWords(db, 3)).toEqual(['Your shoot-off arrow 1 of an archer']);
    const sent: unknown[] = [];
    const transport: SyncTransport = {
      push: async (body) => {
        sent.push(...body.mutations);
        return {
          results: body.mutations.map((m) => ({ seq: m.seq, id: m.id, status: 'applied' as const })),
          lastSeq: body.mutations.at(-1)?.seq ?? 0,
        };
      },
      pull: async () => ({ changes: [], cursor: 0, hasMore: false }),
    };
    await syncOnce(db, 3, transport);
    expect(sent).toMatchObject([{ kind: 'shootoff.record', args: { entryId: 2, distanceMm: 25 } }]);
    expect((await db.outbox.toArray()).map((r) => r.status)).toEqual(['applied']);
    // Sent once: a second sync has nothing to send.
    await syncOnce(db, 3, transport);
    expect(sent).toHaveLength(1);
  });
});
