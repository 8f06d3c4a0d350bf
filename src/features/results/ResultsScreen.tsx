import { Link, useParams } from 'react-router-dom';
import { useEventResults } from '../../api/eventResults';
import { ResultsState } from './components/ResultsState';
import { StandingsTable } from './components/StandingsTable';
import { TeamsTable } from './components/TeamsTable';
import { asOf } from './components/labels';

/**
 * An event's results for anyone with the link (no account needed once published): every
 * session's divisions, standings with their trust and shoot-off flags, teams. It asks every few
 * seconds whether anything changed and keeps its last copy for offline.
 */
export function ResultsScreen() {
  const eventId = Number(useParams().eventId);
  const query = useEventResults(eventId);
  return (
    <div className="space-y-5">
      <ResultsState query={query}>
        {({ results }) => (
          <>
            <header className="space-y-1">
              <h1 className="text-3xl font-bold leading-tight">Results: {results.event.name}</h1>
              <p data-testid="results-as-of">
                As of {asOf(results.computedAt)} · {results.finalCards} of {results.totalCards} cards final
                {!results.event.published && ' · not published yet: only the event’s people see this'}
              </p>
              <p className="flex flex-wrap gap-x-4">
                <Link
                  className="inline-flex min-h-12 items-center font-bold underline"
                  to={`/results/${eventId}/field`}
                >
                  Field screen
                </Link>
                <Link
                  className="inline-flex min-h-12 items-center font-bold underline"
                  to={`/results/${eventId}/brackets`}
                >
                  Eliminations
                </Link>
                {results.event.published && (
                  <>
                    <a
                      className="inline-flex min-h-12 items-center font-bold underline"
                      href={`/api/results/${eventId}/pdf`}
                      download
                    >
                      Print (PDF)
                    </a>
                    <a
                      className="inline-flex min-h-12 items-center font-bold underline"
                      href={`/api/results/${eventId}/csv`}
                      download
                    >
                      Download CSV
                    </a>
                  </>
                )}
              </p>
            </header>
            {results.sessions.map((session) => (
              <section
                key={session.sessionId}
                aria-labelledby={`session-${session.sessionId}`}
                className="space-y-4"
              >
                <h2 id={`session-${session.sessionId}`} className="text-2xl font-bold">
                  {session.name}
                </h2>
                {session.divisions.map((division) => (
                  <section
                    key={division.divisionId}
                    aria-labelledby={`division-${session.sessionId}-${division.divisionId}`}
                    className="surface space-y-3 rounded-xl border-2 border-line bg-card p-3"
                  >
                    <h3
                      id={`division-${session.sessionId}-${division.divisionId}`}
                      className="text-xl font-bold"
                    >
                      {division.name}
                      <span className="block text-base font-normal">
                        {division.roundName}
                        {division.cut !== null ? ` · top ${division.cut} go through` : ''}
                      </span>
                    </h3>
                    {results.event.published && (
                      <a
                        className="inline-flex min-h-12 items-center font-bold underline"
                        href={`/api/results/${eventId}/pdf?division=${division.divisionId}`}
                        download
                      >
                        Print {division.name} (PDF)
                      </a>
                    )}
                    {division.rows.length === 0 ? (
                      <p>No archers on targets yet.</p>
                    ) : (
                      <StandingsTable division={division} />
                    )}
                    {division.classes.map((c) => (
                      <section key={c.name} aria-label={`${division.name}, ${c.name}`} className="space-y-2">
                        <h4 className="text-lg font-bold">{c.name}</h4>
                        <StandingsTable division={division} className={c.name} />
                      </section>
                    ))}
                    <TeamsTable division={division} />
                  </section>
                ))}
              </section>
            ))}
          </>
        )}
      </ResultsState>
    </div>
  );
}
