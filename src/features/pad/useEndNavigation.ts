import type { JoinedTarget } from '../../local/db';

export type TargetArcher = JoinedTarget['archers'][number];

/** The ends of an archer's round, each with its distance and arrows per end. */
export function roundEnds(
  archer: TargetArcher,
): { endIndex: number; distanceIndex: number; arrowsPerEnd: number; label: string }[] {
  const ends: { endIndex: number; distanceIndex: number; arrowsPerEnd: number; label: string }[] = [];
  archer.round.distances.forEach((d, distanceIndex) => {
    for (let i = 0; i < d.arrows / d.arrowsPerEnd; i += 1) {
      ends.push({ endIndex: ends.length, distanceIndex, arrowsPerEnd: d.arrowsPerEnd, label: d.label });
    }
  });
  return ends;
}
