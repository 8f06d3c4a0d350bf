import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { ArrowValue } from '../../src/core';
import type { CardSignatureDto, EndSignatureDto, RulingDto } from '../../src/contract/judging';
import type { ChangeDto } from '../../src/contract/sync';
import { startTestServer, type TestServer } from './support/testServer';
import { fieldTableCounts } from './support/phone';
import {
  agreeEnds,
  expectApplied,
  expectRejected,
  pushOne,
  setUpJudging,
  signEnds,
  targetView,
  twelveEnds,
  writeBoth,
  type JudgingField,
} from './support/judging';
import { setUpMixedField } from './support/fieldSetup';
import { Phone } from './support/phone';
import { makePerson } from './support/people';
import {
  readFieldState,
  rebuildFromLog,
  replayLog,
  sortFieldState,
} from '../../server/services/sync/rebuildFromLog';

/*
 * Judges rule on ends and sign them; archers and scorers sign whole cards. All of it travels as
 * mutations through the same push as the writers' ends: a broken rule is a rejected mutation
 * with a reason a person understands, and nothing else changes.
 */

// Each test starts from its own fresh event, so any one of them can run alone or in any order.
let server: TestServer;
let j: JudgingField;
beforeEach(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
  nextEnd = -1;
});
afterEach(async () => {
  await server.close();
});

const SIX: ArrowValue[] = ['X', '10', '9', '9', '8', '7'];
/** Bea Quill (1B) and Cora Nock (1C) shoot the 70 m round too: 12 ends each, handed out one by one. */
let nextEnd = -1;
const freshEnd = (): { entryId: number; endIndex: number; label: string } => {
  nextEnd += 1;
  const archer = nextEnd < 12 ? j.field.archer(1, 'B') : j.field.archer(1, 'C');
  if (nextEnd >= 24) throw new Error('Out of fresh ends.');
  return {
    entryId: archer.entryId,
    endIndex: nextEnd % 12,
    label: `End ${(nextEnd % 12) + 1} of ${archer.name}`,
  };
};
const at = (e: { entryId: number; endIndex: number }) => ({ sessionId: j.sessionId, ...e });

async function viewOf(e: { entryId: number; endIndex: number }) {
  const view = await targetView(server, j);
  return view.archers.find((a) => a.entryId === e.entryId)!.ends[e.endIndex]!;
}

