import { useState, type FormEvent } from 'react';
import { updateEventSchema, type EventSummary } from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { Notice } from '../../../ui/Notice';
import { useUpdateEvent } from '../api/updateEvent';
import { formProblems } from '../components/formProblems';
import { EventFields, type EventDraft } from '../components/EventFields';

/** The event's name, venue, days and time zone. */
export function DetailsPart({ summary }: { summary: EventSummary }) {
  const { event } = summary;
  const update = useUpdateEvent(event.id);
  const [form, setForm] = useState({
    name: event.name,
    venue: event.venue,
    startsOn: event.startsOn,
    endsOn: event.endsOn,
    timeZone: event.timeZone,
  });
  const [problems, setProblems] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState(false);
  const change = (draft: EventDraft) => {
    setSaved(false);
    setForm(draft);
  };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = updateEventSchema.safeParse(form);
    if (!parsed.success) return setProblems(formProblems(parsed.error));
    setProblems({});
    update.mutate(parsed.data, { onSuccess: () => setSaved(true) });
  };

  return (
    <form
      onSubmit={submit}
      noValidate
      className="surface space-y-4 rounded-xl border border-line bg-card p-4"
    >
      <h2 className="text-2xl font-bold">Details</h2>
      <EventFields draft={form} onChange={change} problems={problems} />
      {update.error && <Notice tone="error">{update.error.message}</Notice>}
      {saved && <Notice tone="success">Details saved.</Notice>}
      <Button type="submit" disabled={update.isPending}>
        {update.isPending ? 'Saving…' : 'Save details'}
      </Button>
    </form>
  );
}
