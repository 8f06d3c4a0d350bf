import { useId, useState } from 'react';
import type { LateValueDto } from '../../contract/lateValues';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { counted } from '../../ui/counted';
import { useDecideLateValue, useLateValues } from './api/lateValues';

const time = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

function whoEntered(l: LateValueDto): string {
  return l.kind === 'end.write' ? `Writer ${l.slot} (${l.byName})` : `The caller's settlement (${l.byName})`;
}

function LateValueCard({ late, eventId }: { late: LateValueDto; eventId: number }) {
  const [rejecting, setRejecting] = useState(false);
  const [reason, setReason] = useState('');
  const decide = useDecideLateValue(eventId, late.sessionId);
  const reasonId = useId();
  return (
    <li
      className="surface space-y-2 rounded-xl border-2 border-line bg-card p-3"
      data-testid={`late-${late.targetNumber}-${late.endIndex + 1}`}
    >
      <p className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="text-xl font-bold">
          Target {late.targetNumber} · {late.archerName}
        </span>
        <span className="font-bold">End {late.endIndex + 1}</span>
      </p>
      <p>
        {whoEntered(late)}: <strong>{late.arrows.join(' ') || 'no arrows'}</strong>
        {late.flags.length > 0 &&
          ` (marked: ${late.flags.map((f) => `${f.flag} on arrow ${f.index + 1}`).join(', ')})`}
      </p>
      <p className="text-base">
        Entered {time(late.at)}, reached the server {time(late.receivedAt)}, after the session closed.
      </p>
      {rejecting ? (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            decide.mutate({ id: late.id, accept: false, reason });
          }}
        >
          <label htmlFor={reasonId} className="block font-bold">
            Why is it rejected? The person who entered it reads this.
          </label>
          <textarea
            id={reasonId}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            rows={2}
            className="surface block w-full rounded-lg border-2 border-line bg-card p-3 text-lg"
          />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" variant="danger" disabled={decide.isPending}>
              Reject with this reason
            </Button>
            <Button variant="secondary" onClick={() => setRejecting(false)}>
              Back
            </Button>
          </div>
        </form>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button disabled={decide.isPending} onClick={() => decide.mutate({ id: late.id, accept: true })}>
            ✓ Accept
          </Button>
          <Button variant="secondary" onClick={() => setRejecting(true)}>
            Reject…
          </Button>
        </div>
      )}
      {decide.error && <Notice tone="error">{decide.error.message}</Notice>}
    </li>
  );
}

/**
 * Values that phones sent after the session closed. Nothing is dropped: each waits here until a
 * judge accepts it (it then counts, as if it had arrived in time) or rejects it with a reason.
 */
export function LateValues({ eventId, sessionId }: { eventId: number; sessionId: number }) {
  const late = useLateValues(eventId, sessionId);
  if (!late.data || late.data.length === 0) return null;
  const waiting = late.data.filter((l) => l.status === 'waiting');
  const decided = late.data.filter((l) => l.status !== 'waiting');
  return (
    <section aria-labelledby="late-values" className="space-y-2" data-testid="late-values">
      <h2 id="late-values" className="text-2xl font-bold">
        Arrived after closing{waiting.length > 0 && ` · ${counted(waiting.length, 'value')} waiting`}
      </h2>
      {waiting.length > 0 && (
        <ul className="space-y-3">
          {waiting.map((l) => (
            <LateValueCard key={l.id} late={l} eventId={eventId} />
          ))}
        </ul>
      )}
      {decided.length > 0 && (
        <ul className="space-y-1 text-base">
          {decided.map((l) => (
            <li key={l.id}>
              <span aria-hidden="true">{l.status === 'accepted' ? '✓ ' : '✗ '}</span>
              Target {l.targetNumber}, {l.archerName}, end {l.endIndex + 1}: {l.status} by {l.decidedByName}
              {l.reason ? ` (${l.reason})` : ''}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
