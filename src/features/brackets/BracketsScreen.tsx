import { Link, useParams } from 'react-router-dom';
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
  return (
    <div className="space-y-5">
      <header className="space-y-1">
        <h1 className="text-3xl font-bold leading-tight">Eliminations</h1>
        <p>
          <Link className="inline-flex min-h-12 items-center font-bold underline" to={`/results/${eventId}`}>
            Qualification standings
          </Link>
        </p>
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
