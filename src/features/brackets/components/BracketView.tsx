import type { BracketDto } from '../../../contract/matches';
import { MatchCard } from './MatchCard';
import { roundName } from '../../../ui/bracketLabels';

/** One division's bracket: final places so far, then each round from the first, the bronze match beside the final. */
export function BracketView({ bracket }: { bracket: BracketDto }) {
  const rounds = Array.from({ length: bracket.rounds }, (_, r) => r);
  const headingId = `bracket-${bracket.id}`;
  return (
    <section
      aria-labelledby={headingId}
      className="surface space-y-3 rounded-xl border-2 border-line bg-card p-3"
    >
      <h2 id={headingId} className="text-2xl font-bold">
        {bracket.divisionName}
        <span className="block text-base font-normal">
          {bracket.format === 'sets' ? 'Set system' : 'Cumulative score'} · {bracket.entrants} archers
        </span>
      </h2>
      {bracket.places.length > 0 && (
        <section aria-labelledby={`${headingId}-places`}>
          <h3 id={`${headingId}-places`} className="text-xl font-bold">
            Final places
          </h3>
          <ol className="space-y-1" data-testid="final-places">
            {bracket.places.map((p) => (
              <li key={p.seed}>
                <span className="font-bold">{p.place}.</span> {p.name}{' '}
                <span className="text-ink-soft">(seed {p.seed})</span>
              </li>
            ))}
          </ol>
        </section>
      )}
      {rounds.map((round) => {
        const matches = bracket.matches.filter((m) => m.round === round && !m.bronze);
        const bronze = bracket.matches.find((m) => m.round === round && m.bronze);
        return (
          <section key={round} aria-labelledby={`${headingId}-round-${round}`} className="space-y-2">
            <h3 id={`${headingId}-round-${round}`} className="text-xl font-bold">
              {roundName(round, bracket.rounds)}
            </h3>
            {matches.map((m) => (
              <MatchCard key={m.id} match={m} />
            ))}
            {bronze && (
              <>
                <h3 className="text-xl font-bold">Bronze match</h3>
                <MatchCard match={bronze} />
              </>
            )}
          </section>
        );
      })}
    </section>
  );
}
