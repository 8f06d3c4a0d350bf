import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Conflict, Target, TargetList } from '../../src/contract/events';
import { startTestServer, type TestServer } from './support/testServer';
import { addArchers, setUpEvent, type SetUpEvent } from './support/eventSetup';
import { planTargets } from '../../server/services/organizer/targetAssignment';
import { findConflicts, type PlacedArcher } from '../../server/services/organizer/targetConflicts';
import {
  JOIN_CODE_ALPHABET,
  JOIN_CODE_LENGTH,
  randomJoinCode,
} from '../../server/services/organizer/joinCodes';
import { facesPerTarget } from '../../server/services/organizer/targetFaces';
import { getRound } from '../../src/core';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

/** Recurve Women (6) and Recurve Men (5) on the 70 m round, Compound Men (3) on the 50 m six-ring, Barebow Women (2) not in the session. */
async function fieldOf16(): Promise<
  SetUpEvent & { sessionId: number; ids: Record<'rw' | 'rm' | 'cm' | 'bw', number[]> }
> {
  const setup = await setUpEvent(server.app, server.db, [
    { bowStyle: 'recurve', className: 'Women' },
    { bowStyle: 'recurve', className: 'Men' },
    { bowStyle: 'compound', className: 'Men' },
    { bowStyle: 'barebow', className: 'Women' },
  ]);
  const ids = {
    rw: await addArchers(setup, 'Recurve Women', 6),
    rm: await addArchers(setup, 'Recurve Men', 5),
    cm: await addArchers(setup, 'Compound Men', 3),
    bw: await addArchers(setup, 'Barebow Women', 2),
  };
  const session = await setup.api('post', '/sessions', {
    name: 'Qualification',
    startsAt: '2026-12-12T09:00',
    rounds: [
      { divisionId: setup.divisions['Recurve Women'], roundId: '70m' },
      { divisionId: setup.divisions['Compound Men'], roundId: '50m-compound' },
      { divisionId: setup.divisions['Recurve Men'], roundId: '70m' },
    ],
  });
  return { ...setup, sessionId: session.body.id, ids };
}

const where = (list: TargetList, entryId: number) => {
  for (const t of list.targets)
    for (const a of t.archers) if (a.entryId === entryId) return `${t.targetNumber}${a.position}`;
  return null;
};

