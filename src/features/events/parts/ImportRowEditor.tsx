import type { Division } from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { Field } from '../../../ui/Field';
import { SelectField } from '../../../ui/SelectField';
import type { CheckedDrafts, ImportDraft } from './importDrafts';

type Row = CheckedDrafts['rows'][number];
type RowProps = { row: Row; divisions: Division[]; onChange: (change: Partial<ImportDraft>) => void };

function RowProblems({ problems }: { problems: string[] }) {
  if (problems.length === 0)
    return (
      <p className="font-bold text-moss-dark">
        <span aria-hidden="true">✓ </span>Ready
      </p>
    );
  return (
    <ul className="font-bold text-brick">
      {problems.map((p) => (
        <li key={p}>
          <span aria-hidden="true">▲ </span>
          {p}
        </li>
      ))}
    </ul>
  );
}

/** The row's fields as inputs; the division is chosen from the event's (a wrong one stays visible). */
function RowFields({ row, divisions, onChange }: RowProps) {
  const known = divisions.some((d) => d.name === row.division);
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <Field label="Name" value={row.name} onChange={(e) => onChange({ name: e.target.value })} />
      <SelectField
        label="Division"
        value={row.division}
        onChange={(e) => onChange({ division: e.target.value })}
      >
        <option value="">Choose a division</option>
        {!known && row.division && <option value={row.division}>{row.division} (not in this event)</option>}
        {divisions.map((d) => (
          <option key={d.id} value={d.name}>
            {d.name}
          </option>
        ))}
      </SelectField>
      <Field label="Club" value={row.club} onChange={(e) => onChange({ club: e.target.value })} />
      <Field
        label="Class (optional)"
        value={row.className}
        onChange={(e) => onChange({ className: e.target.value })}
      />
      <Field
        label="E-mail"
        type="email"
        value={row.email}
        onChange={(e) => onChange({ email: e.target.value })}
      />
    </div>
  );
}

/** One row of the preview: read, corrected in place, or dropped from the import. */
export function ImportRowEditor({ row, divisions, onChange }: RowProps) {
  const tone = row.dropped
    ? 'border-line bg-paper'
    : row.problems.length === 0
      ? 'border-line bg-card'
      : 'border-brick bg-brick-bg';
  return (
    <li className={`surface space-y-2 rounded-lg border-2 p-3 ${tone}`} data-testid={`csv-row-${row.row}`}>
      <fieldset className="space-y-2">
        <legend className="font-bold">Row {row.row}</legend>
        {row.dropped ? (
          <p>
            <span aria-hidden="true">✕ </span>Dropped: {row.name || 'no name'} is left out of the import.
          </p>
        ) : row.editing ? (
          <RowFields row={row} divisions={divisions} onChange={onChange} />
        ) : (
          <p>
            {row.name || <em>no name</em>}
            {row.division && ` · ${row.division}`}
            {row.club && ` · ${row.club}`}
            {row.className && ` · ${row.className}`}
            {row.email && <span className="block break-all text-base">{row.email}</span>}
          </p>
        )}
        {!row.dropped && <RowProblems problems={row.problems} />}
        <div className="flex flex-wrap gap-2">
          {!row.dropped && !row.editing && (
            <Button variant="secondary" onClick={() => onChange({ editing: true })}>
              Correct row {row.row}
            </Button>
          )}
          <Button variant="secondary" onClick={() => onChange({ dropped: !row.dropped })}>
            {row.dropped ? `Keep row ${row.row}` : `Drop row ${row.row}`}
          </Button>
        </div>
      </fieldset>
    </li>
  );
}
