import type { Division } from '../../../contract/events';
import { Field } from '../../../ui/Field';
import { SelectField } from '../../../ui/SelectField';

export type EntryDraft = { name: string; club: string; email: string; divisionId: string; className: string };

/** Name, club, e-mail, division and class of one archer's entry. */
export function EntryFields({
  draft,
  onChange,
  divisions,
  problems,
}: {
  draft: EntryDraft;
  onChange: (d: EntryDraft) => void;
  divisions: Division[];
  problems: Record<string, string>;
}) {
  const set = (key: keyof EntryDraft) => (e: { target: { value: string } }) =>
    onChange({ ...draft, [key]: e.target.value });
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <Field
        label="Archer's name"
        hint="As it should appear on the scorecard."
        value={draft.name}
        onChange={set('name')}
        error={problems.name}
      />
      <SelectField
        label="Division"
        value={draft.divisionId}
        onChange={set('divisionId')}
        error={problems.divisionId}
      >
        <option value="">Choose a division</option>
        {divisions.map((d) => (
          <option key={d.id} value={d.id}>
            {d.name}
          </option>
        ))}
      </SelectField>
      <Field label="Club" hint="Optional." value={draft.club} onChange={set('club')} error={problems.club} />
      <Field
        label="E-mail"
        hint="Optional: links the entry to the archer's account."
        type="email"
        value={draft.email}
        onChange={set('email')}
        error={problems.email}
      />
      <Field
        label="Class"
        hint="Optional: an age class inside the division, such as Under 18 or 50+. Each class is also ranked on its own."
        value={draft.className}
        onChange={set('className')}
        error={problems.className}
      />
    </div>
  );
}

/** The draft as the API wants it (the division as a number). */
export const entryPayload = (d: EntryDraft) => ({
  ...d,
  divisionId: d.divisionId ? Number(d.divisionId) : undefined,
});
