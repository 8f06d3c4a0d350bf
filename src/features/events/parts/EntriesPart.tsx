import { useState, type FormEvent } from 'react';
import { entryInputSchema, updateEntrySchema, type Entry, type EventSummary } from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { Notice } from '../../../ui/Notice';
import { useEntries } from '../api/listEntries';
import { useCreateEntry } from '../api/createEntry';
import { useUpdateEntry } from '../api/updateEntry';
import { useDeleteEntry } from '../api/deleteEntry';
import { ConfirmButton } from '../components/ConfirmButton';
import { EditForm } from '../components/EditForm';
import { GoToPart } from '../components/GoToPart';
import { formProblems } from '../components/formProblems';
import { CsvImport } from './CsvImport';
import { EntryFields, entryPayload, type EntryDraft } from './EntryFields';

function EntryRow({ summary, entry }: { summary: EventSummary; entry: Entry }) {
  const eventId = summary.event.id;
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState<EntryDraft>({
    name: entry.name,
    club: entry.club,
    email: entry.email,
    divisionId: String(entry.divisionId),
    className: entry.className,
  });
  const [problems, setProblems] = useState<Record<string, string>>({});
  const update = useUpdateEntry(eventId);
  const remove = useDeleteEntry(eventId);

  const save = (e: FormEvent) => {
    e.preventDefault();
    const parsed = updateEntrySchema.safeParse(entryPayload(draft));
    if (!parsed.success) return setProblems(formProblems(parsed.error));
    setProblems({});
    update.mutate({ entryId: entry.id, ...parsed.data }, { onSuccess: () => setEditing(false) });
  };

  return (
    <li className="surface space-y-2 rounded-lg border border-line bg-card p-3">
      {editing ? (
        <EditForm
          onSubmit={save}
          onCancel={() => setEditing(false)}
          saveLabel="Save entry"
          pending={update.isPending}
          error={update.error}
        >
          <EntryFields draft={draft} onChange={setDraft} divisions={summary.divisions} problems={problems} />
        </EditForm>
      ) : (
        <>
          <p>
            <strong>{entry.name}</strong>
            {entry.club && ` · ${entry.club}`}
            {entry.className && ` · ${entry.className}`}
            {entry.email && <span className="block break-all text-base">{entry.email}</span>}
            {entry.linked && (
              <span className="block text-base">
                <span aria-hidden="true">✓ </span>Has a Ringcall account
              </span>
            )}
          </p>
          <div className="flex flex-wrap gap-2">
            <Button variant="secondary" onClick={() => setEditing(true)}>
              Edit
            </Button>
            <ConfirmButton
              question={`Remove ${entry.name} from the entry list?`}
              confirmLabel="Yes, remove"
              onConfirm={() => remove.mutate(entry.id)}
            >
              Remove
            </ConfirmButton>
          </div>
          {remove.error && <Notice tone="error">{remove.error.message}</Notice>}
        </>
      )}
    </li>
  );
}

function AddEntry({ summary }: { summary: EventSummary }) {
  const create = useCreateEntry(summary.event.id);
  const [draft, setDraft] = useState<EntryDraft>({
    name: '',
    club: '',
    email: '',
    divisionId: '',
    className: '',
  });
  const [problems, setProblems] = useState<Record<string, string>>({});
  const [added, setAdded] = useState<string>();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = entryInputSchema.safeParse(entryPayload(draft));
    if (!parsed.success) return setProblems(formProblems(parsed.error));
    setProblems({});
    create.mutate(parsed.data, {
      onSuccess: (entry) => {
        setAdded(entry.name);
        // Keep the division and club: entries are often typed club by club.
        setDraft({ ...draft, name: '', email: '' });
      },
    });
  };

  return (
    <form
      onSubmit={submit}
      noValidate
      className="surface space-y-4 rounded-xl border border-line bg-card p-4"
      aria-labelledby="add-entry"
    >
      <h3 id="add-entry" className="text-xl font-bold">
        Add an archer
      </h3>
      <EntryFields
        draft={draft}
        onChange={(d) => {
          setAdded(undefined);
          setDraft(d);
        }}
        divisions={summary.divisions}
        problems={problems}
      />
      {create.error && <Notice tone="error">{create.error.message}</Notice>}
      {added && <Notice tone="success">{added} is entered.</Notice>}
      <Button type="submit" disabled={create.isPending}>
        Add archer
      </Button>
    </form>
  );
}

function EntryList({ summary }: { summary: EventSummary }) {
  const entries = useEntries(summary.event.id);
  if (entries.isPending) return <p>Loading the entry list…</p>;
  if (entries.error) return <Notice tone="error">{entries.error.message}</Notice>;
  if (entries.data.entries.length === 0) {
    return (
      <p data-testid="no-entries">
        No archers entered yet: upload a CSV file or add them one by one with the forms above.
      </p>
    );
  }
  return (
    <div className="space-y-4">
      {summary.divisions.map((d) => {
        const inDivision = entries.data.entries.filter((e) => e.divisionId === d.id);
        if (inDivision.length === 0) return null;
        return (
          <section key={d.id} aria-label={d.name} className="space-y-2">
            <h3 className="text-xl font-bold">
              {d.name} ({inDivision.length})
            </h3>
            <ul className="space-y-2">
              {inDivision.map((e) => (
                <EntryRow key={e.id} summary={summary} entry={e} />
              ))}
            </ul>
          </section>
        );
      })}
    </div>
  );
}

/** The entry list: by form, or by CSV upload checked row by row. */
export function EntriesPart({ summary }: { summary: EventSummary }) {
  if (summary.divisions.length === 0) {
    return (
      <GoToPart
        title="Entry list"
        text="Add the divisions first: every entry belongs to one."
        part="divisions"
        label="Go to divisions"
      />
    );
  }
  return (
    <>
      <h2 className="text-2xl font-bold">Entry list</h2>
      <CsvImport summary={summary} />
      <AddEntry summary={summary} />
      <EntryList summary={summary} />
    </>
  );
}