describe('only judges rule and sign', () => {
  it('refuses a ruling and a signature from a writer, the archer, the caller and an organizer who is not a judge', async () => {
    const e = freshEnd();
    await writeBoth(j, e.entryId, e.endIndex, SIX);
    const before = await fieldTableCounts(server.db);
    for (const phone of [
      j.phones.writer1,
      j.phones.ada,
      j.phones.caller,
      j.phones.organizer,
      j.phones.stranger,
    ]) {
      expectRejected(
        await pushOne(phone, phone.rule({ ...at(e), arrows: SIX, reason: 'Looked at the target' })),
        /^Only a judge of this event can rule on an end\.$/,
      );
      expectRejected(
        await pushOne(phone, phone.sign({ ...at(e), arrows: SIX })),
        /^Only a judge of this event can sign an end\.$/,
      );
    }
    const after = await fieldTableCounts(server.db);
    // Only the log grew (every rejected mutation is kept with its reason), and each phone's sequence.
    expect({ ...after, mutations: 0, sync_clients: 0 }).toEqual({ ...before, mutations: 0, sync_clients: 0 });
    expect(after.mutations! - before.mutations!).toBe(10);
    expect((await viewOf(e)).view.state).toBe('agreed');
  });

  it('the judge may sign an agreed end; the view shows it signed, by whom', async () => {
    const e = freshEnd();
    await writeBoth(j, e.entryId, e.endIndex, ['7', '9', 'X', '8', '10', '9']);
    const result = await pushOne(
      j.phones.judge,
      j.phones.judge.sign({ ...at(e), arrows: ['9', '7', '8', 'X', '9', '10'] }),
    );
    expectApplied([result]);
    const end = await viewOf(e);
    expect(end.view.state).toBe('signed');
    expect(end.view.arrows).toEqual(['X', '10', '9', '9', '8', '7']);
    expect(end.signature).toMatchObject({ signedByName: 'Field Judge', supersededAt: null, arrows: SIX });
    expect(end.signature!.jws.split('.')).toHaveLength(3);
  });

  it('a ruling needs a whole end that fits the face, a reason, and a photo of this event', async () => {
    const e = freshEnd();
    await writeBoth(j, e.entryId, e.endIndex, SIX, ['X', '10', '9', '9', '8', '6']);
    expectRejected(
      await pushOne(
        j.phones.judge,
        j.phones.judge.rule({ ...at(e), arrows: ['X', '10', '9'], reason: 'Arrow 6 was a 7' }),
      ),
      new RegExp(`^${e.label}: End has 3 arrows; this round has 6 per end\\.`),
    );
    const otherEvent = await setUpMixedField(server.db);
    const [photo] = await server
      .db('photos')
      .insert({
        event_id: otherEvent.eventId,
        sha256: 'a'.repeat(64),
        mime_type: 'image/png',
        size_bytes: 10,
        stored_name: 'x.png',
        uploaded_by: otherEvent.judge.id,
        uploaded_at: new Date().toISOString(),
      })
      .returning('id');
    expectRejected(
      await pushOne(
        j.phones.judge,
        j.phones.judge.rule({
          ...at(e),
          arrows: SIX,
          reason: 'Arrow 6 was a 7',
          photoId: (photo as { id: number }).id,
        }),
      ),
      /not one of this event's photos/,
    );
    // A blank reason is bad input: that change is refused on its own with the reason, and nothing
    // of it stored (a phone of its own, since the refused change keeps its number on the phone that made it).
    const spare = new Phone(server.app, j.field.judge);
    const res = await request(server.app)
      .post('/api/sync/push')
      .set(j.field.judge.auth)
      .send({ clientId: spare.clientId, mutations: [spare.rule({ ...at(e), arrows: SIX, reason: ' ' })] });
    expect(res.status).toBe(200);
    expectRejected(res.body.results[0], /^This change could not be read: args\.reason: Give a short reason/);
    expect(await server.db('end_rulings').where({ entry_id: e.entryId, end_index: e.endIndex })).toEqual([]);
  });
});

