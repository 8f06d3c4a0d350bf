import { describe, expect, it } from 'vitest';
import type { MatchDto, MatchPadDto } from '../../src/contract/matches';
import type { OutboxRow } from '../../src/local/db';
import { matchPadView } from '../../src/local/matchPadView';
import { matchDto, side, v } from './matchFixtures';

/* A writer's match pad: own ends laid over the server's copy, each cross-checked with the other writer. */

function pad(extra: Partial<MatchDto>): MatchPadDto {
  return {
    eventId: 3,
    eventName: 'Shoot',
    divisionName: 'Recurve',
    roundName: 'Semi-finals',
    format: 'sets',
    slot: 1,
    ownEntryId: 1,
    match: matchDto({ sides: { a: side(1), b: side(2) }, targetNumber: 2, ...extra }, true),
  };
}
const row = (seq: number, args: OutboxRow['args'], status: OutboxRow['status'] = 'pending'): OutboxRow => ({
  clientId: 'c',
  seq,
  id: `id-${seq}`,
  userId: 1,
  kind: 'matchId' in args && 'endIndex' in args ? 'match.write' : 'match.countersign',
  args,
  at: '2026-12-13T10:00:00.000Z',
  endKey: `match:7:${seq}`,
  status,
});
const ref = { eventId: 3, matchId: 7 };

describe('matchPadView', () => {
  it('marks each end counted, waiting for the other writer, or sent to the judge', () => {
    const view = matchPadView(
      pad({
        ends: [{ a: v('10 10 10'), b: v('9 9 9'), by: 'writers' }],
        writes: [
          { slot: 1, endIndex: 0, a: v('10 10 10'), b: v('9 9 9') },
          { slot: 2, endIndex: 0, a: v('10 10 10'), b: v('9 9 9') },
          { slot: 2, endIndex: 1, a: v('9 9 9'), b: v('8 8 8') },
        ],
      }),
      [
        row(1, { ...ref, endIndex: 1, a: v('9 9 9'), b: v('8 8 7') }),
        row(2, { ...ref, endIndex: 2, a: v('10'), b: [] }),
      ],
    );
    expect(view.ends.map((e) => e.status)).toEqual(['counted', 'mismatch', 'waiting']);
    expect(view.ends[1]!.waiting).toBe(true);
    expect(view.current).toBe(2);
    expect(view.undoEnd).toBe(2);
  });

  it('undoes into the last end while it does not count yet, never into a counted one', () => {
    const writes = [{ slot: 1 as const, endIndex: 0, a: v('10 10 10'), b: v('9 9 9') }];
    expect(matchPadView(pad({ writes }), []).undoEnd).toBe(0);
    const both = [...writes, { ...writes[0]!, slot: 2 as const }];
    const counted = pad({ writes: both, ends: [{ a: v('10 10 10'), b: v('9 9 9'), by: 'writers' }] });
    expect(matchPadView(counted, []).undoEnd).toBeNull();
  });

  it('takes a counted end this writer changes out of the count at once, with the ends after it', () => {
    const agreed = (endIndex: number, a: string, b: string) =>
      ([1, 2] as const).map((slot) => ({ slot, endIndex, a: v(a), b: v(b) }));
    const served = pad({
      ends: [
        { a: v('10 10 10'), b: v('9 9 9'), by: 'writers' },
        { a: v('9 9 9'), b: v('9 9 9'), by: 'writers' },
      ],
      writes: [...agreed(0, '10 10 10', '9 9 9'), ...agreed(1, '9 9 9', '9 9 9')],
    });
    expect(matchPadView(served, []).counted).toHaveLength(2);
    const changed = matchPadView(served, [row(1, { ...ref, endIndex: 0, a: v('10 10 9'), b: v('9 9 9') })]);
    expect(changed.ends.map((e) => e.status)).toEqual(['mismatch', 'stopped']);
    expect(changed.counted).toEqual([]);
  });

  it('says which ends the judge signed, and never undoes into one', () => {
    const writes = [{ slot: 1 as const, endIndex: 0, a: v('10 10 10'), b: v('9 9 9') }];
    const signed = pad({ writes, ends: [{ a: v('10 10 10'), b: v('9 9 9'), by: 'judge', signed: true }] });
    const view = matchPadView(signed, []);
    expect(view.ends[0]).toMatchObject({ status: 'judge', signed: true });
    expect(view.undoEnd).toBeNull();
  });

  it('shows the countersignature waiting on this phone, then the server’s', () => {
    expect(matchPadView(pad({}), [row(1, ref)]).countersigned).toBe('waiting');
    expect(matchPadView(pad({ countersignedBy: [1] }), []).countersigned).toBe('server');
  });
});
