import { useEffect, useState } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import type { EventResults } from '../../contract/results';
import type { BracketDto } from '../../contract/matches';
import { useEventBrackets } from '../../api/eventBrackets';
import { useEventResults } from '../../api/eventResults';
import { FieldMatch } from './components/FieldMatch';
import { fieldBracketPages, type FieldBracketPage } from './fieldBracketPages';
import { ResultsState } from './components/ResultsState';
import { TRUST_LABEL, asOf, placeText, shootOffText } from './components/labels';

/** Rows on one page of the field screen: readable from 10 m on a 1080-line screen. */
const ROWS_PER_PAGE = 8;
const DEFAULT_SECONDS = 12;

type Page =
  | {
      kind: 'standings';
      title: string;
      subtitle: string;
      rows: EventResults['sessions'][number]['divisions'][number]['rows'];
    }
  | FieldBracketPage;

/** Every division's standings, then every division's bracket (current round, or its final places). */
function pagesOf(results: EventResults, brackets: BracketDto[]): Page[] {
  const standings = results.sessions.flatMap((session) =>
    session.divisions
      .filter((d) => d.rows.length > 0)
      .flatMap((d) => {
        const count = Math.ceil(d.rows.length / ROWS_PER_PAGE);
        return Array.from({ length: count }, (_, i) => ({
          kind: 'standings' as const,
          title: d.name,
          subtitle: `${session.name} · ${d.roundName}${count > 1 ? ` · page ${i + 1} of ${count}` : ''}`,
          rows: d.rows.slice(i * ROWS_PER_PAGE, (i + 1) * ROWS_PER_PAGE),
        }));
      }),
  );
  return [...standings, ...fieldBracketPages(brackets, ROWS_PER_PAGE)];
}

/**
 * The results for a big screen or projector at the field: large type, one division (page) at a
 * time, then each division's bracket (the current round's matches, or the final places once
 * decided), moving on by itself every few seconds (`?seconds=` changes it); nobody has to touch it.
 */
export function FieldResultsScreen() {
  const eventId = Number(useParams().eventId);
  const [params] = useSearchParams();
  const seconds = Math.max(3, Number(params.get('seconds')) || DEFAULT_SECONDS);
  const query = useEventResults(eventId);
  const brackets = useEventBrackets(eventId).data?.brackets ?? [];
  const [tick, setTick] = useState(0);
  useEffect(() => {
    const timer = setInterval(() => setTick((t) => t + 1), seconds * 1000);
    return () => clearInterval(timer);
  }, [seconds]);

  return (
    <ResultsState query={query}>
      {({ results }) => {
        const pages = pagesOf(results, brackets);
        const page = pages[tick % Math.max(1, pages.length)];
        return (
          // Wider than the app's reading column: the whole width of a big screen.
          <div
            className="relative left-1/2 w-[calc(100vw-2rem)] max-w-[1800px] -translate-x-1/2 space-y-4"
            data-testid="field-screen"
          >
            <p className="text-2xl lg:text-3xl">
              {results.event.name} · as of {asOf(results.computedAt)} · {results.finalCards} of{' '}
              {results.totalCards} cards final
            </p>
            {!page ? (
              <p className="text-4xl font-bold">No standings yet.</p>
            ) : (
              <section aria-labelledby="field-division" aria-live="polite">
                <h1
                  id="field-division"
                  className="text-5xl font-bold leading-tight"
                  data-testid="field-division"
                >
                  {page.title}
                </h1>
                <p className="text-2xl">{page.subtitle}</p>
                {page.kind === 'matches' && (
                  <ol className="mt-3 space-y-2" data-testid="field-matches">
                    {page.matches.map((m) => (
                      <FieldMatch key={m.id} match={m} />
                    ))}
                  </ol>
                )}
                {page.kind === 'places' && (
                  <ol className="mt-3 space-y-1" data-testid="field-places">
                    {page.places.map((p) => (
                      <li
                        key={p.seed}
                        className="grid grid-cols-[4rem_1fr] items-baseline gap-4 border-b-2 border-line py-2 text-3xl lg:grid-cols-[8rem_1fr] lg:text-6xl"
                      >
                        <span className="font-bold">{p.place}.</span>
                        <span>
                          <span className="font-bold">{p.name}</span>
                          <span className="block text-xl lg:ml-4 lg:inline lg:text-3xl">{p.club}</span>
                        </span>
                      </li>
                    ))}
                  </ol>
                )}
                {page.kind === 'standings' && (
                  <ol className="mt-3 space-y-1">
                    {page.rows.map((r) => {
                      const flag = shootOffText(r);
                      return (
                        <li
                          key={r.entryId}
                          className="grid grid-cols-[4rem_1fr_auto] items-baseline gap-4 border-b-2 border-line py-2 text-3xl lg:grid-cols-[8rem_1fr_auto] lg:text-6xl"
                        >
                          <span className="font-bold">{placeText(r)}</span>
                          <span>
                            <span className="font-bold">{r.name}</span>
                            <span className="block text-xl lg:ml-4 lg:inline lg:text-3xl">
                              {TRUST_LABEL[r.trust].mark} {TRUST_LABEL[r.trust].word}
                              {flag && ` · ${flag}`}
                            </span>
                          </span>
                          <span className="text-right font-bold">{r.total}</span>
                        </li>
                      );
                    })}
                  </ol>
                )}
              </section>
            )}
          </div>
        );
      }}
    </ResultsState>
  );
}
