import { randomUUID } from 'node:crypto';
import type { PracticeEndDto, PracticeSessionDto } from '../../../src/contract/practice';

/** A practice session's setup as a phone sends it, with a fresh id. */
export const session = (over: Partial<PracticeSessionDto> = {}): PracticeSessionDto => ({
  id: randomUUID(),
  startedAt: '2026-11-30T09:00:00.000Z',
  bowStyle: 'recurve',
  venue: 'indoor',
  distanceM: 18,
  faceId: 'full-40',
  arrowsPerEnd: 3,
  plannedEnds: 4,
  shaftDiameterMm: 5.5,
  note: 'Windy',
  ...over,
});

export const arrows = (...values: string[]) =>
  values.map((value) => ({ value }) as PracticeEndDto['arrows'][number]);

export const end = (sessionId: string, index: number, values: PracticeEndDto['arrows']): PracticeEndDto => ({
  sessionId,
  index,
  distanceM: 18,
  faceId: 'full-40',
  arrows: values,
  at: '2026-11-30T09:05:00.000Z',
});
