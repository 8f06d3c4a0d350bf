import type { MatchDto } from '../../../contract/matches';
import type { Side } from '../../../core';
import { matchLine, matchStatus } from '../../../ui/bracketLabels';
import { WonMark } from '../../../ui/WonMark';

/** One match on the field screen: both lines with seed, archer and score, the winner marked in words. */
export function FieldMatch({ match }: { match: MatchDto }) {
  const line = (side: Side) => {
    const { seed, name, score, won } = matchLine(match, side);
    return (
      <li
        className="grid grid-cols-[5rem_1fr_auto] items-baseline gap-4 text-4xl lg:text-5xl"
        data-testid={`field-side-${side}`}
      >
        <span className="text-right text-ink-soft">{seed ?? '–'}</span>
        <span className={won ? 'font-bold' : ''}>
          {name}
          {won && <WonMark />}
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
