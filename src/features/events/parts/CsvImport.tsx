import { useState } from 'react';
import { ENTRY_CSV_COLUMNS, type EventSummary, type ImportPreview } from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { Notice } from '../../../ui/Notice';
import { usePreviewImport } from '../api/previewImport';
import { useImportEntries } from '../api/importEntries';
import { useDownloadTemplate } from '../api/downloadTemplate';

function PreviewRows({ preview }: { preview: ImportPreview }) {
  return (
    <ol className="space-y-2" aria-label="Rows in the file">
      {preview.rows.map((r) => {
        const ok = r.problems.length === 0;
        return (
          <li
            key={r.row}
            className={`surface rounded-lg border-2 p-3 ${ok ? 'border-line bg-card' : 'border-brick bg-brick-bg'}`}
            data-testid={`csv-row-${r.row}`}
          >
            <p>
              <span className="font-bold">Row {r.row}:</span> {r.name || <em>no name</em>}
              {r.division && ` · ${r.division}`}
              {r.club && ` · ${r.club}`}
              {r.className && ` · ${r.className}`}
              {r.email && <span className="block break-all text-base">{r.email}</span>}
            </p>
            {ok ? (
              <p className="font-bold text-moss-dark">
                <span aria-hidden="true">✓ </span>Ready
              </p>
            ) : (
              <ul className="font-bold text-brick">
                {r.problems.map((p) => (
                  <li key={p}>
                    <span aria-hidden="true">▲ </span>
                    {p}
                  </li>
                ))}
              </ul>
            )}
          </li>
        );
      })}
    </ol>
  );
}

/** Upload a CSV file: every row is checked first; Import stays off until the whole file is clean. */
export function CsvImport({ summary }: { summary: EventSummary }) {
  const eventId = summary.event.id;
  const [file, setFile] = useState<File>();
  const [inputKey, setInputKey] = useState(0);
  const [imported, setImported] = useState<number>();
  const preview = usePreviewImport(eventId);
  const importFile = useImportEntries(eventId);
  const template = useDownloadTemplate(eventId);
  const ready = !!file && preview.data !== undefined && !preview.isPending && preview.data.problemCount === 0;

  const choose = (chosen: File | undefined) => {
    setFile(chosen);
    setImported(undefined);
    importFile.reset();
    if (chosen) preview.mutate(chosen);
    else preview.reset();
  };

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
        <strong>{summary.divisions.map((d) => d.name).join(', ')}</strong>. Nothing is stored until the whole
        file is clean.
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
      {preview.data && !preview.isPending && (
        <>
          {preview.data.problemCount === 0 ? (
            <Notice tone="success">All {preview.data.readyCount} rows are ready to import.</Notice>
          ) : (
            <Notice tone="error">
              {preview.data.problemCount} of {preview.data.rows.length} rows{' '}
              {preview.data.problemCount === 1 ? 'has a problem' : 'have problems'}. Fix the file, then choose
              it again.
            </Notice>
          )}
          <PreviewRows preview={preview.data} />
        </>
      )}
      {importFile.error && <Notice tone="error">{importFile.error.message}</Notice>}
      {imported !== undefined && <Notice tone="success">Imported {imported} archers.</Notice>}
      <Button
        disabled={!ready || importFile.isPending}
        onClick={() =>
          file &&
          importFile.mutate(file, {
            onSuccess: (result) => {
              setImported(result.imported);
              setFile(undefined);
              setInputKey((k) => k + 1);
              preview.reset();
            },
          })
        }
      >
        {preview.data && ready ? `Import ${preview.data.readyCount} archers` : 'Import'}
      </Button>
      {!ready && file && preview.data && <p className="text-base">Import is off until every row is ready.</p>}
    </section>
  );
}
