import { useMemo } from 'react';
import { Field } from '../../../ui/Field';

export type EventDraft = { name: string; venue: string; startsOn: string; endsOn: string; timeZone: string };

function TimeZoneOptions({ id }: { id: string }) {
  const zones = useMemo(
    () => (typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : []),
    [],
  );
  return (
    <datalist id={id}>
      {zones.map((z) => (
        <option key={z} value={z} />
      ))}
    </datalist>
  );
}

/** Name, venue, first and last day, and time zone of an event (creating it or editing it). */
export function EventFields({
  draft,
  onChange,
  problems,
  idPrefix,
}: {
  draft: EventDraft;
  onChange: (d: EventDraft) => void;
  problems: Record<string, string>;
  idPrefix: string;
}) {
  const set = (key: keyof EventDraft) => (e: { target: { value: string } }) =>
    onChange({ ...draft, [key]: e.target.value });
  return (
    <>
      <Field label="Event name" value={draft.name} onChange={set('name')} error={problems.name} />
      <Field
        label="Venue"
        hint="Optional: where the shoot is."
        value={draft.venue}
        onChange={set('venue')}
        error={problems.venue}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <Field
          label="First day"
          type="date"
          value={draft.startsOn}
          onChange={set('startsOn')}
          error={problems.startsOn}
        />
        <Field
          label="Last day"
          type="date"
          value={draft.endsOn}
          onChange={set('endsOn')}
          error={problems.endsOn}
        />
      </div>
      <Field
        label="Time zone"
        hint="Session start times are in this zone."
        list={`${idPrefix}-time-zones`}
        value={draft.timeZone}
        onChange={set('timeZone')}
        error={problems.timeZone}
      />
      <TimeZoneOptions id={`${idPrefix}-time-zones`} />
    </>
  );
}
