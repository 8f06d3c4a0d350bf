import { useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { createEventSchema } from '../../contract/events';
import { RequireSignIn } from '../../account/RequireSignIn';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { useEvents } from './api/listEvents';
import { useCreateEvent } from './api/createEvent';
import { dateRange, formProblems } from './components/formProblems';
import { EventFields, type EventDraft } from './components/EventFields';

const ROLE_WORDS = { organizer: 'Organizer', judge: 'Judge', archer: 'Archer' } as const;

function EventList() {
  const events = useEvents();
  if (events.isPending) return <p>Loading your events…</p>;
  if (events.error) return <Notice tone="error">{events.error.message}</Notice>;
  if (events.data.events.length === 0) {
    return (
      <p data-testid="no-events">You have no events yet. Create one below: you will be its organizer.</p>
    );
  }
  return (
    <ul className="space-y-3" aria-label="Your events">
      {events.data.events.map((e) => (
        <li key={e.id}>
          <Link
            to={`/events/${e.id}`}
            className="surface block rounded-xl border border-line bg-card p-4 hover:border-ink"
          >
            <span className="block text-xl font-bold underline">{e.name}</span>
            <span className="block">
              {dateRange(e.startsOn, e.endsOn)}
              {e.venue && ` · ${e.venue}`}
            </span>
            <span className="block text-base text-ink-soft">
              You are: {e.roles.map((r) => ROLE_WORDS[r]).join(', ')}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}

const today = () => new Date().toISOString().slice(0, 10);

function CreateEventForm() {
  const navigate = useNavigate();
  const create = useCreateEvent();
  const [form, setForm] = useState<EventDraft>({
    name: '',
    venue: '',
    startsOn: today(),
    endsOn: today(),
    timeZone: Intl.DateTimeFormat().resolvedOptions().timeZone,
  });
  const [problems, setProblems] = useState<Record<string, string>>({});

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = createEventSchema.safeParse(form);
    if (!parsed.success) return setProblems(formProblems(parsed.error));
    setProblems({});
    create.mutate(parsed.data, { onSuccess: (event) => navigate(`/events/${event.id}?part=divisions`) });
  };

  return (
    <form
      onSubmit={submit}
      noValidate
      className="surface space-y-4 rounded-xl border border-line bg-card p-4"
      aria-labelledby="create-event"
    >
      <h2 id="create-event" className="text-2xl font-bold">
        Create an event
      </h2>
      <EventFields draft={form} onChange={setForm} problems={problems} />
      {create.error && <Notice tone="error">{create.error.message}</Notice>}
      <Button type="submit" className="w-full sm:w-auto" disabled={create.isPending}>
        {create.isPending ? 'Creating…' : 'Create event'}
      </Button>
    </form>
  );
}

/** The organizer's way in: their events, and a new one. */
export function EventsScreen() {
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Your events</h1>
      <RequireSignIn>
        {() => (
          <>
            <EventList />
            <CreateEventForm />
          </>
        )}
      </RequireSignIn>
    </div>
  );
}