describe('signing an end', () => {
  it('is refused with the reason while the cards differ, an arrow is disputed or an incident waits', async () => {
    const judge = j.phones.judge;
    const sign = async (e: ReturnType<typeof freshEnd>, arrows: ArrowValue[] = SIX) =>
      pushOne(judge, judge.sign({ ...at(e), arrows }));

    const empty = freshEnd();
    expectRejected(await sign(empty), new RegExp(`^${empty.label} has no arrows yet`));

    const one = freshEnd();
    await pushOne(j.phones.writer1, j.phones.writer1.write({ ...at(one), slot: 1, arrows: SIX }));
    expectRejected(await sign(one), /only one writer's card so far/);

    const differ = freshEnd();
    await writeBoth(j, differ.entryId, differ.endIndex, SIX, ['X', '9', '9', '9', '8', '7']);
    expectRejected(
      await sign(differ),
      new RegExp(`^${differ.label}: the two cards still differ at arrow 2\\.`),
    );

    const disputed = freshEnd();
    await writeBoth(j, disputed.entryId, disputed.endIndex, SIX, ['X', '10', '8', '9', '8', '7']);
    expectApplied([
      await pushOne(
        j.phones.caller,
        j.phones.caller.settle({
          ...at(disputed),
          arrows: SIX,
          basis: { first: 1, second: 1 },
          disputed: [2],
        }),
      ),
    ]);
    expectRejected(
      await sign(disputed),
      new RegExp(`^${disputed.label}: arrow 3 is still disputed\\. Rule on the end first\\.$`),
    );

    const incident = freshEnd();
    await writeBoth(j, incident.entryId, incident.endIndex, SIX, SIX, {
      first: [{ index: 4, flag: 'bounce-out' }],
      second: [{ index: 4, flag: 'bounce-out' }],
    });
    expectRejected(
      await sign(incident),
      new RegExp(`^${incident.label}: a bounce-out on arrow 5 needs a ruling first\\.$`),
    );

    const partial = freshEnd();
    await writeBoth(j, partial.entryId, partial.endIndex, ['X', '10', '9']);
    expectRejected(await sign(partial, ['X', '10', '9']), /End has 3 arrows; this round has 6 per end\./);

    const moved = freshEnd();
    await writeBoth(j, moved.entryId, moved.endIndex, SIX);
    expectRejected(await sign(moved, ['X', '10', '9', '9', '8', '8']), /changed since you looked at it/);
    expectApplied([await sign(moved)]);
    expectRejected(await sign(moved), new RegExp(`^${moved.label} is already signed by Field Judge\\.$`));

    // A ruling answers the dispute and the incident; then both can be signed.
    for (const e of [disputed, incident]) {
      expectApplied([
        await pushOne(
          judge,
          judge.rule({ ...at(e), arrows: ['X', '10', '9', '9', '8', 'M'], reason: 'Looked at the holes' }),
        ),
      ]);
      const end = await viewOf(e);
      expect(end.view).toMatchObject({
        state: 'settled',
        decidedBy: 'judge',
        openIncidents: 0,
        canSign: true,
      });
      expectApplied([await sign(e, ['X', '10', '9', '9', '8', 'M'])]);
    }
  });

  it('a writer cannot alter a signed end, nor a caller settle it: rejected with a reason, nothing changed', async () => {
    const e = freshEnd();
    await writeBoth(j, e.entryId, e.endIndex, SIX);
    expectApplied(await signEnds(server, j, e.entryId, [e.endIndex]));
    const before = {
      entries: await server
        .db('end_entries')
        .where({ entry_id: e.entryId, end_index: e.endIndex })
        .orderBy('slot'),
      settlements: await server.db('end_settlements').where({ entry_id: e.entryId, end_index: e.endIndex }),
      signatures: await server.db('end_signatures').where({ entry_id: e.entryId, end_index: e.endIndex }),
      changes: await server.db('changes').count({ n: '*' }).first(),
    };
    expectRejected(
      await pushOne(
        j.phones.writer1,
        j.phones.writer1.write({ ...at(e), slot: 1, arrows: ['M', 'M', 'M', 'M', 'M', 'M'] }),
      ),
      new RegExp(`^${e.label} is signed\\. Ask a judge to correct it\\.$`),
    );
    expectRejected(
      await pushOne(
        j.phones.caller,
        j.phones.caller.settle({ ...at(e), arrows: SIX, basis: { first: 1, second: 1 } }),
      ),
      /is signed\. Ask a judge to correct it\./,
    );
    expect({
      entries: await server
        .db('end_entries')
        .where({ entry_id: e.entryId, end_index: e.endIndex })
        .orderBy('slot'),
      settlements: await server.db('end_settlements').where({ entry_id: e.entryId, end_index: e.endIndex }),
      signatures: await server.db('end_signatures').where({ entry_id: e.entryId, end_index: e.endIndex }),
      changes: await server.db('changes').count({ n: '*' }).first(),
    }).toEqual(before);
  });

  it('a ruling on a signed end supersedes its signature; the old row stays, and the end can be signed again', async () => {
    const e = freshEnd();
    await writeBoth(j, e.entryId, e.endIndex, SIX);
    expectApplied(await signEnds(server, j, e.entryId, [e.endIndex]));
    const [signed] = await server.db('end_signatures').where({ entry_id: e.entryId, end_index: e.endIndex });
    const corrected: ArrowValue[] = ['X', '10', '9', '9', '8', '8'];
    expectApplied([
      await pushOne(
        j.phones.judge,
        j.phones.judge.rule({ ...at(e), arrows: corrected, reason: 'Line cutter on arrow 6: 8, not 7' }),
      ),
    ]);
    const [ruling] = await server.db('end_rulings').where({ entry_id: e.entryId, end_index: e.endIndex });
    const rows = await server.db('end_signatures').where({ entry_id: e.entryId, end_index: e.endIndex });
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({
      id: signed.id,
      arrows_json: signed.arrows_json,
      jws: signed.jws,
      superseded_by_ruling: ruling.id,
    });
    expect(rows[0].superseded_at).toBeTruthy();
    const end = await viewOf(e);
    expect(end.view).toMatchObject({ state: 'settled', decidedBy: 'judge', arrows: corrected });
    expect(end.signature).toBeNull();
    expect(end.ruling).toMatchObject({ arrows: corrected, reason: 'Line cutter on arrow 6: 8, not 7' });
    // Writers still cannot change it: only a judge can now.
    expectRejected(
      await pushOne(j.phones.writer2, j.phones.writer2.write({ ...at(e), slot: 2, arrows: SIX })),
      /is signed|A judge has ruled on end/,
    );
    expectApplied(await signEnds(server, j, e.entryId, [e.endIndex]));
    expect(
      await server.db('end_signatures').where({ entry_id: e.entryId, end_index: e.endIndex }),
    ).toHaveLength(2);
  });

  it('once a judge has ruled, the writers and the caller can no longer change the end', async () => {
    const e = freshEnd();
    await writeBoth(j, e.entryId, e.endIndex, SIX, ['X', '10', '9', '9', '8', '6']);
    expectApplied([
      await pushOne(j.phones.judge, j.phones.judge.rule({ ...at(e), arrows: SIX, reason: 'Arrow 6 is a 7' })),
    ]);
    expectRejected(
      await pushOne(j.phones.writer2, j.phones.writer2.write({ ...at(e), slot: 2, arrows: SIX })),
      new RegExp(`^A judge has ruled on end ${e.endIndex + 1} of .+\\. Only a judge can change it now\\.$`),
    );
  });
});

const ada = () => j.ada.entryId;
const adaTotal = () =>
  twelveEnds()
    .flat()
    .reduce((s, v) => s + (v === 'X' ? 10 : v === 'M' ? 0 : Number(v)), 0);
const adaCard = (role: 'archer' | 'scorer', total = adaTotal()) => ({
  sessionId: j.sessionId,
  entryId: ada(),
  role,
  total,
});
const ALL_ENDS = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11];

