import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { CloseCheck, LateValueDto } from '../../src/contract/lateValues';
import type { ChangeDto } from '../../src/contract/sync';
import { readFieldState, replayLog, sortFieldState } from '../../server/services/sync/rebuildFromLog';
import { startTestServer, type TestServer } from './support/testServer';
import { giveRole, makePerson, type TestPerson } from './support/people';
import { pushOne, setUpJudging, writeBoth, type JudgingField } from './support/judging';

/*
 * Closing a session never throws away values still on phones: a change that arrives after the
 * close is held (not refused), a judge accepts it (it takes effect) or rejects it with a reason
 * (which reaches the phone), and the organizer is shown what is missing before closing.
 */

let server: TestServer;
let j: JudgingField;
let judgeOnly: TestPerson;

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
  judgeOnly = await makePerson(server.db, 'Second Judge');
  await giveRole(server.db, j.field.eventId, judgeOnly, 'judge');
});
afterAll(async () => {
  await server.close();
});

const SIX: ArrowValue[] = ['10', '9', '9', '8', '7', '6'];
const base = () => `/api/events/${j.field.eventId}`;
const as = (person: { auth: { Authorization: string } }) => ({
  get: (path: string) => request(server.app).get(path).set(person.auth),
  post: (path: string, body?: object) => request(server.app).post(path).set(person.auth).send(body),
});
const setClosed = (closed: boolean) =>
  server
    .db('event_sessions')
    .where({ id: j.sessionId })
    .update({ closed_at: closed ? new Date().toISOString() : null });
const lateValues = async (): Promise<LateValueDto[]> => {
  const res = await as(j.field.judge).get(`${base()}/sessions/${j.sessionId}/late-values`);
  expect(res.status).toBe(200);
  return res.body as LateValueDto[];
};
const lateChanges = async (changes: ChangeDto[], mutationId: string) =>
  changes.filter((c) => c.type === 'late-value' && c.record.mutationId === mutationId);

