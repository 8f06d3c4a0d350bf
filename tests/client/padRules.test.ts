import { describe, expect, it } from 'vitest';
import { endView, type ArrowValue } from '../../src/core';
import type { EndRecordDto } from '../../src/contract/sync';
import type { RulingRow, SettlementRow } from '../../src/local/db';
import { localEnd } from '../../src/local/endFacts';
import { openFlags } from '../../src/ui/scorecard/endFlags';
import { feedKey, flushLoneOne } from '../../src/ui/scorecard/keyEntry';
import { pullAdvice } from '../../src/features/pad/pullAdvice';
import { countedValues } from '../../src/features/pad/WriterPad';
import { startingValues } from '../../src/features/desk/deskItems';
import { changesWords, summarizeWaiting, waitingWords } from '../../src/local/waitingSummary';

const SIX: ArrowValue[] = ['10', '9', '9', '8', '7', '6'];
const record = (slot: 1 | 2, arrows: ArrowValue[], flags: EndRecordDto['flags'] = []): EndRecordDto => ({
  sessionId: 1,
  entryId: 7,
  endIndex: 0,
  slot,
  arrows,
  flags,
  revision: 1,
  writtenBy: slot,
  writtenAt: '2026-06-01T10:00:00.000Z',
});
const ruling = (arrows: ArrowValue[], id = 1): RulingRow => ({
  id,
  endKey: '1:7:0',
  sessionId: 1,
  entryId: 7,
  endIndex: 0,
  arrows,
  reason: 'Bounce-out: the mark on the face is a 7',
  photoId: null,
  judgedBy: 9,
  judgedByName: 'Tobias Wren',
  judgedAt: '2026-06-01T10:05:00.000Z',
});
const settlement = (arrows: ArrowValue[], disputed: number[]): SettlementRow => ({
  endKey: '1:7:0',
  sessionId: 1,
  entryId: 7,
  endIndex: 0,
  arrows,
  disputed,
  basis: { first: 1, second: 1 },
  settledBy: 3,
  settledAt: '2026-06-01T10:02:00.000Z',
});

describe("a judge's ruling on the pads", () => {
  it('counts the ruled values in the totals, not the writer’s own card', () => {
    const bounced: ArrowValue[] = ['10', '9', '9', '8', '7', 'M'];
    const end = localEnd([record(1, bounced), record(2, bounced)], undefined, [], {
      rulings: [ruling(SIX)],
    });
    expect(countedValues(end, bounced)).toEqual(SIX);
    // While no one but the writers decided, the pad counts what this writer typed.
    const open = localEnd([record(1, bounced)], undefined, []);
    expect(countedValues(open, ['10'])).toEqual(['10']);
  });

  it('keeps every ruling with the values it replaced, oldest first', () => {
    const end = localEnd([record(1, SIX), record(2, ['10', '9', '8', '8', '7', '6'])], undefined, [], {
      rulings: [ruling(['10', '9', '9', '8', '7', '7'], 2), ruling(SIX, 1)],
    });
    expect(end.rulings.map((s) => s.before)).toEqual([
      { by: 'cards', first: SIX, second: ['10', '9', '8', '8', '7', '6'] },
      { by: 'judge', arrows: SIX },
    ]);
    expect(end.ruling).toMatchObject({
      judgedByName: 'Tobias Wren',
      arrows: ['10', '9', '9', '8', '7', '7'],
    });
  });
});

describe('flags on either card', () => {
  it('show once each, with whose card marks them, until a judge rules', () => {
    const end = localEnd(
      [record(1, SIX, [{ index: 5, flag: 'bounce-out' }]), record(2, SIX, [{ index: 2, flag: 'missing' }])],
      undefined,
      [],
    );
    expect(openFlags(end)).toEqual([
      { index: 2, flag: 'missing', slots: [2] },
      { index: 5, flag: 'bounce-out', slots: [1] },
    ]);
    expect(
      openFlags(
        localEnd([record(1, SIX, [{ index: 5, flag: 'bounce-out' }])], undefined, [], {
          rulings: [ruling(SIX)],
        }),
      ),
    ).toEqual([]);
  });
});

