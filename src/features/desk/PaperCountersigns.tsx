import { Link } from 'react-router-dom';
import { useSessionCards } from './api/sessionCards';

/**
 * Cards whose archer has no account (no e-mail address) and so can only countersign on the
 * paper card: once every end is signed, the judge opens the card and records it with a photo.
 */
export function PaperCountersigns({ eventId, sessionId }: { eventId: number; sessionId: number }) {
  const cards = useSessionCards(eventId, sessionId);
  const waiting = cards.data?.cards.filter((c) => c.needsPaperCountersign) ?? [];
  if (waiting.length === 0) return null;
  return (
    <section
      aria-label="Countersignatures on paper"
      className="surface space-y-2 rounded-xl border border-line bg-card p-3"
    >
      <h2 className="font-bold">Countersignatures on paper</h2>
      <p className="text-base">
        These archers have no account, so they countersign the paper card. Record it with a photo of the card.
      </p>
      <ul className="space-y-2">
        {waiting.map((c) => (
          <li key={c.entryId}>
            <Link
              to={`/card/${sessionId}/${c.entryId}`}
              className="surface flex min-h-12 items-center rounded-lg border-2 border-ink bg-card px-3 font-bold"
            >
              Target {c.targetNumber}
              {c.position} · {c.name} ▸
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}
