import type { NewPracticeSession } from '../../../src/features/practice/practiceStore';

/** Free practice: 18 m on the 40 cm face, two ends of three. */
export const FREE_PRACTICE: NewPracticeSession = {
  bowStyle: 'recurve',
  venue: 'indoor',
  distanceM: 18,
  faceId: 'full-40',
  arrowsPerEnd: 3,
  plannedEnds: 2,
  shaftDiameterMm: 5.5,
};
