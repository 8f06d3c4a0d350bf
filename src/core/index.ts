// The scoring core shared by the phone and the server: pure functions, no platform code.
export { ScoringError } from './errors';
export type { ScoringErrorCode } from './errors';

export {
  ARROW_VALUES,
  arrowPoints,
  compareArrowValues,
  isArrowValue,
  isHit,
  isNine,
  isTen,
  isX,
  parseArrowValue,
} from './arrowValue';
export type { ArrowValue } from './arrowValue';

export {
  BOW_STYLES,
  FACE_IDS,
  TRIPLE_SPOT_SPACING_MM,
  VENUES,
  describeFaceFor,
  getFace,
  isFaceId,
  scoresInnerTenOnly,
  scoringValues,
} from './faces';
export type { BowStyle, Face, FaceId, FaceZone, Venue, ZoneColour, ZoneValue } from './faces';

export {
  MAX_ARROW_POINTS,
  ROUND_CATALOG,
  defineCustomRound,
  endsOfRound,
  getRound,
  roundArrowCount,
  roundEndCount,
  roundMaxScore,
} from './rounds';
export type { RoundDefinition, RoundDistance, RoundEnd } from './rounds';

export { countingArrows, endTotal, sortEnd, sortEndWithMarks, validateEnd } from './ends';
export type { EndCheck, EndRules } from './ends';
export { endRules } from './endRules';
export { rulesForEnd, writerLock } from './endLock';
export type { WriterLock } from './endLock';

export { cardTotals } from './card';
export type { CardEnd, CardTotals, DistanceTally, Tally } from './card';

// Plotting (./plotting) and practice (./practice) are imported from their own files, and so are the
// values of ranking (./ranking) and matches (./matches): through this index their code would join
// the chunk every screen shares, the pad's too, though only results, the desk and matches use them.

export { crossCheck } from './crossCheck';
export type { CrossCheck, CrossCheckArrow, CrossCheckStatus } from './crossCheck';

export type { Placing, RankInput, RankOptions, ShootOffArrow, TeamMemberInput, TeamResult } from './ranking';

export { canonicalJson } from './canonicalJson';
export { cleanText } from './cleanText';

export { endView, rulingSteps, settlementApplies } from './endState';
export type { EndFacts, EndState, EndView, Settlement, ValuesBefore, WriterRecord } from './endState';

export type * from './matches';
