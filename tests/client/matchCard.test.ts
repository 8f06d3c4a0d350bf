import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import type { MatchDto } from '../../src/contract/matches';
import { LocalDb, matchPadKeyOf, type OutboxRow } from '../../src/local/db';
import { recordChange } from '../../src/local/outbox';
import { summarizeWaiting, waitingWords } from '../../src/local/waitingSummary';
import { matchInWords, waitingInWords } from '../../src/local/waitingInWords';
import { matchCard } from '../../src/local/matchCard';
import { matchDto, side, v } from './matchFixtures';

/*
 * The judge's match card on the phone: the outbox rows laid over the server's copy (pending ones
 * always, delivered ones until the copy shows them), read by the core; words for waiting changes.
 */

const dbs: LocalDb[] = [];
afterEach(async () => {
  for (const db of dbs.splice(0)) await db.delete();
});

const match = (extra: Partial<MatchDto> = {}) => matchDto(extra);
const row = (
  seq: number,
  kind: OutboxRow['kind'],
  args: OutboxRow['args'],
  status: OutboxRow['status'],
): OutboxRow => ({
  clientId: 'c',
  seq,
  id: `id-${seq}`,
  userId: 1,
  kind,
  args,
  at: '2026-12-13T10:00:00.000Z',
  endKey: `match:7:${seq}`,
  status,
});
const ref = { eventId: 3, matchId: 7 };

describe('matchCard', () => {
  it('lays waiting ends over the server copy and reads them with the core', () => {
    const card = matchCard(match({ ends: [{ a: v('10 10 10'), b: v('9 9 9') }] }), 'sets', [
      row(1, 'match.end', { ...ref, endIndex: 1, a: v('10 10 9'), b: v('9 9 9') }, 'pending'),
      row(2, 'match.end', { ...ref, endIndex: 2, a: v('10 9 9'), b: v('9 9 8') }, 'pending'),
      row(3, 'match.sign', ref, 'pending'),
    ]);
    expect(card.ends.map((e) => e.waiting)).toEqual([false, true, true]);
    expect(card.state).toMatchObject({ score: { a: 6, b: 0 }, winner: 'a', next: 'none' });
    expect(card.signed).toBe('waiting');
  });

  it('keeps a delivered end until the server copy shows it, then trusts the copy', () => {
    const delivered = row(
      1,
      'match.end',
      { ...ref, endIndex: 0, a: v('10 10 10'), b: v('9 9 9') },
      'applied',
    );
    expect(matchCard(match(), 'sets', [delivered]).ends).toHaveLength(1);
    // A later copy (another judge corrected the end) wins over this phone's delivered change.
    const copy = match({ ends: [{ a: v('9 9 9'), b: v('9 9 9') }] });
    expect(matchCard(copy, 'sets', [delivered]).ends[0]!.a).toEqual(v('9 9 9'));
  });

  it('shows the judge’s signature on an end: waiting, delivered, and gone with a correction', () => {
    const signedEnd = { a: v('10 10 10'), b: v('9 9 9') };
    const sign = (seq: number, status: OutboxRow['status']) =>
      row(seq, 'match.endSign', { ...ref, endIndex: 0 }, status);
    const copy = match({ ends: [signedEnd] });
    expect(matchCard(copy, 'sets', [sign(1, 'pending')]).ends[0]!.signature).toBe('waiting');
    // Delivered before the copy shows it: signed; the copy's own signature reads the same.
    expect(matchCard(copy, 'sets', [sign(1, 'applied')]).ends[0]!.signature).toBe('server');
    expect(matchCard(match({ ends: [{ ...signedEnd, signed: true }] }), 'sets', []).ends[0]!.signature).toBe(
      'server',
    );
    // The judge's correction after the signature replaces the end and its signature.
    const fix = row(2, 'match.end', { ...ref, endIndex: 0, a: v('10 10 9'), b: v('9 9 9') }, 'pending');
    expect(matchCard(copy, 'sets', [sign(1, 'applied'), fix]).ends[0]!.signature).toBeNull();
    const fixed = row(2, 'match.end', { ...ref, endIndex: 0, a: v('10 10 9'), b: v('9 9 9') }, 'applied');
    const corrected = match({ ends: [{ a: v('10 10 9'), b: v('9 9 9') }] });
    expect(matchCard(corrected, 'sets', [sign(1, 'applied'), fixed]).ends[0]!.signature).toBeNull();
  });

  it('never lays a refused change over, and says when the core refuses the card', () => {
    const refused = row(1, 'match.end', { ...ref, endIndex: 0, a: v('10 10 10'), b: v('9 9 9') }, 'rejected');
    expect(matchCard(match(), 'sets', [refused]).ends).toHaveLength(0);
    const early = row(
      2,
      'match.shootoff',
      { ...ref, a: { value: '9', closer: true }, b: { value: '9', closer: false } },
      'pending',
    );
    const card = matchCard(match(), 'sets', [early]);
    expect(card.state).toBeNull();
    expect(card.problem).toMatch(/shoot-off/);
  });

  it('decides a 5–5 match by the arrow marked closer', () => {
    const ends = ['10 10 10|9 9 9', '9 9 9|10 10 10', '10 10 10|9 9 9', '9 9 9|10 10 10', '9 9 9|9 9 9'].map(
      (s) => {
        const [a, b] = s.split('|') as [string, string];
        return { a: v(a), b: v(b) };
      },
    );
    const card = matchCard(match({ ends }), 'sets', [
      row(
        1,
        'match.shootoff',
        { ...ref, a: { value: '9', closer: false }, b: { value: '9', closer: true } },
        'pending',
      ),
    ]);
    expect(card.state).toMatchObject({ winner: 'b', decidedBy: 'shoot-off' });
    expect(card.shootOffWaiting).toBe(true);
  });
});

