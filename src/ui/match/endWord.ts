import type { MatchFormat } from '../../core';

/** What one end of a match is called: a set in the set system, an end when the score is cumulative. */
export const endWord = (format: MatchFormat): 'set' | 'end' => (format === 'sets' ? 'set' : 'end');

/** "Set 2" / "End 2" for the end at `endIndex` (from 0). */
export const endTitle = (format: MatchFormat, endIndex: number): string =>
  `${format === 'sets' ? 'Set' : 'End'} ${endIndex + 1}`;
