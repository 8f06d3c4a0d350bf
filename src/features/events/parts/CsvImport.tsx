import { useMemo, useState } from 'react';
import { ENTRY_CSV_COLUMNS, type EventSummary } from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { Notice } from '../../../ui/Notice';
import { useEntries } from '../api/listEntries';
import { usePreviewImport } from '../api/previewImport';
import { useImportEntries } from '../api/importEntries';
import { useDownloadTemplate } from '../api/downloadTemplate';
import { ImportRowEditor } from './ImportRowEditor';
import { checkDrafts, draftsOf, sentValues, type ImportDraft } from './importDrafts';

/** "3 ready · 1 to fix · 1 dropped": where the kept rows stand, said in words. */
function RowCounts({ ready, toFix, dropped }: { ready: number; toFix: number; dropped: number }) {
  return (
    <p role="status" className="font-bold" data-testid="csv-counts">
      {ready} ready · {toFix} {toFix === 1 ? 'needs' : 'need'} fixing · {dropped} dropped
    </p>
  );
}

/**
 * Upload a CSV file: every row is checked, rows are corrected in place (checked again by the
 * server's own rules at each change) or dropped, and Import stays off until every kept row is ready.
 */
export function CsvImport({ summary }: { summary: EventSummary }) {
  const eventId = summary.event.id;
  const [file, setFile] = useState<File>();
  const [inputKey, setInputKey] = useState(0);
  const [imported, setImported] = useState<number>();
  const [drafts, setDrafts] = useState<ImportDraft[]>();
  const [onlyProblems, setOnlyProblems] = useState(false);
  const preview = usePreviewImport(eventId);
  const importRows = useImportEntries(eventId);
  const template = useDownloadTemplate(eventId);
  const entries = useEntries(eventId);

  const checked = useMemo(() => {
    if (!drafts || !entries.data) return undefined;
    return checkDrafts(drafts, {
      divisions: summary.divisions,
      entered: entries.data.entries.map((e) => ({
        name: e.name,
        divisionId: e.divisionId,
        divisionName: e.divisionName,
      })),
    });
  }, [drafts, entries.data, summary.divisions]);
  const ready = !!checked && checked.ready > 0 && checked.toFix === 0;

  const choose = (chosen: File | undefined) => {
    setFile(chosen);
    setImported(undefined);
    setDrafts(undefined);
    importRows.reset();
    if (chosen) preview.mutate(chosen, { onSuccess: (p) => setDrafts(draftsOf(p.rows)) });
    else preview.reset();
  };
  const change = (row: number, patch: Partial<ImportDraft>) =>
    setDrafts((all) => all?.map((d) => (d.row === row ? { ...d, ...patch } : d)));
  const submit = () => {
    if (!checked) return;
    const rows = checked.rows.filter((d) => !d.dropped).map(sentValues);
    importRows.mutate(
      { rows },
      {
        onSuccess: (result) => {
          setImported(result.imported);
          setFile(undefined);
          setDrafts(undefined);
          setInputKey((k) => k + 1);
          preview.reset();
        },
      },
    );
  };
  // A row opened for correcting stays in view once fixed, so it does not vanish under the cursor.
  const shown = checked?.rows.filter((r) => !onlyProblems || r.editing || r.problems.length > 0);

  return (
    <section
      className="surface space-y-4 rounded-xl border border-line bg-card p-4"
      aria-labelledby="csv-import"
    >
      <h3 id="csv-import" className="text-xl font-bold">
        Upload a CSV file
      </h3>
      <p>
        One archer per row, with the columns {ENTRY_CSV_COLUMNS.join(', ')} (club, email and class may be
        empty). The division must be one of:{' '}
        <strong>{summary.divisions.map((d) => d.name).join(', ')}</strong>. You can correct or drop rows
        before importing; nothing is stored until every kept row is ready.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => template.mutate()} disabled={template.isPending}>
          Download the template
        </Button>
        <label className="inline-flex min-h-14 cursor-pointer items-center rounded-lg border-2 border-ink bg-card px-5 text-lg font-bold text-ink focus-within:outline focus-within:outline-3 focus-within:outline-[#0b57d0]">
          Choose a CSV file
          <input
            key={inputKey}
            type="file"
            accept=".csv,text/csv"
            className="sr-only"
            data-testid="csv-file"
            onChange={(e) => choose(e.target.files?.[0])}
          />
        </label>
      </div>
      {template.error && <Notice tone="error">{template.error.message}</Notice>}
      {file && (
        <p>
          Chosen file: <strong className="break-all">{file.name}</strong>
        </p>
      )}
      {preview.isPending && <p>Checking the file…</p>}
      {preview.error && <Notice tone="error">{preview.error.message}</Notice>}
      {entries.error && <Notice tone="error">{entries.error.message}</Notice>}
      {checked && shown && (
        <>
          <RowCounts ready={checked.ready} toFix={checked.toFix} dropped={checked.dropped} />
          <label className="flex min-h-11 items-center gap-3 font-bold">
            <input
              type="checkbox"
              className="h-6 w-6"
              checked={onlyProblems}
              onChange={(e) => setOnlyProblems(e.target.checked)}
            />
            Only rows with problems
          </label>
          {shown.length === 0 && <p>No row has a problem.</p>}
          <ol className="space-y-2" aria-label="Rows in the file">
            {shown.map((r) => (
              <ImportRowEditor
                key={r.row}
                row={r}
                divisions={summary.divisions}
                onChange={(patch) => change(r.row, patch)}
              />
            ))}
          </ol>
        </>
      )}
      {importRows.error && <Notice tone="error">{importRows.error.message}</Notice>}
      {imported !== undefined && <Notice tone="success">Imported {imported} archers.</Notice>}
      <Button disabled={!ready || importRows.isPending} onClick={submit}>
        {checked && ready ? `Import ${checked.ready} archers` : 'Import'}
      </Button>
      {checked && !ready && (
        <p className="text-base">
          {checked.ready === 0 && checked.toFix === 0
            ? 'Every row is dropped: keep at least one to import.'
            : 'Import is off until every kept row is ready: correct or drop the rows with problems.'}
        </p>
      )}
    </section>
  );
}
