import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { downloadFile } from '../../api/downloadFile';
import { Notice } from '../../ui/Notice';
import { useEventBrackets } from '../../api/eventBrackets';
import { BracketView } from './components/BracketView';

/**
 * An event's elimination brackets for anyone who may see its results: every division's matches
 * round by round with their scores, and the final places as they are decided.
 */
export function BracketsScreen() {
  const eventId = Number(useParams().eventId);
  const query = useEventBrackets(eventId);
  const [printError, setPrintError] = useState<string | null>(null);
  // Fetched with the sign-in when there is one: before publishing only the event's people see it.
  const print = () => {
    setPrintError(null);
    downloadFile(`/api/events/${eventId}/brackets/pdf`, `eliminations-${eventId}.pdf`).catch((error: Error) =>
      setPrintError(error.message),
    );
  };
  return (
    <div className="space-y-5">
      <header className="space-y-1">
        <h1 className="text-3xl font-bold leading-tight">Eliminations</h1>
        <p>
          <Link className="inline-flex min-h-12 items-center font-bold underline" to={`/results/${eventId}`}>
            Qualification standings
          </Link>
        </p>
        {!!query.data?.brackets.length && (
          <p>
            <button
              type="button"
              className="inline-flex min-h-12 items-center font-bold underline"
              onClick={print}
            >
              Print the brackets (PDF)
            </button>
          </p>
        )}
        {printError && <Notice tone="error">{printError}</Notice>}
      </header>
      {query.isError && <Notice tone="error">{query.error.message}</Notice>}
      {query.isPending && <p>Loading the brackets…</p>}
      {query.data?.brackets.length === 0 && <p>No brackets yet: they are made after qualification.</p>}
      {query.data?.brackets.map((b) => (
        <BracketView key={b.id} bracket={b} />
      ))}
    </div>
  );
}
