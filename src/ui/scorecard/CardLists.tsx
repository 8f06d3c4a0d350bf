import { Link } from 'react-router-dom';
import type { CardToSign, MyCard } from '../../contract/myCards';
import { PlaceLine } from './PlaceLine';

const linkClass = 'surface block min-h-16 rounded-xl border-2 border-ink bg-card p-3';

/** The cards a writer kept and must sign as scorer; ready ones say so. */
export function CardsToSignList({ cards }: { cards: CardToSign[] }) {
  return (
    <ul className="space-y-2" aria-label="Cards to sign as scorer">
      {cards.map((c) => (
        <li key={`${c.sessionId}-${c.entryId}`}>
          <Link to={`/card/${c.sessionId}/${c.entryId}`} className={linkClass}>
            <span className="block text-xl font-bold">
              {c.archerName}
              <span className="font-normal">
                {' '}
                · target {c.targetNumber}
                {c.position}
              </span>
            </span>
            <span className="block text-base">
              {c.eventName} · {c.sessionName}
            </span>
            <span className="block font-bold">
              {c.ready
                ? '✍ Ready for your signature ▸'
                : `○ A judge has signed ${c.signedEnds} of ${c.totalEnds} ends`}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}

/** The person's own scorecards, each with its live place. */
export function OwnCardsList({ cards }: { cards: MyCard[] }) {
  return (
    <ul className="space-y-2" aria-label="Your scorecards">
      {cards.map((c) => (
        <li key={`${c.sessionId}-${c.entryId}`}>
          <Link to={`/card/${c.sessionId}/${c.entryId}`} className={linkClass}>
            <span className="block text-xl font-bold">{c.eventName}</span>
            <span className="block text-base">
              {c.sessionName} · {c.division} · target {c.targetNumber}
              {c.position}
            </span>
          </Link>
          <div className="px-3 pt-1">
            <PlaceLine sessionId={c.sessionId} entryId={c.entryId} />
          </div>
        </li>
      ))}
    </ul>
  );
}
