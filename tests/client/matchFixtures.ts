import type { ArrowValue } from '../../src/core';
import { matchState } from '../../src/core/matches';
import type { MatchDto } from '../../src/contract/matches';

/** Match fixtures shared by the client tests of match cards, pads and bracket labels. */

export const v = (text: string) => (text ? (text.split(' ') as ArrowValue[]) : []);
export const side = (seed: number, name = `Archer ${seed}`) => ({
  seed,
  archers: [{ entryId: seed, name, club: '' }],
});

/** A set-system match (id 7) as the server sends it, with the core's reading of its ends when `read`. */
export function matchDto(extra: Partial<MatchDto> = {}, read = false): MatchDto {
  const m: MatchDto = {
    id: 7,
    round: 0,
    slot: 0,
    bronze: false,
    targetNumber: 5,
    sides: { a: side(1, 'Ada'), b: side(4, 'Bo') },
    ends: [],
    shootOff: {},
    state: null,
    winner: null,
    decidedBy: null,
    signedAt: null,
    writes: [],
    countersignedBy: [],
    alternate: false,
    firstShooter: null,
    ...extra,
  };
  if (!read) return m;
  const s = matchState('sets', { ends: m.ends, shootOff: m.shootOff });
  const { score, totals, next, winner, endsLeft, shootOff, outlook } = s;
  const setPoints = s.ends.map((e) => e.setPoints ?? null);
  return { ...m, state: { score, totals, setPoints, next, winner, endsLeft, shootOff, outlook } };
}
