import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { apiRequest } from '../../api/request';
import type { VerifyResult } from '../../contract/judging';
import { Notice } from '../../ui/Notice';

/** Where a signed card's QR code leads: is this card still what was signed? Open to anyone. */
export function VerifyScreen() {
  const [params] = useSearchParams();
  const sig = params.get('sig') ?? '';
  const result = useQuery({
    queryKey: ['verify', sig],
    queryFn: () => apiRequest<VerifyResult>(`/api/verify?sig=${encodeURIComponent(sig)}`),
    enabled: sig.length > 0,
    retry: false,
  });

  return (
    <div className="mx-auto max-w-xl space-y-4">
      <h1 className="text-3xl font-bold">Check a signed card</h1>
      {!sig && (
        <Notice tone="error">This link has no signature in it. Scan the QR code on the card again.</Notice>
      )}
      {result.isPending && sig && <p>Checking the signature…</p>}
      {result.error && <Notice tone="error">{result.error.message}</Notice>}
      {result.data && !result.data.signatureValid && (
        <div
          data-testid="verify-result"
          className="surface rounded-xl border-4 border-brick bg-brick-bg p-4 text-brick"
        >
          <p className="text-2xl font-bold">▲ Not a valid Ringcall signature</p>
          <p>{result.data.message}</p>
        </div>
      )}
      {result.data?.signatureValid && (
        <div
          data-testid="verify-result"
          className={`surface space-y-2 rounded-xl border-4 p-4 ${result.data.unchanged ? 'border-moss bg-card' : 'border-brick bg-brick-bg text-brick'}`}
        >
          <p className="text-2xl font-bold">
            {result.data.unchanged ? '✓ Unchanged since it was signed' : '▲ Changed after it was signed'}
          </p>
          <p>{result.data.message}</p>
          <p>
            {result.data.kind === 'card' ? 'Scorecard' : 'End'} of <strong>{result.data.archer}</strong> (
            {result.data.division}), {result.data.event}.
          </p>
          {result.data.totals && (
            <p className="text-xl">
              Total <strong>{result.data.totals.total}</strong> · 10s {result.data.totals.tens} · Xs{' '}
              {result.data.totals.xs} · hits {result.data.totals.hits}
            </p>
          )}
          <p className="text-base">
            Signed {new Date(result.data.signedAt).toLocaleString()}
            {result.data.phoneAt && ` (phone time ${new Date(result.data.phoneAt).toLocaleString()})`} by{' '}
            {result.data.signers.map((s) => `${s.name} (${s.role})`).join(', ')}.
          </p>
          {result.data.countersigned && <p className="text-base">The archer {result.data.countersigned}.</p>}
          {result.data.changes && (
            <div>
              <h2 className="font-bold">What differs from the card as signed</h2>
              <ul className="list-disc pl-6">
                {result.data.changes.map((c) => (
                  <li key={c.what}>
                    {c.what}: signed “{c.signed}”, now “{c.now}”
                  </li>
                ))}
              </ul>
            </div>
          )}
          {!result.data.unchanged && (
            <p className="font-bold">
              Ask the event's judges: the stored card no longer matches its signature.
            </p>
          )}
        </div>
      )}
    </div>
  );
}
