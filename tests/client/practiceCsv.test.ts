import { describe, expect, it } from 'vitest';
import type { PracticeEndRow, PracticeSessionRow } from '../../src/local/db';
import { practiceCsv } from '../../src/features/practice/practiceCsv';

const session: PracticeSessionRow = {
  ownerId: 0,
  id: 's1',
  startedAt: '2026-12-01T17:00:00.000Z',
  bowStyle: 'recurve',
  venue: 'indoor',
  distanceM: 18,
  faceId: 'triple-40',
  arrowsPerEnd: 3,
  plannedEnds: null,
  shaftDiameterMm: 5.5,
  note: '=HYPERLINK("x"), windy',
};

const end: PracticeEndRow = {
  key: 's1:0',
  sessionId: 's1',
  index: 0,
  distanceM: 18,
  faceId: 'triple-40',
  at: '2026-12-01T17:05:00.000Z',
  arrows: [
    { value: 'X', xMm: 1.23, yMm: -218.04, spot: 0 },
    { value: '9', xMm: 30, yMm: -220, spot: 0 },
    { value: '8' },
  ],
};

describe('practiceCsv', () => {
  it('writes one row an arrow with the value that counts, the point, and a note that cannot run', () => {
    const lines = practiceCsv([session], [end]).trimEnd().split('\r\n');
    expect(lines[0]).toBe(
      'session,started,round,bow style,note,end,arrow,distance m,face,value,points,x mm,y mm',
    );
    // Two arrows in the top spot: only the lower counts (oneArrowPerSpot), the X becomes M.
    expect(lines[1]).toBe(
      `s1,2026-12-01T17:00:00.000Z,"Free practice, 18 m, 40 cm triple face",recurve,"'=HYPERLINK(""x""), windy",1,1,18,40 cm triple face,M,0,1.2,-218`,
    );
    expect(lines[2]).toContain(',1,2,18,40 cm triple face,9,9,30,-220');
    expect(lines[3]).toMatch(/,1,3,18,40 cm triple face,8,8,,$/);
    expect(lines).toHaveLength(4);
  });
});