describe('automatic assignment', () => {
  it('groups by round and division, up to four per target in A–D, numbering on from 1', async () => {
    const f = await fieldOf16();
    const res = await f.api('post', `/sessions/${f.sessionId}/assign`);
    expect(res.status).toBe(200);
    const list = res.body as TargetList & { assigned: number };
    expect(list.assigned).toBe(14);
    // 70 m: Recurve Women 4+2 (targets 1–2), Recurve Men 4+1 (3–4); then the six-ring: Compound Men 3 (5).
    expect(
      list.targets.map((t: Target) => [t.targetNumber, t.archers.map((a) => a.position).join('')]),
    ).toEqual([
      [1, 'ABCD'],
      [2, 'AB'],
      [3, 'ABCD'],
      [4, 'A'],
      [5, 'ABC'],
    ]);
    for (const t of list.targets) {
      expect(t.archers.length).toBeLessThanOrEqual(4);
      expect(new Set(t.archers.map((a) => a.divisionName)).size).toBe(1);
      expect(new Set(t.archers.map((a) => a.roundName)).size).toBe(1);
    }
    expect(list.targets[0]!.archers[0]).toMatchObject({
      name: 'Recurve Women archer 1',
      bowStyle: 'recurve',
      roundName: '70 m round',
      faces: ['122 cm face'],
    });
    // Shared 122 cm face; one 80 cm six-ring face per archer.
    expect(list.targets[0]).toMatchObject({ facesPerTarget: 1, faceUse: 'shared' });
    expect(list.targets[4]).toMatchObject({ facesPerTarget: 3, faceUse: 'one-per-archer' });
    // Barebow Women shoot nothing in this session: neither placed nor missing.
    expect(list.unassigned).toEqual([]);
    expect(list.conflicts).toEqual([]);
    expect(f.ids.bw.map((id) => where(list, id))).toEqual([null, null]);
  });

  it('gives every target a join code, and keeps them when assigning again', async () => {
    const f = await fieldOf16();
    const first = (await f.api('post', `/sessions/${f.sessionId}/assign`)).body as TargetList;
    const codes = first.targets.map((t) => t.joinCode!.code);
    expect(new Set(codes).size).toBe(5);
    for (const code of codes)
      expect(code).toMatch(new RegExp(`^[${JOIN_CODE_ALPHABET}]{${JOIN_CODE_LENGTH}}$`));
    expect(first.targets[0]!.joinCode!.joinUrl).toMatch(new RegExp(`/join\\?code=${codes[0]}$`));
    expect(first.targets[0]!.joinCode!.qrDataUrl).toMatch(/^data:image\/png;base64,/);
    const again = (await f.api('post', `/sessions/${f.sessionId}/assign`)).body as TargetList;
    expect(again.targets.map((t) => t.joinCode!.code)).toEqual(codes);
  });

  it('refuses a session nobody shoots in, and a closed session', async () => {
    const setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Women' }]);
    const s = await setup.api('post', '/sessions', {
      name: 'Empty',
      startsAt: '2026-12-12T09:00',
      rounds: [],
    });
    const res = await setup.api('post', `/sessions/${s.body.id}/assign`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/No archer shoots in this session yet/);
    const f = await fieldOf16();
    await f.api('post', `/sessions/${f.sessionId}/close`);
    const closed = await f.api('post', `/sessions/${f.sessionId}/assign`);
    expect(closed.status).toBe(409);
    expect(closed.body.error.message).toMatch(/closed/);
  });

  it('plans targets purely: groups, four a target, numbering across groups', () => {
    const a = 'setup-a';
    const b = 'setup-b';
    const entries = [
      ...Array.from({ length: 9 }, (_, i) => ({
        entryId: i + 1,
        name: `A${i}`,
        divisionId: 1,
        setupKey: a,
        club: '',
      })),
      ...Array.from({ length: 2 }, (_, i) => ({
        entryId: 20 + i,
        name: `B${i}`,
        divisionId: 2,
        setupKey: b,
        club: '',
      })),
      { entryId: 30, name: 'C', divisionId: 3, setupKey: a, club: '' },
      { entryId: 40, name: 'None', divisionId: 4, setupKey: null, club: '' },
    ];
    const plan = planTargets(entries);
    const at = (id: number) => plan.find((p) => p.entryId === id);
    expect(plan).toHaveLength(12);
    expect(at(1)).toEqual({ entryId: 1, targetNumber: 1, position: 'A' });
    expect(at(9)).toEqual({ entryId: 9, targetNumber: 3, position: 'A' });
    // Division 3 shares division 1's setup, so it follows it before setup b starts.
    expect(at(30)).toEqual({ entryId: 30, targetNumber: 4, position: 'A' });
    expect(at(20)).toEqual({ entryId: 20, targetNumber: 5, position: 'A' });
    expect(at(40)).toBeUndefined();
    const perTarget = new Map<number, number>();
    for (const p of plan) perTarget.set(p.targetNumber, (perTarget.get(p.targetNumber) ?? 0) + 1);
    expect(Math.max(...perTarget.values())).toBeLessThanOrEqual(4);
  });
});

