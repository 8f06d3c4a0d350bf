import { describe, expect, it } from 'vitest';
import { getRound, type ArrowValue } from '../../src/core';
import type { EndRecordDto } from '../../src/contract/sync';
import { endKeyOf, type JoinedTarget, type OutboxRow } from '../../src/local/db';
import { localEnd, type LocalEnd } from '../../src/local/endFacts';
import { deskItemKey, deskItems, targetSummaries, withoutSigned } from '../../src/features/desk/deskItems';

const SIX: ArrowValue[] = ['10', '9', '9', '8', '7', '6'];
const round = getRound('70m');

const target = (targetNumber: number): JoinedTarget =>
  ({
    key: `1:1:${targetNumber}`,
    targetNumber,
    joinedAt: '2026-06-01T09:00:00.000Z',
    session: { id: 1 },
    archers: [{ entryId: targetNumber * 10, position: 'A', name: `Archer ${targetNumber}A`, round }],
  }) as unknown as JoinedTarget;

const record = (entryId: number, slot: 1 | 2, arrows: ArrowValue[], revision = 1): EndRecordDto => ({
  sessionId: 1,
  entryId,
  endIndex: 0,
  slot,
  arrows,
  flags: [],
  revision,
  writtenBy: slot,
  writtenAt: '2026-06-01T10:00:00.000Z',
});

const keyOf = (t: JoinedTarget, entryId: number, endIndex: number) =>
  endKeyOf(t.session.id, entryId, endIndex);
const endOf = (entryId: number, second: ArrowValue[], waiting: OutboxRow[] = []): [string, LocalEnd] => [
  endKeyOf(1, entryId, 0),
  localEnd([record(entryId, 1, SIX), record(entryId, 2, second)], undefined, waiting),
];

describe('the judge desk overview', () => {
  it('puts targets whose ends need a decision before those with ends to sign, then the quiet ones', () => {
    const targets = [target(1), target(2), target(3)];
    const ends = new Map([endOf(10, SIX), endOf(20, ['10', '9', '8', '8', '7', '6'])]);
    const summaries = targetSummaries(targets, deskItems(targets, ends, keyOf));
    expect(summaries.map((s) => [s.target.targetNumber, s.first])).toEqual([
      [2, 'mismatch'],
      [1, 'to-sign'],
      [3, undefined],
    ]);
    expect(summaries[0]!.counts).toEqual({ dispute: 0, incident: 0, mismatch: 1, 'to-sign': 0 });
  });

  it('gives an end card a new revision only when its own end changes', () => {
    const targets = [target(1), target(2)];
    const before = deskItems(targets, new Map([endOf(10, SIX), endOf(20, SIX)]), keyOf);
    // Target 2's second card is written again: target 1's card keeps its revision, target 2's changes.
    const after = deskItems(
      targets,
      new Map([
        endOf(10, SIX),
        [endKeyOf(1, 20, 0), localEnd([record(20, 1, SIX), record(20, 2, SIX, 2)], undefined, [])],
      ]),
      keyOf,
    );
    const revisionOf = (items: typeof before, entryId: number) =>
      items.find((i) => i.target.archers[i.archerIndex]!.entryId === entryId)!.revision;
    expect(revisionOf(after, 10)).toBe(revisionOf(before, 10));
    expect(revisionOf(after, 20)).not.toBe(revisionOf(before, 20));
  });
});

describe('an end signed on the desk', () => {
  const targets = [target(1), target(2)];
  const items = deskItems(targets, new Map([endOf(10, SIX), endOf(20, SIX)]), keyOf);
  const signed = items.find((i) => i.target.targetNumber === 1)!;

  it('leaves the desk at the tap, before its signature is stored, whatever read comes meanwhile', () => {
    const signedAt = new Map([[deskItemKey(signed), Infinity]]);
    for (const readNumber of [1, 3, 4, 100]) {
      expect(withoutSigned(items, signedAt, readNumber).map((i) => i.target.targetNumber)).toEqual([2]);
    }
  });

  it('stays off once stored, even in a read begun before the signature was stored', () => {
    // Reads 1 to 3 had begun when the signature was stored.
    const signedAt = new Map([[deskItemKey(signed), 3]]);
    for (const readNumber of [2, 3]) {
      expect(withoutSigned(items, signedAt, readNumber).map((i) => i.target.targetNumber)).toEqual([2]);
    }
  });

  it('comes back when a read begun after its signature still shows it (a refused signature)', () => {
    const signedAt = new Map([[deskItemKey(signed), 3]]);
    expect(withoutSigned(items, signedAt, 4).map((i) => i.target.targetNumber)).toEqual([1, 2]);
  });
});
