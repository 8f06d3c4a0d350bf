import { useState, type FormEvent } from 'react';
import { divisionInputSchema, type Division, type EventSummary } from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { Field } from '../../../ui/Field';
import { Notice } from '../../../ui/Notice';
import { useCreateDivision } from '../api/createDivision';
import { useUpdateDivision } from '../api/updateDivision';
import { useDeleteDivision } from '../api/deleteDivision';
import { ConfirmButton } from '../components/ConfirmButton';
import { EditForm } from '../components/EditForm';
import { SelectField } from '../../../ui/SelectField';
import { BOW_STYLE_LABELS, formProblems } from '../components/formProblems';

type DivisionForm = { bowStyle: string; className: string };

function DivisionFields({
  form,
  setForm,
  problems,
}: {
  form: DivisionForm;
  setForm: (f: DivisionForm) => void;
  problems: Record<string, string>;
}) {
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <SelectField
        label="Bow style"
        value={form.bowStyle}
        onChange={(e) => setForm({ ...form, bowStyle: e.target.value })}
        error={problems.bowStyle}
      >
        {Object.entries(BOW_STYLE_LABELS).map(([value, label]) => (
          <option key={value} value={value}>
            {label}
          </option>
        ))}
      </SelectField>
      <Field
        label="Class"
        hint="For example Women, Men, Under 18, Open."
        value={form.className}
        onChange={(e) => setForm({ ...form, className: e.target.value })}
        error={problems.className}
      />
    </div>
  );
}

function DivisionRow({ eventId, division }: { eventId: number; division: Division }) {
  const [editing, setEditing] = useState(false);
  const [form, setForm] = useState<DivisionForm>({
    bowStyle: division.bowStyle,
    className: division.className,
  });
  const [problems, setProblems] = useState<Record<string, string>>({});
  const update = useUpdateDivision(eventId);
  const remove = useDeleteDivision(eventId);

  const save = (e: FormEvent) => {
    e.preventDefault();
    const parsed = divisionInputSchema.safeParse(form);
    if (!parsed.success) return setProblems(formProblems(parsed.error));
    setProblems({});
    update.mutate({ divisionId: division.id, ...parsed.data }, { onSuccess: () => setEditing(false) });
  };

  return (
    <li className="surface space-y-3 rounded-xl border border-line bg-card p-4">
      <p>
        <strong className="text-xl">{division.name}</strong>
        <span className="block text-base text-ink-soft">
          {division.entryCount === 0
            ? 'No entries yet'
            : `${division.entryCount} ${division.entryCount === 1 ? 'entry' : 'entries'}`}
        </span>
      </p>
      {editing ? (
        <EditForm
          onSubmit={save}
          onCancel={() => setEditing(false)}
          saveLabel="Save division"
          pending={update.isPending}
          error={update.error}
        >
          <DivisionFields form={form} setForm={setForm} problems={problems} />
        </EditForm>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => setEditing(true)}>
            Edit
          </Button>
          <ConfirmButton
            question={`Remove ${division.name}?`}
            confirmLabel="Yes, remove"
            onConfirm={() => remove.mutate(division.id)}
            disabled={remove.isPending}
          >
            Remove
          </ConfirmButton>
        </div>
      )}
      {remove.error && <Notice tone="error">{remove.error.message}</Notice>}
    </li>
  );
}

/** Divisions: bow style × class. Every entry belongs to one, and each division shoots one round per session. */
export function DivisionsPart({ summary }: { summary: EventSummary }) {
  const eventId = summary.event.id;
  const create = useCreateDivision(eventId);
  const [form, setForm] = useState<DivisionForm>({ bowStyle: 'recurve', className: '' });
  const [problems, setProblems] = useState<Record<string, string>>({});

  const add = (e: FormEvent) => {
    e.preventDefault();
    const parsed = divisionInputSchema.safeParse(form);
    if (!parsed.success) return setProblems(formProblems(parsed.error));
    setProblems({});
    create.mutate(parsed.data, { onSuccess: () => setForm({ ...form, className: '' }) });
  };

  return (
    <>
      <h2 className="text-2xl font-bold">Divisions</h2>
      {summary.divisions.length === 0 ? (
        <p data-testid="no-divisions">
          No divisions yet. Add one for each bow style and class that will shoot, for example Recurve Women.
        </p>
      ) : (
        <ul className="space-y-3">
          {summary.divisions.map((d) => (
            <DivisionRow key={d.id} eventId={eventId} division={d} />
          ))}
        </ul>
      )}
      <form
        onSubmit={add}
        noValidate
        className="surface space-y-4 rounded-xl border border-line bg-card p-4"
        aria-labelledby="add-division"
      >
        <h3 id="add-division" className="text-xl font-bold">
          Add a division
        </h3>
        <DivisionFields form={form} setForm={setForm} problems={problems} />
        {create.error && <Notice tone="error">{create.error.message}</Notice>}
        <Button type="submit" disabled={create.isPending}>
          Add division
        </Button>
      </form>
    </>
  );
}