describe('clubmates on targets', () => {
  const archer = (entryId: number, name: string, club: string) => ({
    entryId,
    name,
    divisionId: 1,
    setupKey: 'a',
    club,
  });
  const targetsOf = (plan: { entryId: number; targetNumber: number }[], ids: number[]) =>
    ids.map((id) => plan.find((p) => p.entryId === id)!.targetNumber);

  it('spreads two archers of one club over two targets when name order would put them together', () => {
    // In name order Ada and Bea (one club) would both be on target 1.
    const plan = planTargets([
      archer(1, 'Ada', 'Heron'),
      archer(2, 'Bea', 'Heron'),
      archer(3, 'Cal', 'Lark'),
      archer(4, 'Dot', 'Wren'),
      archer(5, 'Eve', 'Finch'),
      archer(6, 'Fay', 'Rook'),
    ]);
    const [ada, bea] = targetsOf(plan, [1, 2]);
    expect(ada).not.toBe(bea);
    // Still four on the first target, and positions in name order on each target.
    expect(plan.filter((p) => p.targetNumber === 1)).toHaveLength(4);
    const first = plan
      .filter((p) => p.targetNumber === 1)
      .sort((x, y) => x.position.localeCompare(y.position));
    expect(first.map((p) => p.entryId)).toEqual([...first.map((p) => p.entryId)].sort((x, y) => x - y));
  });

  it('keeps name order when no club shares a target, and clubmates together when there is no other room', () => {
    const apart = planTargets([
      archer(1, 'Ada', 'Heron'),
      archer(2, 'Bea', 'Lark'),
      archer(3, 'Cal', 'Heron'),
    ]);
    expect(apart.map((p) => `${p.targetNumber}${p.position}`)).toEqual(['1A', '1B', '1C']);
    const together = planTargets([archer(1, 'Ada', 'Heron'), archer(2, 'Bea', 'Heron')]);
    expect(targetsOf(together, [1, 2])).toEqual([1, 1]);
  });
});

