// Head-to-head matches after qualification: match scoring, bracket seeding and final places.
export { other, shootOffWinner } from './shootOff';
export type { ShootOffOutcome, Side } from './shootOff';
export { MATCH_ARROWS_PER_END, MATCH_MAX_ENDS, SET_POINTS_TO_WIN, matchState } from './matchState';
export type {
  MatchEnd,
  MatchFormat,
  MatchNext,
  MatchRecord,
  MatchState,
  Pair,
  ScoredEnd,
  SetOutcome,
  SideOutlook,
} from './matchState';
export {
  MAX_BRACKET_ENTRANTS,
  MIN_BRACKET_ENTRANTS,
  bracketRounds,
  bracketSize,
  firstRound,
  seedLines,
} from './seeding';
export type { FirstRoundMatch } from './seeding';
export { finalPlaces } from './finalPlaces';
export { matchCrossCheck } from './matchCrossCheck';
export type { MatchCrossCheck } from './matchCrossCheck';
export { countedEnds } from './countedEnds';
export type { CountedEnd, EndCountedBy, EndOnRecord } from './countedEnds';
export { MATCH_SECONDS_PER_ARROW } from './timing';
export { endOrder, firstInEnd, lastInOrder, nextArrow, nextInOrder, shootingOrder } from './shootingOrder';
export type { EndSoFar } from './shootingOrder';
export { ALTERNATE_FROM, alternates } from './alternation';
export type { AlternateFrom } from './alternation';
export type { BracketArcher, FinalPlace } from './finalPlaces';
