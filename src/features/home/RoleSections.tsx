import { Link } from 'react-router-dom';
import type { Me } from '../../contract/auth';
import { CardsToSignList, OwnCardsList } from '../../ui/scorecard/CardLists';
import { useMyCards } from '../../api/card';

const eventLink =
  'surface flex min-h-14 items-center justify-between rounded-xl border-2 border-ink bg-card p-3 text-xl font-bold';

type Role = Me['roles'][number];

/** Links to the events where the person holds one role: the judge desk, or the event's setup. */
function EventLinks({ roles, to, label }: { roles: Role[]; to: (eventId: number) => string; label: string }) {
  return (
    <ul className="space-y-2">
      {roles.map((r) => (
        <li key={r.eventId}>
          <Link to={to(r.eventId)} className={eventLink}>
            <span>{r.eventName}</span>
            <span className="whitespace-nowrap pl-2 text-base">{label} ▸</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}

export function JudgeDesks({ roles }: { roles: Role[] }) {
  return (
    <section aria-labelledby="home-judge" className="space-y-2">
      <h2 id="home-judge" className="text-2xl font-bold">
        Judge desk
      </h2>
      <EventLinks roles={roles} to={(id) => `/desk/${id}`} label="Judge desk" />
    </section>
  );
}

export function OrganizedEvents({ roles }: { roles: Role[] }) {
  return (
    <section aria-labelledby="home-organize" className="space-y-2">
      <h2 id="home-organize" className="text-2xl font-bold">
        Events you organize
      </h2>
      <EventLinks roles={roles} to={(id) => `/events/${id}`} label="Set up" />
    </section>
  );
}

/** The cards a writer must sign as scorer, and the person's own cards; nothing when there are none. */
export function CardSections({ archer }: { archer: boolean }) {
  const cards = useMyCards();
  if (!cards.data) return null;
  const { cards: own, toSign } = cards.data;
  return (
    <>
      {toSign.length > 0 && (
        <section aria-labelledby="home-to-sign" className="space-y-2">
          <h2 id="home-to-sign" className="text-2xl font-bold">
            Cards to sign as scorer
          </h2>
          <CardsToSignList cards={toSign} />
        </section>
      )}
      {(archer || own.length > 0) && (
        <section aria-labelledby="home-own-cards" className="space-y-2">
          <h2 id="home-own-cards" className="text-2xl font-bold">
            Your scorecards
          </h2>
          {own.length > 0 ? (
            <OwnCardsList cards={own} />
          ) : (
            <p>Once an organizer puts you on a target, your card appears here.</p>
          )}
        </section>
      )}
    </>
  );
}