describe('moving and swapping by hand', () => {
  it('moves an archer to a free position and refuses a taken one', async () => {
    const f = await fieldOf16();
    await f.api('post', `/sessions/${f.sessionId}/assign`);
    const archer = f.ids.rw[5]!; // on 2B
    const moved = await f.api('post', `/sessions/${f.sessionId}/assignments/move`, {
      entryId: archer,
      targetNumber: 4,
      position: 'D',
    });
    expect(moved.status).toBe(200);
    expect(where(moved.body, archer)).toBe('4D');
    // 4A holds a Recurve Men archer, 4D now a Recurve Women archer: same round, no conflict.
    expect(moved.body.conflicts).toEqual([]);
    const taken = await f.api('post', `/sessions/${f.sessionId}/assignments/move`, {
      entryId: archer,
      targetNumber: 1,
      position: 'A',
    });
    expect(taken.status).toBe(409);
    expect(taken.body.error.message).toMatch(
      /Target 1A is taken by Recurve Women archer 1. Swap the two archers instead/,
    );
    const newTarget = await f.api('post', `/sessions/${f.sessionId}/assignments/move`, {
      entryId: archer,
      targetNumber: 12,
      position: 'C',
    });
    expect(newTarget.body.targets.find((t: Target) => t.targetNumber === 12).joinCode.code).toEqual(
      expect.any(String),
    );
    expect(
      await server.db('audit_log').where({ event_id: f.eventId, action: 'targets.moved' }).first(),
    ).toBeTruthy();
  });

  it('shows mixed rounds on a target as a conflict rather than refusing or fixing it', async () => {
    const f = await fieldOf16();
    await f.api('post', `/sessions/${f.sessionId}/assign`);
    const compound = f.ids.cm[0]!;
    const res = await f.api('post', `/sessions/${f.sessionId}/assignments/move`, {
      entryId: compound,
      targetNumber: 2,
      position: 'C',
    });
    expect(res.status).toBe(200);
    const mixed = res.body.conflicts.filter((c: Conflict) => c.kind === 'mixed-rounds');
    expect(mixed).toHaveLength(1);
    expect(mixed[0]).toMatchObject({ targetNumber: 2 });
    expect(mixed[0].message).toMatch(
      /Target 2 mixes rounds or faces: .*\(70 m round\); Compound Men archer 1 \(50 m compound round\)/,
    );
    const target2 = res.body.targets.find((t: Target) => t.targetNumber === 2);
    expect(target2.facesPerTarget).toBe(3);
  });

  it('swaps two archers in one transaction', async () => {
    const f = await fieldOf16();
    await f.api('post', `/sessions/${f.sessionId}/assign`);
    const [a, b] = [f.ids.rw[0]!, f.ids.rm[0]!]; // 1A and 3A
    const res = await f.api('post', `/sessions/${f.sessionId}/assignments/swap`, {
      entryId: a,
      otherEntryId: b,
    });
    expect(res.status).toBe(200);
    expect([where(res.body, a), where(res.body, b)]).toEqual(['3A', '1A']);
    const rows = await server.db('target_assignments').where({ session_id: f.sessionId });
    expect(rows).toHaveLength(14);
    const same = await f.api('post', `/sessions/${f.sessionId}/assignments/swap`, {
      entryId: a,
      otherEntryId: a,
    });
    expect(same.status).toBe(400);
    expect(same.body.error.message).toMatch(/two different archers/);
  });

  it('takes an archer off a target, which then shows as unassigned; swapping with them is refused', async () => {
    const f = await fieldOf16();
    await f.api('post', `/sessions/${f.sessionId}/assign`);
    const a = f.ids.rm[4]!;
    const res = await f.api('delete', `/sessions/${f.sessionId}/assignments/${a}`);
    expect(res.status).toBe(200);
    expect(res.body.unassigned).toEqual([
      { entryId: a, name: 'Recurve Men archer 5', divisionName: 'Recurve Men', roundName: '70 m round' },
    ]);
    expect(res.body.conflicts).toEqual([
      {
        kind: 'unassigned',
        targetNumber: null,
        entryIds: [a],
        message: 'Recurve Men archer 5 (Recurve Men) has no target yet.',
      },
    ]);
    const swap = await f.api('post', `/sessions/${f.sessionId}/assignments/swap`, {
      entryId: a,
      otherEntryId: f.ids.rm[0],
    });
    expect(swap.status).toBe(409);
    expect(swap.body.error.message).toMatch(/has no target in this session yet/);
    expect((await f.api('delete', `/sessions/${f.sessionId}/assignments/${a}`)).status).toBe(404);
  });

  it('shows an archer whose division lost its round in the session; refuses to move an archer with no round', async () => {
    const f = await fieldOf16();
    await f.api('post', `/sessions/${f.sessionId}/assign`);
    await f.api('patch', `/sessions/${f.sessionId}`, {
      rounds: [
        { divisionId: f.divisions['Recurve Women'], roundId: '70m' },
        { divisionId: f.divisions['Recurve Men'], roundId: '70m' },
      ],
    });
    const list = (await f.api('get', `/sessions/${f.sessionId}/targets`)).body as TargetList;
    const noRound = list.conflicts.filter((c) => c.kind === 'no-round');
    expect(noRound).toHaveLength(3);
    expect(noRound[0]!.message).toMatch(
      /Compound Men archer 1 is on target 5A, but Compound Men has no round in this session/,
    );
    const move = await f.api('post', `/sessions/${f.sessionId}/assignments/move`, {
      entryId: f.ids.bw[0],
      targetNumber: 9,
      position: 'A',
    });
    expect(move.status).toBe(409);
    expect(move.body.error.message).toMatch(/Barebow Women, has no round in this session/);
  });

  it('refuses bad move input with readable messages', async () => {
    const f = await fieldOf16();
    const res = await f.api('post', `/sessions/${f.sessionId}/assignments/move`, {
      entryId: f.ids.rw[0],
      targetNumber: 0,
      position: 'E',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/targetNumber: A number above 0/);
    expect(res.body.error.message).toMatch(/position: Choose position A, B, C or D/);
    const missing = await f.api('post', `/sessions/${f.sessionId}/assignments/move`, {
      entryId: 999999,
      targetNumber: 1,
      position: 'A',
    });
    expect(missing.status).toBe(404);
  });
});

describe('conflicts (pure), for layouts the database itself would refuse', () => {
  const archer = (
    entryId: number,
    targetNumber: number,
    position: string,
    setupKey: string | null = 's1',
  ): PlacedArcher => ({
    entryId,
    name: `Archer ${entryId}`,
    divisionName: 'Recurve Men',
    targetNumber,
    position,
    setupKey,
    roundName: setupKey ? `Round ${setupKey}` : null,
  });

  it('finds two archers in one position, more than four on a target, mixed rounds and unassigned archers', () => {
    const conflicts = findConflicts(
      [
        archer(1, 1, 'A'),
        archer(2, 1, 'A'),
        archer(3, 1, 'B'),
        archer(4, 1, 'C'),
        archer(5, 1, 'D'),
        archer(6, 2, 'A'),
        archer(7, 2, 'B', 's2'),
      ],
      [{ entryId: 8, name: 'Archer 8', divisionName: 'Recurve Men' }],
    );
    expect(conflicts.map((c) => [c.kind, c.targetNumber, c.entryIds])).toEqual([
      ['position-taken', 1, [1, 2]],
      ['too-many', 1, [1, 2, 3, 4, 5]],
      ['mixed-rounds', 2, [6, 7]],
      ['unassigned', null, [8]],
    ]);
    expect(conflicts[0]!.message).toBe(
      'Target 1A holds 2 archers: Archer 1 and Archer 2. Move all but one of them.',
    );
    expect(conflicts[1]!.message).toMatch(/Target 1 has 5 archers; a target takes at most 4. Move 1 of them/);
  });

  it('finds nothing in a clean layout', () => {
    expect(findConflicts([archer(1, 1, 'A'), archer(2, 1, 'B'), archer(3, 2, 'A')], [])).toEqual([]);
  });
});

describe('faces per target', () => {
  it('is one shared face on 122 cm, one per archer on the six-ring and the triple face', () => {
    // Product brief: four archers shoot one shared face; on the 80 cm six-ring or 40 cm triple each position has its own.
    expect(facesPerTarget([getRound('70m')], 4)).toBe(1);
    expect(facesPerTarget([getRound('50m-compound')], 4)).toBe(4);
    expect(facesPerTarget([getRound('18m-triple')], 3)).toBe(3);
    expect(facesPerTarget([getRound('1440-men')], 4)).toBe(1);
  });
});

describe('join codes', () => {
  it('draws codes only from the unambiguous alphabet', () => {
    expect(JOIN_CODE_ALPHABET).not.toMatch(/[0O1IL8B]/);
    for (let i = 0; i < 500; i += 1) expect(randomJoinCode()).toMatch(/^[ACDEFGHJKMNPQRSTUVWXYZ2345679]{6}$/);
  });

  it('keeps codes unique across sessions and events (the database refuses a repeat)', async () => {
    const one = await fieldOf16();
    const two = await fieldOf16();
    await one.api('post', `/sessions/${one.sessionId}/assign`);
    await two.api('post', `/sessions/${two.sessionId}/assign`);
    const codes = (await server.db('join_codes').select('code')).map((r) => r.code);
    expect(new Set(codes).size).toBe(codes.length);
    const row = await server.db('join_codes').first();
    await expect(
      server
        .db('join_codes')
        .insert({ session_id: row.session_id, target_number: 99, code: row.code, created_at: 'x' }),
    ).rejects.toThrow();
  });

  it('re-issues a code (the old one stops working) and revokes without a new one', async () => {
    const f = await fieldOf16();
    const first = (await f.api('post', `/sessions/${f.sessionId}/assign`)).body as TargetList;
    const old = first.targets[0]!.joinCode!.code;
    const reissued = await f.api('post', `/sessions/${f.sessionId}/targets/1/join-code`);
    expect(reissued.status).toBe(200);
    const fresh = reissued.body.targets[0].joinCode.code;
    expect(fresh).not.toBe(old);
    const oldRow = await server.db('join_codes').where({ code: old }).first();
    expect(oldRow.revoked_at).toEqual(expect.any(String));
    const revoked = await f.api('delete', `/sessions/${f.sessionId}/targets/1/join-code`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.targets[0].joinCode).toBeNull();
    expect((await f.api('delete', `/sessions/${f.sessionId}/targets/1/join-code`)).status).toBe(409);
    // On demand: every target without a code gets one.
    const onDemand = await f.api('post', `/sessions/${f.sessionId}/join-codes`);
    expect(onDemand.body.targets.every((t: Target) => t.joinCode !== null)).toBe(true);
    expect((await f.api('post', `/sessions/${f.sessionId}/targets/40/join-code`)).status).toBe(404);
    const actions = (await server.db('audit_log').where({ event_id: f.eventId }).select('action')).map(
      (r) => r.action,
    );
    expect(actions).toEqual(
      expect.arrayContaining(['join_code.issued', 'join_code.revoked', 'join_codes.created']),
    );
  });

  it('will not show the targets of another event’s session', async () => {
    const f = await fieldOf16();
    const other = await setUpEvent(server.app, server.db);
    const res = await request(server.app)
      .get(`/api/events/${other.eventId}/sessions/${f.sessionId}/targets`)
      .set(other.organizer.auth);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('That session does not exist in this event.');
  });
});

describe('once ends are scored', () => {
  it('keeps the layout, the round, the session and the entry that the scores belong to', async () => {
    const f = await fieldOf16();
    await f.api('post', `/sessions/${f.sessionId}/assign`);
    const archer = f.ids.rw[0]!;
    // One written end, as the field loop stores it.
    await server.db('end_entries').insert({
      session_id: f.sessionId,
      entry_id: archer,
      end_index: 0,
      slot: 1,
      arrows_json: '["X","10","9","9","8","7"]',
      flags_json: '[]',
      revision: 1,
      written_by: f.organizer.id,
      written_at: new Date().toISOString(),
      mutation_id: '00000000-0000-4000-8000-000000000001',
    });
    const reassign = await f.api('post', `/sessions/${f.sessionId}/assign`);
    expect(reassign.status).toBe(409);
    expect(reassign.body.error.message).toMatch(/Change places by hand instead/);
    const round = await f.api('patch', `/sessions/${f.sessionId}`, {
      rounds: [
        { divisionId: f.divisions['Recurve Women'], roundId: '18m' },
        { divisionId: f.divisions['Recurve Men'], roundId: '70m' },
        { divisionId: f.divisions['Compound Men'], roundId: '50m-compound' },
      ],
    });
    expect(round.status).toBe(409);
    expect(round.body.error.message).toMatch(/Recurve Women already have scored ends/);
    // Other divisions' rounds may still change.
    const other = await f.api('patch', `/sessions/${f.sessionId}`, {
      rounds: [
        { divisionId: f.divisions['Recurve Women'], roundId: '70m' },
        { divisionId: f.divisions['Recurve Men'], roundId: '70m' },
      ],
    });
    expect(other.status).toBe(200);
    const remove = await f.api('delete', `/entries/${archer}`);
    expect(remove.status).toBe(409);
    expect(remove.body.error.message).toMatch(/already has scored ends/);
    const drop = await f.api('delete', `/sessions/${f.sessionId}`);
    expect(drop.status).toBe(409);
    expect(drop.body.error.message).toMatch(/Close it instead/);
    // Moving by hand is still possible.
    const move = await f.api('post', `/sessions/${f.sessionId}/assignments/move`, {
      entryId: archer,
      targetNumber: 9,
      position: 'A',
    });
    expect(move.status).toBe(200);
  });
});