/** Ada's twelve ends agreed and signed by the judge. */
async function adaSignedByJudge() {
  await agreeEnds(j, ada(), twelveEnds());
  expectApplied(await signEnds(server, j, ada(), ALL_ENDS));
}

/** Ada's card final: every end signed, then the archer's and the scorer's signatures. */
async function adaFinal() {
  await adaSignedByJudge();
  expectApplied([await pushOne(j.phones.ada, j.phones.ada.signCard(adaCard('archer')))]);
  expectApplied([await pushOne(j.phones.writer1, j.phones.writer1.signCard(adaCard('scorer')))]);
}

const CORRECTED_FIRST_END: ArrowValue[] = ['X', '10', '9', '9', '8', '8'];
/** A judge corrects end 1 of Ada's final card. */
const correctAdaFirstEnd = async () =>
  expectApplied([
    await pushOne(
      j.phones.judge,
      j.phones.judge.rule({
        sessionId: j.sessionId,
        entryId: ada(),
        endIndex: 0,
        arrows: CORRECTED_FIRST_END,
        reason: 'Addition corrected after a look at the face',
      }),
    ),
  ]);

/**
 * A judged morning: Ada's card final and then corrected by a ruling (superseding signatures), and
 * two of Bea's ends ruled after a caller's settlement left an arrow disputed.
 */
async function judgedMorning() {
  await adaFinal();
  await correctAdaFirstEnd();
  for (let i = 0; i < 2; i += 1) {
    const e = freshEnd();
    await writeBoth(j, e.entryId, e.endIndex, SIX, ['X', '10', '8', '9', '8', '7']);
    expectApplied([
      await pushOne(
        j.phones.caller,
        j.phones.caller.settle({ ...at(e), arrows: SIX, basis: { first: 1, second: 1 }, disputed: [2] }),
      ),
    ]);
    expectApplied([
      await pushOne(
        j.phones.judge,
        j.phones.judge.rule({ ...at(e), arrows: SIX, reason: 'Looked at the holes' }),
      ),
    ]);
  }
}

