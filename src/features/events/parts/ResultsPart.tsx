import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import type { EventSummary } from '../../../contract/events';
import type { EventResults } from '../../../contract/results';
import { Button } from '../../../ui/Button';
import { Field } from '../../../ui/Field';
import { Notice } from '../../../ui/Notice';
import { downloadFile } from '../../../api/downloadFile';
import { useEventResults } from '../../../api/eventResults';
import { useUpdateResultsSettings } from '../api/updateResultsSettings';
import { SendResults } from './SendResults';

const cutOf = (results: EventResults, divisionId: number) =>
  results.sessions.flatMap((s) => s.divisions).find((d) => d.divisionId === divisionId)?.cut ?? null;

/** The organizer's results: publish them, the team size, each division's cut, links, PDF and CSV, sending them. */
export function ResultsPart({ summary }: { summary: EventSummary }) {
  const eventId = summary.event.id;
  const query = useEventResults(eventId);
  const results = query.data?.results;
  if (!results) return query.isError ? <Notice tone="error">{query.error.message}</Notice> : <p>Loading…</p>;
  return <ResultsSettingsForm summary={summary} results={results} />;
}

function ResultsSettingsForm({ summary, results }: { summary: EventSummary; results: EventResults }) {
  const eventId = summary.event.id;
  const update = useUpdateResultsSettings(eventId);
  const [teamSize, setTeamSize] = useState(String(results.event.teamSize));
  const [cuts, setCuts] = useState<Record<number, string>>(() =>
    Object.fromEntries(summary.divisions.map((d) => [d.id, String(cutOf(results, d.id) ?? '')])),
  );
  const [saved, setSaved] = useState(false);
  const [download, setDownload] = useState<string>();

  const save = (e: FormEvent) => {
    e.preventDefault();
    setSaved(false);
    update.mutate(
      {
        teamSize: Number(teamSize),
        cuts: summary.divisions.map((d) => ({
          divisionId: d.id,
          cut: cuts[d.id]?.trim() ? Number(cuts[d.id]) : null,
        })),
      },
      { onSuccess: () => setSaved(true) },
    );
  };
  const fetchFile = (kind: 'csv' | 'pdf') => {
    setDownload(undefined);
    downloadFile(`/api/results/${eventId}/${kind}`, `results-${eventId}.${kind}`).catch((error: Error) =>
      setDownload(error.message),
    );
  };

  return (
    <div className="space-y-4">
      <div className="surface space-y-3 rounded-xl border border-line bg-card p-4">
        <h2 className="text-2xl font-bold">Results</h2>
        <p>
          {results.event.published
            ? 'The results are public: anyone with the link sees them.'
            : 'The results are private: only this event’s organizers, judges and archers see them.'}
        </p>
        <label className="flex min-h-14 items-center gap-3 text-lg font-bold">
          <input
            type="checkbox"
            className="h-7 w-7"
            checked={results.event.published}
            disabled={update.isPending}
            onChange={(e) => update.mutate({ published: e.target.checked })}
          />
          Publish the results
        </label>
        <p className="flex flex-wrap gap-x-4">
          <Link className="inline-flex min-h-12 items-center font-bold underline" to={`/results/${eventId}`}>
            Open the results page
          </Link>
          <Link
            className="inline-flex min-h-12 items-center font-bold underline"
            to={`/results/${eventId}/field`}
          >
            Field screen
          </Link>
        </p>
        <div className="flex flex-wrap gap-3">
          <Button variant="secondary" onClick={() => fetchFile('pdf')}>
            Print results (PDF)
          </Button>
          <Button variant="secondary" onClick={() => fetchFile('csv')}>
            Download results (CSV)
          </Button>
        </div>
        {download && <Notice tone="error">{download}</Notice>}
        <SendResults eventId={eventId} published={results.event.published} />
      </div>
      <form
        onSubmit={save}
        noValidate
        className="surface space-y-3 rounded-xl border border-line bg-card p-4"
      >
        <h2 className="text-2xl font-bold">Cuts and teams</h2>
        <Field
          label="Archers in a team"
          hint="The best archers of each club in a division count for the team."
          type="number"
          min={1}
          max={12}
          value={teamSize}
          onChange={(e) => setTeamSize(e.target.value)}
        />
        {summary.divisions.map((d) => (
          <Field
            key={d.id}
            label={`Cut for ${d.name}`}
            hint="How many go through to the eliminations; empty when there are none (then ties for places 1–3 go to a shoot-off)."
            type="number"
            min={1}
            value={cuts[d.id] ?? ''}
            onChange={(e) => setCuts({ ...cuts, [d.id]: e.target.value })}
          />
        ))}
        {update.error && <Notice tone="error">{update.error.message}</Notice>}
        {saved && <Notice tone="success">Cuts and teams saved.</Notice>}
        <Button type="submit" disabled={update.isPending}>
          {update.isPending ? 'Saving…' : 'Save cuts and teams'}
        </Button>
      </form>
    </div>
  );
}
