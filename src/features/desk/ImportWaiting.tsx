import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '../../api/request';
import type { WaitingChangesImport } from '../../contract/waitingChanges';
import { useOnline } from '../../local/online';
import { FileField } from '../../ui/FileField';
import { Notice } from '../../ui/Notice';

/** Brings in the file a phone saved when it could not sync ("Save waiting changes as a file"). */
export function ImportWaiting({ eventId }: { eventId: number }) {
  const online = useOnline();
  const upload = useMutation({
    mutationFn: async (file: File) => {
      let body: unknown;
      try {
        body = JSON.parse(await file.text());
      } catch {
        throw new Error('This file is not a file of waiting changes saved by Ringcall.');
      }
      return apiRequest<WaitingChangesImport>(`/api/events/${eventId}/waiting-changes`, {
        method: 'POST',
        body: JSON.stringify(body),
      });
    },
  });
  const transcribed = upload.data?.clients.find((c) => c.transcribedBy)?.transcribedBy;
  const totals = upload.data?.clients.reduce(
    (t, c) => ({
      applied: t.applied + c.applied,
      known: t.known + c.duplicates,
      refused: t.refused + c.results.filter((r) => r.status === 'rejected').length,
    }),
    { applied: 0, known: 0, refused: 0 },
  );
  return (
    <section
      aria-label="A phone that cannot sync"
      className="surface space-y-2 rounded-xl border border-line bg-card p-3"
    >
      <h2 className="font-bold">A phone that cannot sync</h2>
      <p className="text-base">
        Load the file its writer saved with "Save waiting changes as a file". Each change counts once, even if
        the phone syncs later.
      </p>
      <FileField
        label="File of waiting changes"
        hint={online ? undefined : 'Importing needs signal.'}
        accept="application/json,.json"
        disabled={!online || upload.isPending}
        onChange={(e) => {
          const file = e.target.files?.[0];
          if (file) upload.mutate(file);
        }}
      />
      {upload.error && <Notice tone="error">{upload.error.message}</Notice>}
      {totals && (
        <Notice tone={totals.refused ? 'error' : 'success'}>
          {totals.applied} changes applied, {totals.known} already known
          {totals.refused
            ? `, ${totals.refused} refused: ${upload
                .data!.clients.flatMap((c) => c.results)
                .filter((r) => r.status === 'rejected')
                .map((r) => ('reason' in r ? r.reason : ''))
                .join(' ')}`
            : ''}
          .
        </Notice>
      )}
      {transcribed && (
        <Notice tone="info">
          Some changes were not signed by the phone that made them (an older app, a phone without a key, or a
          file changed after saving). They count as your transcription and show "transcribed by judge{' '}
          {transcribed} from a file"; signatures in them were refused.
        </Notice>
      )}
    </section>
  );
}
