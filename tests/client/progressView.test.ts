import { describe, expect, it } from 'vitest';
import { progressView } from '../../src/features/practice/progress/progressView';
import type { TournamentCard } from '../../src/contract/myCards';
import type { PracticeSessionRow } from '../../src/local/db';

const session = (id: string, distanceM: number, bowStyle: 'recurve' | 'barebow'): PracticeSessionRow => ({
  id,
  ownerId: 0,
  startedAt: '2026-01-05T17:00:00.000Z',
  bowStyle,
  venue: 'outdoor',
  distanceM,
  faceId: distanceM === 18 ? 'full-40' : 'full-122',
  arrowsPerEnd: 6,
  plannedEnds: null,
  shaftDiameterMm: 5.5,
});
const own = [
  {
    session: session('a', 18, 'recurve'),
    parts: [{ distanceM: 18, faceId: 'full-40' as const, arrows: 30, points: 270 }],
  },
  {
    session: session('b', 70, 'barebow'),
    parts: [{ distanceM: 70, faceId: 'full-122' as const, arrows: 36, points: 288 }],
  },
];

/** No tournament cards: the same answer each time, as the shared read keeps it. */
const cards: TournamentCard[] = [];

/*
 * What progress shows is worked out once per answer of the log's reads and filter (the log does
 * it while idle): opening the screen again, or from the log, does not work it out again.
 */
describe('progressView', () => {
  it('is worked out once per answer and filter, and again for a new answer', () => {
    const all = progressView(own, cards, {});
    expect(all.series.map((s) => s.series.distanceM)).toEqual([18, 70]);
    // Its words worked out with it (dates formatted then, not in the tap's render).
    expect(all.series[1]?.title).toBe('70 m · 122 cm face');
    expect(all.series[1]?.summary).toMatch(/^Week of .*: 8\.00 an arrow over 36 arrows\. Best session: 8\.00 an arrow on .* \(36 arrows\), ringed on the chart\.$/);
    expect(all.choices).toEqual({ bowStyles: ['recurve', 'barebow'], distances: [18, 70] });
    // The same answers: the very same view, nothing worked out again.
    expect(progressView(own, cards, {})).toBe(all);

    const barebow = progressView(own, cards, { bowStyle: 'barebow' });
    expect(barebow.series.map((s) => s.series.distanceM)).toEqual([70]);
    expect(barebow.choices).toBe(all.choices);
    expect(progressView(own, cards, { bowStyle: 'barebow' })).toBe(barebow);

    // A new answer (an arrow stored): worked out from it.
    const more = [...own, { session: session('c', 18, 'recurve'), parts: own[0]!.parts }];
    const after = progressView(more, cards, {});
    expect(after).not.toBe(all);
    expect(after.series[0]?.series.weeks[0]?.sessions).toBe(2);
  });
});