describe('countersigning the card', () => {
  it('is refused while ends are unsigned, with the ends named', async () => {
    await agreeEnds(j, ada(), twelveEnds());
    expectApplied(await signEnds(server, j, ada(), [0, 1, 2, 3, 4, 5, 6, 7, 8]));
    expectRejected(
      await pushOne(
        j.phones.ada,
        j.phones.ada.signCard({ sessionId: j.sessionId, entryId: ada(), role: 'archer', total: adaTotal() }),
      ),
      /^3 of the 12 ends on Ada Fletcher's card are not signed yet \(ends 10, 11 and 12\)\. A judge signs each end first\.$/,
    );
  });

  it('only the archer countersigns their own card, with the right total; the writer signs as scorer', async () => {
    await adaSignedByJudge();
    const card = adaCard;
    for (const phone of [j.phones.judge, j.phones.writer1, j.phones.organizer, j.phones.stranger])
      expectRejected(
        await pushOne(phone, phone.signCard(card('archer'))),
        /^Only Ada Fletcher can countersign this card as the archer/,
      );
    // Another archer of the event, signed in with her own account, cannot sign Ada's card either.
    const beaPerson = await makePerson(server.db, 'Bea Quill');
    await server
      .db('entries')
      .where({ id: j.field.archer(1, 'B').entryId })
      .update({ user_id: beaPerson.id });
    const bea = new Phone(server.app, beaPerson);
    expectRejected(await pushOne(bea, bea.signCard(card('archer'))), /^Only Ada Fletcher can countersign/);
    expectRejected(
      await pushOne(j.phones.ada, j.phones.ada.signCard(card('archer', adaTotal() - 2))),
      new RegExp(`^Ada Fletcher's card adds up to ${adaTotal()}, not ${adaTotal() - 2}\\.`),
    );
    for (const phone of [j.phones.caller, j.phones.judge, j.phones.ada])
      expectRejected(
        await pushOne(phone, phone.signCard(card('scorer'))),
        /^Only writer 1 or writer 2 of target 1 can sign Ada Fletcher's card as scorer\.$/,
      );
    expectApplied([await pushOne(j.phones.ada, j.phones.ada.signCard(card('archer')))]);
    expectRejected(
      await pushOne(j.phones.ada, j.phones.ada.signCard(card('archer'))),
      /^Ada Fletcher's card is already signed by the archer \(Ada Fletcher\)\.$/,
    );
    const view = await request(server.app)
      .get(`/api/cards/${j.sessionId}/${ada()}`)
      .set(j.people.writer1.auth);
    expect(view.body).toMatchObject({ state: 'countersigned', final: false, canCountersign: 'scorer' });
    expectApplied([await pushOne(j.phones.writer1, j.phones.writer1.signCard(card('scorer')))]);
    const final = await request(server.app).get(`/api/cards/${j.sessionId}/${ada()}`).set(j.people.ada.auth);
    expect(final.body).toMatchObject({
      state: 'final',
      final: true,
      signedEnds: 12,
      totalEnds: 12,
      canCountersign: null,
      totals: { total: adaTotal() },
    });
    expect(final.body.signatures.map((s: { role: string; name: string }) => [s.role, s.name])).toEqual([
      ['archer', 'Ada Fletcher'],
      ['scorer', 'Wren One'],
    ]);
  });

  it('a ruling on an end of a final card supersedes the card signatures too', async () => {
    await adaFinal();
    await correctAdaFirstEnd();
    const cards = await server.db('card_signatures').where({ entry_id: ada() }).orderBy('id');
    expect(cards).toHaveLength(2);
    expect(cards.every((c) => c.superseded_at && c.superseded_by_ruling)).toBe(true);
    const view = await request(server.app).get(`/api/cards/${j.sessionId}/${ada()}`).set(j.people.ada.auth);
    expect(view.body).toMatchObject({ state: 'running', final: false, signedEnds: 11, canCountersign: null });
    expect(view.body.countersignNote).toMatch(/still has to sign 1 of the 12 ends/);
  });
});