describe("the caller's word on pulling arrows", () => {
  const agreed = localEnd([record(1, SIX), record(2, SIX)], undefined, []);
  it('says arrows can be pulled only when every end is agreed or settled with no flag', () => {
    expect(
      pullAdvice([
        { position: 'A', local: agreed },
        { position: 'B', local: agreed },
      ]).kind,
    ).toBe('pull');
  });

  it('holds while an arrow is flagged on one card, even though both cards agree', () => {
    const flagged = localEnd(
      [record(1, SIX, [{ index: 5, flag: 'bounce-out' }]), record(2, SIX)],
      undefined,
      [],
    );
    expect(endView(flagged.facts).state).toBe('agreed');
    const advice = pullAdvice([
      { position: 'A', local: agreed },
      { position: 'B', local: flagged },
    ]);
    expect(advice.kind).toBe('hold');
    expect(advice.text).toMatch(/^Do not pull yet\. B: bounce-out on arrow 6/);
  });

  it('holds while an arrow is with a judge or the cards differ, and waits for missing cards', () => {
    const disputed = localEnd(
      [record(1, SIX), record(2, ['10', '9', '8', '8', '7', '6'])],
      settlement(SIX, [2]),
      [],
    );
    expect(pullAdvice([{ position: 'C', local: disputed }]).text).toMatch(/C: arrow 3 is with a judge/);
    const differ = localEnd([record(1, SIX), record(2, ['10', '9', '8', '8', '7', '6'])], undefined, []);
    expect(pullAdvice([{ position: 'D', local: differ }]).text).toMatch(/D: the cards differ at arrow 3/);
    const waiting = pullAdvice([
      { position: 'A', local: agreed },
      { position: 'B', local: undefined },
    ]);
    expect(waiting).toMatchObject({ kind: 'wait' });
    expect(waiting.text).toMatch(/^Waiting for both writers' cards of B/);
  });
});

describe('the ruling form', () => {
  it('leaves the disputed arrow empty instead of starting from one writer’s value', () => {
    const local = localEnd(
      [record(1, SIX), record(2, ['10', '9', '8', '8', '7', '6'])],
      settlement(SIX, [2]),
      [],
    );
    expect(startingValues({ local, view: endView(local.facts) }, 6)).toEqual(['10', '9', '', '8', '7', '6']);
  });

  it('leaves differing and flagged arrows empty too', () => {
    const differ = localEnd([record(1, SIX), record(2, ['10', '9', '8', '8', '7', '6'])], undefined, []);
    expect(startingValues({ local: differ, view: endView(differ.facts) }, 6)).toEqual([
      '10',
      '9',
      '',
      '8',
      '7',
      '6',
    ]);
    const flagged = localEnd(
      [record(1, SIX, [{ index: 5, flag: 'bounce-out' }]), record(2, SIX)],
      undefined,
      [],
    );
    expect(startingValues({ local: flagged, view: endView(flagged.facts) }, 6)).toEqual([
      '10',
      '9',
      '9',
      '8',
      '7',
      '',
    ]);
  });
});

describe('keyboard entry', () => {
  const FULL: ArrowValue[] = ['X', '10', '9', '8', '7', '6', '5', '4', '3', '2', '1', 'M'];
  const type = (keys: string[], allowed = FULL) => {
    let pending = false;
    const values: ArrowValue[] = [];
    for (const key of keys) {
      const step = feedKey(pending, key, allowed);
      pending = step.pending;
      values.push(...step.values);
    }
    return { values, pending };
  };

  it('reads "1" then "0" as one arrow of 10, not 1 and 10', () => {
    expect(type(['1', '0'])).toEqual({ values: ['10'], pending: false });
  });

  it('waits after a lone "1"; Enter, space or the next value key makes it 1', () => {
    expect(type(['1'])).toEqual({ values: [], pending: true });
    expect(type(['1', 'Enter'])).toEqual({ values: ['1'], pending: false });
    expect(type(['1', ' '])).toEqual({ values: ['1'], pending: false });
    expect(type(['1', '9'])).toEqual({ values: ['1', '9'], pending: false });
    expect(type(['1', '1', '0'])).toEqual({ values: ['1', '10'], pending: false });
    expect(flushLoneOne(FULL)).toEqual(['1']);
  });

  it('understands X, M, 0 for 10, and only values of the face', () => {
    expect(type(['x', 'X', 'm', '0', '9'])).toEqual({ values: ['X', 'X', 'M', '10', '9'], pending: false });
    const sixRing: ArrowValue[] = ['X', '10', '9', '8', '7', '6', '5', 'M'];
    expect(type(['4', '1', '0'], sixRing)).toEqual({ values: ['10'], pending: false });
    // A lone 1 on a face without 1 counts as nothing.
    expect(type(['1', 'Enter'], sixRing).values).toEqual([]);
    expect(flushLoneOne(sixRing)).toEqual([]);
    expect(feedKey(false, 'q', FULL).handled).toBe(false);
  });
});

describe('what waits to sync, in words', () => {
  it('counts one end of four archers typed tap by tap as four ends, and keeps the exact count', () => {
    const taps = ['A', 'B', 'C', 'D'].flatMap((archer) =>
      Array.from({ length: 6 }, () => ({ kind: 'end.write' as const, endKey: `1:${archer}:0` })),
    );
    const summary = summarizeWaiting(taps);
    expect(summary).toEqual({ changes: 24, ends: 4, signatures: 0, shootOffArrows: 0, practiceSessions: 0 });
    expect(waitingWords(summary)).toBe('4 ends');
    expect(changesWords(summary)).toBe('24 changes');
  });

  it('counts signatures apart from ends', () => {
    const summary = summarizeWaiting([
      { kind: 'end.rule', endKey: '1:7:0' },
      { kind: 'end.sign', endKey: '1:7:0' },
      { kind: 'card.sign', endKey: '1:7:card' },
    ]);
    expect(waitingWords(summary)).toBe('1 end and 2 signatures');
  });

  it('counts a re-recorded shoot-off arrow once, apart from ends and signatures', () => {
    const summary = summarizeWaiting([
      { kind: 'end.sign', endKey: '1:7:0' },
      { kind: 'shootoff.record', endKey: '1:7:shootoff:0' },
      { kind: 'shootoff.record', endKey: '1:7:shootoff:0' },
      { kind: 'shootoff.record', endKey: '1:8:shootoff:0' },
    ]);
    expect(summary.shootOffArrows).toBe(2);
    expect(waitingWords(summary)).toBe('1 signature and 2 shoot-off arrows');
  });

  it('names a practice session waiting with no end of its own, and folds it into its ends otherwise', () => {
    // Just started (its setup alone), and another deleted: nothing reads "· waiting" with no noun.
    const started = summarizeWaiting([
      { kind: 'practice.session', endKey: 'practice:s1' },
      { kind: 'practice.delete', endKey: 'practice:s2' },
    ]);
    expect(waitingWords(started)).toBe('2 practice sessions');
    const shot = summarizeWaiting([
      { kind: 'practice.session', endKey: 'practice:s1' },
      { kind: 'practice.end', endKey: 'practice:s1:0' },
      { kind: 'practice.end', endKey: 'practice:s1:0' },
    ]);
    expect(waitingWords(shot)).toBe('1 end');
    expect(changesWords(shot)).toBe('3 changes');
  });
});
