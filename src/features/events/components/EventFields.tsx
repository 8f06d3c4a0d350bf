import { useMemo } from 'react';
import { Field } from '../../../ui/Field';
import { SelectField } from '../../../ui/SelectField';

export type EventDraft = { name: string; venue: string; startsOn: string; endsOn: string; timeZone: string };

/** The zones this browser knows, with the event's own first when the browser's list lacks it (e.g. "UTC"). */
function useTimeZones(current: string): string[] {
  return useMemo(() => {
    const known = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [];
    return current && !known.includes(current) ? [current, ...known] : known;
  }, [current]);
}

/** Name, venue, first and last day, and time zone of an event (creating it or editing it). */
export function EventFields({
  draft,
  onChange,
  problems,
}: {
  draft: EventDraft;
  onChange: (d: EventDraft) => void;
  problems: Record<string, string>;
}) {
  const set = (key: keyof EventDraft) => (e: { target: { value: string } }) =>
    onChange({ ...draft, [key]: e.target.value });
  const zones = useTimeZones(draft.timeZone);
  const zoneProps = {
    label: 'Time zone',
    value: draft.timeZone,
    onChange: set('timeZone'),
    error: problems.timeZone,
  };
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
      {zones.length > 1 ? (
        <SelectField {...zoneProps} hint="Session start times are in this zone.">
          {zones.map((z) => (
            <option key={z} value={z}>
              {z.replaceAll('_', ' ')}
            </option>
          ))}
        </SelectField>
      ) : (
        // A browser that cannot list its zones: the name is typed (the server checks it).
        <Field {...zoneProps} hint="Session start times are in this zone, e.g. Europe/Berlin." />
      )}
    </>
  );
}
