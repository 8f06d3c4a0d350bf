import { randomUUID } from 'node:crypto';
import { cardTotals, endsOfRound, sortEnd, type ArrowValue, type RoundDefinition } from '../../src/core';
import type { Mutation } from '../../src/contract/sync';
import type { Db } from '../db';
import type { SigningKeys } from '../services/signing/serverKeys';
import { pushBatch } from '../services/sync/pushBatch';

/*
 * The demo event partway through its session, made the way a real one is: writers joined to
 * targets 1–3 push their ends, a caller settles, judges rule and sign, archers countersign —
 * every change a mutation through the same push as the phones use, so the log, the change feed
 * and the signatures are all real.
 */

type Archer = {
  entryId: number;
  userId: number;
  name: string;
  email: string;
  target: number;
  position: string;
};

/** A small seeded generator (mulberry32), so the demo is the same every time. */
function seeded(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const LADDER: ArrowValue[] = ['X', '10', '9', '8', '7', '6', '5', '4', '3', '2', '1', 'M'];

/** An end of six arrows for an archer of some skill (0 strong … 1 weaker), on the 122 cm face. */
function endFor(random: () => number, skill: number): ArrowValue[] {
  return sortEnd(
    Array.from(
      { length: 6 },
      () => LADDER[Math.min(LADDER.length - 1, Math.floor(random() ** 1.6 * (4 + skill * 5)))]!,
    ),
  );
}

/** A phone of one demo person: numbers changes like the outbox and pushes them. */
class DemoPhone {
  private seq = 0;
  private queue: Mutation[] = [];
  constructor(readonly userId: number) {}

  add(change: Pick<Mutation, 'kind' | 'args'>, at: string): void {
    this.seq += 1;
    this.queue.push({ id: randomUUID(), seq: this.seq, at, ...change } as Mutation);
  }

  async push(db: Db, keys: SigningKeys): Promise<void> {
    if (this.queue.length === 0) return;
    const res = await pushBatch(
      db,
      this.userId,
      { clientId: `demo-${this.userId}`, mutations: this.queue },
      { signingKeys: keys },
    );
    const refused = res.results.find((r) => r.status !== 'applied');
    if (refused) throw new Error(`The demo field could not be made: ${JSON.stringify(refused)}`);
    this.queue = [];
  }
}

/**
 * Plays the first part of the demo session on targets 1–3. The banner archer's card is complete
 * and signed end by end, waiting for her countersignature; her neighbour has countersigned and
 * waits for the scorer; the others are eight ends in, with ends to sign, a disputed arrow, an
 * unsettled mismatch, a bounce-out waiting for a ruling, and one ruled end.
 */
export async function playDemoField(
  db: Db,
  keys: SigningKeys,
  sessionId: number,
  judgeIds: number[],
  bannerEmail: string,
): Promise<void> {
  const archers = (await db('target_assignments as ta')
    .join('entries as e', 'e.id', 'ta.entry_id')
    .where('ta.session_id', sessionId)
    .whereIn('ta.target_number', [1, 2, 3])
    .orderBy([{ column: 'ta.target_number' }, { column: 'ta.position' }])
    .select(
      'ta.entry_id as entryId',
      'e.user_id as userId',
      'e.name',
      'e.email',
      'ta.target_number as target',
      'ta.position',
    )) as Archer[];
  const round = JSON.parse(
    (
      await db('session_divisions as sd')
        .join('entries as e', 'e.division_id', 'sd.division_id')
        .where({ 'sd.session_id': sessionId, 'e.id': archers[0]!.entryId })
        .first('sd.round_json')
    ).round_json,
  ) as RoundDefinition;
  const endCount = endsOfRound(round).length;

  // Times on the day: the session starts at 09:30; an end about every six minutes.
  const start = Date.UTC(2026, 11, 12, 9, 40);
  const at = (endIndex: number, minutes = 0) =>
    new Date(start + (endIndex * 6 + minutes) * 60_000).toISOString();

  const phones = new Map<number, DemoPhone>();
  const phone = (userId: number) => {
    if (!phones.has(userId)) phones.set(userId, new DemoPhone(userId));
    return phones.get(userId)!;
  };
  const [judge, secondJudge] = judgeIds as [number, number];
  // Writers and callers first, then the ruling judge, then the signing one: the order on the field.
  const pushAll = async () => {
    const order = (p: DemoPhone) => (p.userId === judge ? 2 : p.userId === secondJudge ? 1 : 0);
    for (const p of [...phones.values()].sort((a, b) => order(a) - order(b))) await p.push(db, keys);
  };

  // The archers of each target keep its cards: A writes the first card, B the second, C calls.
  const byTarget = new Map<number, Archer[]>();
  for (const a of archers) byTarget.set(a.target, [...(byTarget.get(a.target) ?? []), a]);
  const tasks = ['writer1', 'writer2', 'caller'] as const;
  for (const [target, group] of byTarget) {
    for (const [i, a] of group.slice(0, 3).entries()) {
      await db('target_members').insert({
        session_id: sessionId,
        target_number: target,
        user_id: a.userId,
        task: tasks[i],
        joined_at: at(-8),
      });
    }
  }
  const banner = archers.find((a) => a.email === bannerEmail) ?? archers[0]!;
  const neighbour = byTarget.get(banner.target)!.find((a) => a !== banner)!;
  const complete = new Set([banner.entryId, neighbour.entryId]);
  // The other targets' troubles, one archer each; a dispute needs a target with a caller.
  const elsewhere = archers.filter((a) => a.target !== banner.target);
  const called = elsewhere.filter((a) => (byTarget.get(a.target)?.length ?? 0) >= 3);
  const [disputed, bounced, ruled] = called;
  const unsettled = elsewhere.find((a) => !called.slice(0, 3).includes(a));
  if (!disputed || !bounced || !ruled || !unsettled)
    throw new Error('The demo layout has too few archers on targets 1–3 for the demo field.');
  const special = {
    dispute: { entryId: disputed.entryId, endIndex: 6 },
    mismatch: { entryId: unsettled.entryId, endIndex: 7 },
    incident: { entryId: bounced.entryId, endIndex: 6 },
    ruled: { entryId: ruled.entryId, endIndex: 2 },
  };
  type Special = keyof typeof special;
  const is = (kind: Special, entryId: number, endIndex: number) =>
    special[kind].entryId === entryId && special[kind].endIndex === endIndex;
  const isSpecial = (entryId: number, endIndex: number) =>
    (Object.keys(special) as Special[]).some((kind) => is(kind, entryId, endIndex));

  const random = seeded(20261212);
  const signed = new Map<number, ArrowValue[][]>();
  for (let endIndex = 0; endIndex < endCount; endIndex += 1) {
    for (const [target, group] of byTarget) {
      const [w1, w2, caller] = group;
      if (!w1 || !w2) continue;
      for (const [n, a] of group.entries()) {
        if (endIndex >= 8 && !complete.has(a.entryId)) continue;
        const where = { sessionId, entryId: a.entryId, endIndex };
        const arrows = endFor(random, (n + target) / 6);
        let second = arrows;
        let flags: { index: number; flag: 'bounce-out' }[] = [];
        if (is('incident', a.entryId, endIndex)) {
          arrows[5] = 'M';
          second = arrows;
          flags = [{ index: 5, flag: 'bounce-out' }];
        } else if (isSpecial(a.entryId, endIndex)) {
          // The second card has one arrow a zone off: the writers heard it differently.
          const off = (v: ArrowValue) => (v === 'M' ? '1' : LADDER[LADDER.indexOf(v) + 1]!);
          second = sortEnd(arrows.map((v, i) => (i === 2 ? off(v) : v)));
        }
        phone(w1.userId).add(
          { kind: 'end.write', args: { ...where, slot: 1, arrows, flags } },
          at(endIndex, 1),
        );
        phone(w2.userId).add(
          { kind: 'end.write', args: { ...where, slot: 2, arrows: second, flags: [] } },
          at(endIndex, 2),
        );
        if (is('dispute', a.entryId, endIndex) && caller) {
          const position = arrows.findIndex((v, i) => v !== second[i]);
          phone(caller.userId).add(
            {
              kind: 'end.settle',
              args: { ...where, arrows, disputed: [position], basis: { first: 1, second: 1 } },
            },
            at(endIndex, 3),
          );
        }
        if (is('ruled', a.entryId, endIndex)) {
          phone(secondJudge).add(
            {
              kind: 'end.rule',
              args: {
                ...where,
                arrows,
                reason: 'Line cutter: the shaft touches the line, so it scores the higher zone.',
              },
            },
            at(endIndex, 4),
          );
        }
        // Judges sign what is decided, a couple of ends behind the shooting (all of a complete card).
        const decided = !isSpecial(a.entryId, endIndex) || is('ruled', a.entryId, endIndex);
        if (decided && (endIndex < 6 || complete.has(a.entryId))) {
          phone(judge).add({ kind: 'end.sign', args: { ...where, arrows } }, at(endIndex, 5));
          signed.set(a.entryId, [...(signed.get(a.entryId) ?? []), arrows]);
        }
      }
    }
    await pushAll();
  }

  // The neighbour has countersigned her card; the scorer has not signed it yet.
  const total = cardTotals(round, signed.get(neighbour.entryId)!).total;
  phone(neighbour.userId).add(
    { kind: 'card.sign', args: { sessionId, entryId: neighbour.entryId, role: 'archer', total } },
    at(endCount, 3),
  );
  await pushAll();
}
