import type { MatchDto } from '../../../contract/matches';
import type { Side } from '../../../core';
import { matchStatus } from '../../../ui/bracketLabels';

/** One match on the field screen: both lines with seed, archer and score, the winner marked in words. */
export function FieldMatch({ match }: { match: MatchDto }) {
  const winner = match.winner ?? match.state?.winner ?? null;
  const line = (side: Side) => {
    const s = match.sides[side];
    const name = s ? s.archers.map((a) => a.name).join(', ') : 'to be decided';
    const score = match.ends.length > 0 ? match.state?.score[side] : undefined;
    const won = winner === side;
    return (
      <li
        className="grid grid-cols-[5rem_1fr_auto] items-baseline gap-4 text-4xl lg:text-5xl"
        data-testid={`field-side-${side}`}
      >
        <span className="text-right text-ink-soft">{s ? s.seed : '–'}</span>
        <span className={won ? 'font-bold' : ''}>
          {name}
          {won && (
            <span>
              {' '}
              · <span aria-hidden="true">✓ </span>won
            </span>
          )}
        </span>
        <span className="text-right font-bold">{score ?? ''}</span>
      </li>
    );
  };
  return (
    <li className="border-b-2 border-line py-2" data-testid={`field-match-${match.id}`}>
      <ul className="space-y-1">
        {line('a')}
        {line('b')}
      </ul>
      <p className="text-2xl lg:text-3xl">
        {match.bronze ? 'Bronze match · ' : ''}
        {matchStatus(match)}
        {match.targetNumber !== null && ` · target ${match.targetNumber}`}
      </p>
    </li>
  );
}