describe('values that arrive after the session is closed', () => {
  it('holds a push after the close, lists it on the desk, and answers a repeat the same way', async () => {
    await setClosed(true);
    const phone = j.phones.writer1;
    const m = phone.write({
      sessionId: j.sessionId,
      entryId: j.ada.entryId,
      endIndex: 0,
      slot: 1,
      arrows: SIX,
    });
    const result = await pushOne(phone, m);
    expect(result).toMatchObject({ status: 'held', reason: expect.stringMatching(/kept for a judge/) });
    expect(await server.db('end_entries').where({ mutation_id: m.id }).first()).toBeUndefined();
    expect((await phone.push([m])).results[0]).toMatchObject({ status: 'held' });

    // The phone sends the whole end at each tap: a later value of the end replaces the waiting one.
    const again = phone.write({
      sessionId: j.sessionId,
      entryId: j.ada.entryId,
      endIndex: 0,
      slot: 1,
      arrows: SIX.slice(0, 5),
    });
    const last = phone.write({
      sessionId: j.sessionId,
      entryId: j.ada.entryId,
      endIndex: 0,
      slot: 1,
      arrows: SIX,
    });
    expect((await phone.push([again, last])).results.map((r) => r.status)).toEqual(['held', 'held']);
    const listed = (await lateValues()).filter((l) => l.endIndex === 0 && l.slot === 1);
    expect(listed.map((l) => l.mutationId)).toEqual([last.id]);
    const { changes } = await phone.pull(0);
    for (const replaced of [m, again])
      expect(await lateChanges(changes, replaced.id)).toEqual([
        expect.objectContaining({ record: expect.objectContaining({ status: 'replaced' }) }),
      ]);

    const held = (await lateValues()).find((l) => l.mutationId === last.id);
    expect(held).toMatchObject({
      status: 'waiting',
      targetNumber: 1,
      archerName: 'Ada Fletcher',
      endIndex: 0,
      slot: 1,
      arrows: SIX,
      byName: 'Wren One',
    });
  });

  it('still refuses a late change from someone who does not keep the task', async () => {
    const phone = j.phones.stranger;
    const m = phone.write({
      sessionId: j.sessionId,
      entryId: j.ada.entryId,
      endIndex: 0,
      slot: 1,
      arrows: SIX,
    });
    expect(await pushOne(phone, m)).toMatchObject({
      status: 'rejected',
      reason: expect.stringMatching(/not in the group/),
    });
  });

  it('a judge accepts a late value: the end is updated, the phone hears it, and the log replays it', async () => {
    const phone = j.phones.writer2;
    const m = phone.write({
      sessionId: j.sessionId,
      entryId: j.ada.entryId,
      endIndex: 0,
      slot: 2,
      arrows: SIX,
    });
    expect(await pushOne(phone, m)).toMatchObject({ status: 'held' });
    const late = (await lateValues()).find((l) => l.mutationId === m.id)!;

    const accepted = await as(j.field.judge).post(`${base()}/late-values/${late.id}/accept`);
    expect(accepted.status).toBe(204);
    const row = await server.db('end_entries').where({ mutation_id: m.id }).first();
    expect(JSON.parse(row.arrows_json)).toEqual(SIX);
    expect(row.written_by).toBe(j.people.writer2.id);

    const { changes } = await phone.pull(0);
    expect(await lateChanges(changes, m.id)).toEqual([
      expect.objectContaining({
        record: expect.objectContaining({ status: 'accepted', decidedByName: 'Field Judge' }),
      }),
    ]);
    expect(
      changes.some((c) => c.type === 'end' && c.record.slot === 2 && c.record.entryId === j.ada.entryId),
    ).toBe(true);
    expect((await lateValues()).find((l) => l.id === late.id)).toMatchObject({ status: 'accepted' });

    // Deciding twice is refused; the replay of the log equals the live tables.
    expect((await as(judgeOnly).post(`${base()}/late-values/${late.id}/accept`)).status).toBe(409);
    expect(sortFieldState(await replayLog(server.db))).toEqual(await readFieldState(server.db));
  });

  it('a judge rejects a late value with a reason, which reaches the phone; the end keeps its values', async () => {
    const phone = j.phones.writer1;
    const m = phone.write({
      sessionId: j.sessionId,
      entryId: j.ada.entryId,
      endIndex: 1,
      slot: 1,
      arrows: SIX,
    });
    expect(await pushOne(phone, m)).toMatchObject({ status: 'held' });
    const late = (await lateValues()).find((l) => l.mutationId === m.id)!;

    const noReason = await as(judgeOnly).post(`${base()}/late-values/${late.id}/reject`, { reason: ' ' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.message).toMatch(/why/);
    const rejected = await as(judgeOnly).post(`${base()}/late-values/${late.id}/reject`, {
      reason: 'Entered after the cards were collected; the paper card counts.',
    });
    expect(rejected.status).toBe(204);
    expect(await server.db('end_entries').where({ mutation_id: m.id }).first()).toBeUndefined();
    const { changes } = await phone.pull(0);
    expect(await lateChanges(changes, m.id)).toEqual([
      expect.objectContaining({
        record: expect.objectContaining({
          status: 'rejected',
          reason: 'Entered after the cards were collected; the paper card counts.',
          decidedByName: 'Second Judge',
        }),
      }),
    ]);
    expect(sortFieldState(await replayLog(server.db))).toEqual(await readFieldState(server.db));
  });

  it('an accept that now breaks a rule says why and changes nothing', async () => {
    await setClosed(false);
    await writeBoth(j, j.ada.entryId, 2, SIX);
    await setClosed(true);
    const phone = j.phones.writer1;
    const m = phone.write({
      sessionId: j.sessionId,
      entryId: j.ada.entryId,
      endIndex: 2,
      slot: 1,
      arrows: ['X', '9', '9', '8', '7', '6'],
    });
    expect(await pushOne(phone, m)).toMatchObject({ status: 'held' });
    // Meanwhile a judge signs end 3 with the values the server has.
    expect(
      await pushOne(
        j.phones.judge,
        j.phones.judge.sign({ sessionId: j.sessionId, entryId: j.ada.entryId, endIndex: 2, arrows: SIX }),
      ),
    ).toMatchObject({ status: 'applied' });
    const late = (await lateValues()).find((l) => l.mutationId === m.id)!;
    const res = await as(j.field.judge).post(`${base()}/late-values/${late.id}/accept`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/cannot take effect: End 3 of Ada Fletcher is signed/);
    expect((await lateValues()).find((l) => l.id === late.id)).toMatchObject({ status: 'waiting' });
  });

  it('lets only judges decide, and only staff list', async () => {
    const late = (await lateValues()).find((l) => l.status === 'waiting')!;
    for (const person of [j.people.writer1, j.field.organizer, j.people.stranger]) {
      expect((await as(person).post(`${base()}/late-values/${late.id}/accept`)).status).toBe(403);
      expect(
        (await as(person).post(`${base()}/late-values/${late.id}/reject`, { reason: 'No good' })).status,
      ).toBe(403);
    }
    expect((await as(j.people.writer1).get(`${base()}/sessions/${j.sessionId}/late-values`)).status).toBe(
      403,
    );
    expect((await request(server.app).post(`${base()}/late-values/${late.id}/accept`)).status).toBe(401);
    expect((await as(j.field.judge).post(`${base()}/late-values/999999/accept`)).status).toBe(404);
  });
});

describe('the check before closing', () => {
  it('names the targets whose ends the server does not hold whole, agreed or signed', async () => {
    await setClosed(false);
    const res = await as(j.field.organizer).get(`${base()}/sessions/${j.sessionId}/close-check`);
    expect(res.status).toBe(200);
    const check = res.body as CloseCheck;
    const t1 = check.targets.find((t) => t.targetNumber === 1)!;
    // Ada's end 1 has only writer 2's record (writer 1's still waits for a judge), and most ends nothing.
    expect(t1.notEntered).toBeGreaterThan(0);
    expect(t1.lateValues).toBe(2); // the first value held, and the one an accept could not apply
    expect(check.totalEnds).toBeGreaterThan(t1.notEntered);
    expect((await as(j.people.writer1).get(`${base()}/sessions/${j.sessionId}/close-check`)).status).toBe(
      403,
    );
  });
});
