import { Link } from 'react-router-dom';
import { RequireSignIn } from '../auth/RequireSignIn';
import { Notice } from '../../ui/Notice';
import { useMyCards } from './api/card';

function List() {
  const cards = useMyCards();
  if (cards.isPending) return <p>Loading your cards…</p>;
  if (cards.error) return <Notice tone="error">{cards.error.message}</Notice>;
  if (cards.data.cards.length === 0) {
    return <p>No scorecards yet. Once an organizer puts you on a target, your card appears here.</p>;
  }
  return (
    <ul className="space-y-2">
      {cards.data.cards.map((c) => (
        <li key={`${c.sessionId}-${c.entryId}`}>
          <Link
            to={`/card/${c.sessionId}/${c.entryId}`}
            className="surface block min-h-16 rounded-xl border-2 border-ink bg-card p-3"
          >
            <span className="block text-xl font-bold">{c.eventName}</span>
            <span className="block text-base">
              {c.sessionName} · {c.division} · target {c.targetNumber}
              {c.position}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}

export function MyCardsScreen() {
  return (
    <div className="space-y-4">
      <h1 className="text-3xl font-bold">Your scorecards</h1>
      <RequireSignIn>{() => <List />}</RequireSignIn>
    </div>
  );
}
