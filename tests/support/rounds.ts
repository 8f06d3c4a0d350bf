import type { RoundDefinition } from '../../src/core';

/** A hand-built round whose 10 arrows at one distance are shot as an end of 6 and a shorter end of 4. */
export const UNEVEN_ROUND: RoundDefinition = {
  id: 'custom-uneven',
  name: 'Uneven',
  venue: 'outdoor',
  distances: [
    { label: '30 m', distanceM: 30, faceId: 'full-80', arrows: 10, arrowsPerEnd: 6, secondsPerEnd: 240 },
  ],
  bowStyles: ['recurve'],
};