describe('match changes in the outbox', () => {
  it('are counted and described in words', async () => {
    const db = new LocalDb(`match-card-${Date.now()}`);
    dbs.push(db);
    await recordChange(db, 1, {
      kind: 'match.end',
      args: { ...ref, endIndex: 0, a: v('10 10 10'), b: v('9 9 9') },
    });
    await recordChange(db, 1, {
      kind: 'match.end',
      args: { ...ref, endIndex: 0, a: v('10 10 9'), b: v('9 9 9') },
    });
    await recordChange(db, 1, {
      kind: 'match.shootoff',
      args: { ...ref, a: { value: '9', closer: true }, b: { value: '9', closer: false } },
    });
    await recordChange(db, 1, { kind: 'match.endSign', args: { ...ref, endIndex: 0 } });
    await recordChange(db, 1, { kind: 'match.sign', args: ref });
    const rows = await db.outbox.toArray();
    expect(rows.map((r) => r.endKey)).toEqual([
      'match:7:end:0',
      'match:7:end:0',
      'match:7:shoot-off',
      'match:7:end-sign:0',
      'match:7:sign',
    ]);
    expect(waitingWords(summarizeWaiting(rows))).toBe('1 end, 2 signatures and 1 shoot-off arrow');
    expect(await waitingInWords(db, 1)).toEqual([
      'Match: number 7, end 1',
      'Match: number 7, shoot-off arrows',
      'Your signature on end 1 of the match number 7',
      'Your signature on the match number 7',
    ]);
    // Named by its archers once the phone knows them: a bracket looked at, or a match joined as writer.
    const names = (matchId: number) => (matchId === 7 ? matchInWords(match()) : undefined);
    expect((await waitingInWords(db, 1, undefined, names))[0]).toBe('Match: Ada v Bo, end 1');
    await db.matchPads.put({
      key: matchPadKeyOf(1, 7),
      userId: 1,
      matchId: 7,
      eventId: 3,
      eventName: 'Shoot',
      divisionName: 'Recurve',
      roundName: 'Final',
      format: 'sets',
      slot: 1,
      ownEntryId: null,
      match: match({ sides: { a: side(1, 'Cy'), b: side(2, 'Di') } }),
    });
    await recordChange(db, 1, { kind: 'match.write', args: { ...ref, endIndex: 1, a: v('10'), b: [] } });
    await recordChange(db, 1, { kind: 'match.countersign', args: ref });
    expect((await waitingInWords(db, 1)).slice(-2)).toEqual([
      'Match: Cy v Di, end 2',
      'Your countersignature on the match Cy v Di',
    ]);
  });
});