describe('the log and the phones', () => {
  it('a signing change sent again is a duplicate: answered from the log, never signed twice', async () => {
    const e = freshEnd();
    await writeBoth(j, e.entryId, e.endIndex, SIX);
    const m = j.phones.judge.sign({ ...at(e), arrows: SIX });
    expect((await j.phones.judge.push([m])).results[0]!.status).toBe('applied');
    const before = await fieldTableCounts(server.db);
    expect((await j.phones.judge.push([m])).results[0]!.status).toBe('duplicate');
    const resent = { ...m, seq: m.seq + 1 };
    expect((await j.phones.judge.push([resent])).results[0]!.status).toBe('duplicate');
    expect({ ...(await fieldTableCounts(server.db)), sync_clients: 0 }).toEqual({
      ...before,
      sync_clients: 0,
    });
  });

  it('rulings and signatures reach the target group and the judges by pull; a stranger sees nothing', async () => {
    await judgedMorning();
    const pullAll = async (phone: Phone) => {
      const changes: ChangeDto[] = [];
      let cursor = 0;
      for (;;) {
        const page = await phone.pull(cursor, 500);
        changes.push(...page.changes);
        cursor = page.cursor;
        if (!page.hasMore) return changes;
      }
    };
    for (const phone of [j.phones.writer2, j.phones.judge]) {
      const changes = await pullAll(phone);
      const types = new Set(changes.map((c) => c.type));
      expect(types).toEqual(new Set(['end', 'settlement', 'ruling', 'signature', 'card-signature']));
      const superseded = changes.filter(
        (c): c is Extract<ChangeDto, { type: 'signature' }> =>
          c.type === 'signature' && !!c.record.supersededAt,
      );
      expect(superseded.length).toBeGreaterThan(0);
      const record: EndSignatureDto = superseded[0]!.record;
      expect(record.id).toBeGreaterThan(0);
      expect(record.supersededByRuling).toBeGreaterThan(0);
      const ruling = changes.find((c) => c.type === 'ruling')!.record as RulingDto;
      expect(ruling.id).toBeGreaterThan(0);
      const card = changes.find((c) => c.type === 'card-signature')!.record as CardSignatureDto;
      expect(card).toMatchObject({ role: 'archer', name: 'Ada Fletcher' });
    }
    expect(await pullAll(j.phones.stranger)).toEqual([]);
  });

  it('the replay of the log gives the same writers’ records, settlements and rulings; rebuilding keeps signatures', async () => {
    await judgedMorning();
    const current = await readFieldState(server.db);
    expect(current.rulings.length).toBeGreaterThanOrEqual(3);
    expect(sortFieldState(await replayLog(server.db))).toEqual(current);
    const signatures = await server.db('end_signatures').orderBy('id');
    await server.db('end_rulings').update({ arrows_json: '["M"]', reason: 'damaged' });
    await rebuildFromLog(server.db);
    expect(await readFieldState(server.db)).toEqual(current);
    expect(await server.db('end_signatures').orderBy('id')).toEqual(signatures);
  });
});

describe('a closed session', () => {
  it('stops the writers but not the judges', async () => {
    const closed = await setUpMixedField(server.db, { closed: true });
    const judge = new Phone(server.app, closed.judge);
    const archer = closed.archer(1, 'A');
    expectApplied([
      await pushOne(
        judge,
        judge.rule({
          sessionId: closed.sessionId,
          entryId: archer.entryId,
          endIndex: 0,
          arrows: SIX,
          reason: 'Card handed in without the last end; values from the target sheet',
        }),
      ),
    ]);
    expectApplied([
      await pushOne(
        judge,
        judge.sign({ sessionId: closed.sessionId, entryId: archer.entryId, endIndex: 0, arrows: SIX }),
      ),
    ]);
  });
});
