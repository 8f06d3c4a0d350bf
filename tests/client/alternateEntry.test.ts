import { describe, expect, it } from 'vitest';
import type { OutboxRow } from '../../src/local/db';
import { chosenFirstShooter } from '../../src/local/firstShooter';
import {
  addInOrder,
  alternateOrder,
  asksWhoShootsFirst,
  undoInOrder,
} from '../../src/ui/match/alternateEntry';
import { matchDto, v } from './matchFixtures';

/*
 * Entering an end of a match shot alternately on the pad and the judge's card: who shoots first
 * as this phone shows it (its own choice laid over the server's), each value going to the archer
 * whose arrow it is, an undo taking back the last arrow in turn; a match that does not alternate
 * is entered line by line as before.
 */

const ref = { eventId: 3, matchId: 7 };
const choice = (seq: number, side: 'a' | 'b', status: OutboxRow['status']): OutboxRow => ({
  clientId: 'c',
  seq,
  id: `id-${seq}`,
  userId: 1,
  kind: 'match.firstShooter',
  args: { ...ref, side },
  at: '2026-12-13T10:00:00.000Z',
  endKey: 'match:7:first-shooter',
  status,
});
const alternating = matchDto({ alternate: true });
const empty = { endIndex: 0, a: [], b: [] };

describe('chosenFirstShooter', () => {
  it('lays this phone’s waiting choice over the server’s, and a delivered one until the copy shows it', () => {
    expect(chosenFirstShooter(alternating, [])).toBeNull();
    expect(chosenFirstShooter(alternating, [choice(1, 'b', 'pending')])).toEqual({
      side: 'b',
      waiting: true,
    });
    const server = matchDto({ alternate: true, firstShooter: 'a' });
    expect(chosenFirstShooter(server, [choice(1, 'b', 'applied')])).toEqual({ side: 'a', waiting: false });
    expect(chosenFirstShooter(alternating, [choice(1, 'b', 'applied')])).toEqual({
      side: 'b',
      waiting: false,
    });
    expect(chosenFirstShooter(server, [choice(2, 'b', 'rejected')])).toEqual({ side: 'a', waiting: false });
    expect(chosenFirstShooter(alternating, [choice(1, 'a', 'pending'), choice(2, 'b', 'pending')])).toEqual({
      side: 'b',
      waiting: true,
    });
    // Another match's choice is not this one's.
    expect(chosenFirstShooter(matchDto({ id: 8, alternate: true }), [choice(1, 'a', 'pending')])).toBeNull();
  });
});

describe('alternate entry', () => {
  it('asks who shoots first only for an alternating match before end 1 begins', () => {
    expect(asksWhoShootsFirst(alternating, null, empty)).toBe(true);
    expect(asksWhoShootsFirst(alternating, 'a', empty)).toBe(false);
    expect(asksWhoShootsFirst(matchDto(), null, empty)).toBe(false);
    expect(asksWhoShootsFirst(alternating, null, { ...empty, a: v('9') })).toBe(false);
    // The other writer's arrows of end 1 reached the server: the server would refuse the choice.
    const begun = matchDto({ alternate: true, writes: [{ slot: 2, endIndex: 0, a: v('9'), b: [] }] });
    expect(asksWhoShootsFirst(begun, null, empty)).toBe(false);
    const emptied = matchDto({ alternate: true, writes: [{ slot: 2, endIndex: 0, a: [], b: [] }] });
    expect(asksWhoShootsFirst(emptied, null, empty)).toBe(true);
  });

  it('puts each value in turn from the archer behind, and undoes the last arrow in turn', () => {
    // b won set 1: a is behind and starts set 2.
    const order = alternateOrder(alternating, 'sets', [{ a: v('9 9 9'), b: v('10 10 10') }], 'b');
    expect(order).toEqual(['a', 'b', 'a', 'b', 'a', 'b']);
    const draft = addInOrder({ endIndex: 1, a: [], b: [] }, v('10 9 8'), order);
    expect(draft).toEqual({ endIndex: 1, a: v('10 8'), b: v('9') });
    expect(undoInOrder(draft, order)).toEqual({ endIndex: 1, a: v('10'), b: v('9') });
    // Never more than the end has.
    expect(addInOrder(draft, v('7 7 7 7 7'), order)).toEqual({ endIndex: 1, a: v('10 8 7'), b: v('9 7 7') });
  });

  it('gives the shoot-off one arrow each, from the archer who started the match (the judge’s shoot-off entry shows it)', () => {
    // Five sets won in turn, 5–5: level, so the archer who shot first in end 1 starts (core rule, from memory: see shootingOrder.test.ts).
    const sets = [
      { a: v('10 10 10'), b: v('9 9 9') },
      { a: v('9 9 9'), b: v('10 10 10') },
      { a: v('10 10 10'), b: v('9 9 9') },
      { a: v('9 9 9'), b: v('10 10 10') },
      { a: v('10 10 9'), b: v('10 10 9') },
    ];
    expect(alternateOrder(alternating, 'sets', sets, 'b')).toEqual(['b', 'a']);
    expect(alternateOrder(alternating, 'sets', sets, 'a')).toEqual(['a', 'b']);
    expect(alternateOrder(matchDto(), 'sets', sets, 'a')).toBeNull();
  });

  it('fills line by line when the match does not alternate or nobody chose', () => {
    expect(alternateOrder(matchDto(), 'sets', [], 'a')).toBeNull();
    expect(alternateOrder(alternating, 'sets', [], null)).toBeNull();
    const draft = addInOrder(empty, v('10 9 8 7'), null);
    expect(draft).toEqual({ endIndex: 0, a: v('10 9 8'), b: v('7') });
    expect(undoInOrder(draft, null)).toEqual({ endIndex: 0, a: v('10 9 8'), b: [] });
  });
});
