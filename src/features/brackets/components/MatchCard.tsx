import type { MatchDto } from '../../../contract/matches';
import type { Side } from '../../../core';
import { matchStatus } from '../../../ui/bracketLabels';

/** One match: its two sides with seed, archer and score; the winner is marked by a word and a shape, never by colour alone. */
export function MatchCard({ match }: { match: MatchDto }) {
  const winner = match.winner ?? match.state?.winner ?? null;
  const line = (side: Side) => {
    const s = match.sides[side];
    const name = s
      ? s.archers.map((a) => a.name).join(', ')
      : match.decidedBy === 'bye'
        ? 'bye'
        : 'to be decided';
    // A walkover or bye has no score to show.
    const score = match.ends.length > 0 ? match.state?.score[side] : undefined;
    const won = winner === side;
    return (
      <li className="flex items-baseline gap-2" data-testid={`side-${side}`}>
        <span className="w-8 shrink-0 text-right text-ink-soft">{s ? s.seed : '–'}</span>
        <span className={`flex-1 ${won ? 'font-bold' : ''}`}>
          {name}
          {won && (
            <span>
              {' '}
              · <span aria-hidden="true">✓ </span>won
            </span>
          )}
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
    </article>
  );
}
