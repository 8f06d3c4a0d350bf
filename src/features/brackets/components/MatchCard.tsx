import type { MatchDto } from '../../../contract/matches';
import type { Side } from '../../../core';
import { countersignedLine, matchLine, matchStatus } from '../../../ui/bracketLabels';
import { WonMark } from '../../../ui/WonMark';

/** One match: its two sides with seed, archer and score; the winner is marked by a word and a shape, never by colour alone. */
export function MatchCard({ match }: { match: MatchDto }) {
  const line = (side: Side) => {
    const { seed, name, score, won } = matchLine(match, side);
    return (
      <li className="flex items-baseline gap-2" data-testid={`side-${side}`}>
        <span className="w-8 shrink-0 text-right text-ink-soft">{seed ?? '–'}</span>
        <span className={`flex-1 ${won ? 'font-bold' : ''}`}>
          {name}
          {won && <WonMark />}
        </span>
        {score !== undefined && <span className="text-xl font-bold">{score}</span>}
      </li>
    );
  };
  return (
    <article
      className="surface rounded-lg border-2 border-line bg-card p-2"
      data-testid={`match-${match.id}`}
      aria-label={`Match ${match.slot + 1}${match.bronze ? ' (bronze)' : ''}`}
    >
      <ul className="space-y-1">
        {line('a')}
        {line('b')}
      </ul>
      <p className="mt-1 text-base text-ink-soft">
        {matchStatus(match)}
        {match.targetNumber !== null && ` · target ${match.targetNumber}`}
      </p>
      {countersignedLine(match) && <p className="text-base">✓ {countersignedLine(match)}</p>}
    </article>
  );
}
