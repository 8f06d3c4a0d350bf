import { lazy, Suspense, useState } from 'react';
import { Link } from 'react-router-dom';
import type { BowStyle } from '../../../core';
import { usePhoneOwner } from '../../../local/phoneOwner';
import { BOW_STYLE_LABELS } from '../plan';
import { useOwnSessionParts, useStoredTournamentCards } from '../storedPractice';
import { useFreshTournamentCards } from '../tournamentCards';
import { CHART_HEIGHT, perArrow, weekLabel } from './progressData';
import { progressChartLoader } from './loadProgress';
import { progressView, type ShownSeries } from './progressView';

// The log works progress out while idle (warmProgressView): with this chunk, not before.
export { progressView };

// The chart library comes with the chart, after the screen and its table are on show.
const ProgressChart = lazy(progressChartLoader);

/** Progress over weeks: the average per arrow by week, per distance and face, from this phone's log. */
export function ProgressScreen() {
  const owner = usePhoneOwner();
  // Practice and the person's own tournament cards (marked as such), all read from the phone:
  // the log's reads (shared), so opened from the log it draws from its answers at once.
  const own = useOwnSessionParts(owner);
  const cards = useStoredTournamentCards(owner);
  useFreshTournamentCards(owner);
  const [bowStyle, setBowStyle] = useState<BowStyle>();
  const [distanceM, setDistanceM] = useState<number>();
  // Worked out once per answer and filter, usually while the log sat idle (progressView).
  const view = own && cards ? progressView(own, cards, { bowStyle, distanceM }) : undefined;
  const sessions = view?.sessions;
  const choices = view?.choices;
  const series = view?.series;

  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <h1 className="text-3xl font-bold leading-tight">Progress</h1>
        <p>
          Your average per arrow, week by week, at each distance and face: your practice log and your
          tournament cards.
        </p>
        <Link to="/practice" className="inline-flex min-h-11 items-center font-bold underline">
          Back to the practice log
        </Link>
      </header>
      {choices && choices.distances.length > 0 && (
        <section aria-label="Filters" className="space-y-3">
          <FilterRow
            label="Bow style"
            options={choices.bowStyles.map((b) => ({ value: b, text: BOW_STYLE_LABELS[b] }))}
            chosen={bowStyle}
            onChoose={setBowStyle}
          />
          <FilterRow
            label="Distance"
            options={choices.distances.map((d) => ({ value: d, text: `${d} m` }))}
            chosen={distanceM}
            onChoose={setDistanceM}
          />
        </section>
      )}
      {sessions && sessions.length === 0 && (
        <div className="surface space-y-3 rounded-xl border border-line bg-card p-4">
          <p className="text-lg">
            Nothing to draw yet. Record a session in the practice log: its average per arrow will be drawn here,
            week by week.
          </p>
          <Link
            to="/practice"
            className="inline-flex min-h-14 items-center rounded-lg bg-moss px-5 text-lg font-bold text-white"
          >
            Start practice
          </Link>
        </div>
      )}
      {sessions && sessions.length > 0 && series?.length === 0 && (
        <p className="text-lg">No practice with these filters. Choose “All” to see every session.</p>
      )}
      {series?.map((s) => (
        <SeriesView key={`${s.series.distanceM}|${s.series.faceId}`} shown={s} />
      ))}
    </div>
  );
}

function FilterRow<T extends string | number>({
  label,
  options,
  chosen,
  onChoose,
}: {
  label: string;
  options: { value: T; text: string }[];
  chosen: T | undefined;
  onChoose: (value: T | undefined) => void;
}) {
  const all = [{ value: undefined, text: 'All' }, ...options];
  return (
    <div role="group" aria-label={label} className="space-y-1">
      <p className="font-bold">{label}</p>
      <div className="flex flex-wrap gap-2">
        {all.map((o) => (
          <button
            key={o.text}
            type="button"
            aria-pressed={o.value === chosen}
            onClick={() => onChoose(o.value)}
            className={`min-h-14 min-w-14 rounded-lg border-2 px-4 text-base font-bold transition-transform active:scale-[0.97] ${
              o.value === chosen ? 'border-moss bg-moss text-white' : 'border-ink bg-card text-ink'
            }`}
          >
            {o.text}
          </button>
        ))}
      </div>
    </div>
  );
}

function SeriesView({ shown: { series, title, summary } }: { shown: ShownSeries }) {
  const id = `progress-${series.distanceM}-${series.faceId}`;
  const best = series.best;
  // The table (the chart's figures in text) is drawn when opened: a year is 52 rows a series.
  const [open, setOpen] = useState(false);
  return (
    <section aria-labelledby={id} className="surface space-y-3 rounded-xl border border-line bg-card p-4">
      <h2 id={id} className="text-2xl font-bold">
        {title}
      </h2>
      <p data-testid="progress-summary">{summary}</p>
      <Suspense fallback={<div style={{ height: CHART_HEIGHT }} />}>
        <ProgressChart series={series} />
      </Suspense>
      <details onToggle={(e) => setOpen(e.currentTarget.open)}>
        <summary className="flex min-h-11 cursor-pointer items-center font-bold underline">
          Every week ({series.weeks.length})
        </summary>
        {open && (
          <table className="w-full text-left">
            <caption className="sr-only">{title}: average per arrow by week</caption>
            <thead>
              <tr className="border-b-2 border-ink">
                <th scope="col" className="py-1">
                  Week of
                </th>
                <th scope="col" className="py-1 pl-2 text-right">
                  Arrows
                </th>
                <th scope="col" className="py-1 pl-2 text-right">
                  Average
                </th>
              </tr>
            </thead>
            <tbody>
              {[...series.weeks].reverse().map((w) => (
                <tr key={w.weekStart} className="border-b border-line">
                  <th scope="row" className="py-1 font-normal">
                    {weekLabel(w.weekStart)}
                    {w.weekStart === best.weekStart && <span className="font-bold"> · best session</span>}
                    {w.tournaments && ' · tournament'}
                  </th>
                  <td className="py-1 text-right">{w.arrows}</td>
                  <td className="py-1 text-right font-bold">{perArrow(w.averagePerArrow)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </details>
    </section>
  );
}
