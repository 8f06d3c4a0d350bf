import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { EventSession, EventSummary } from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { Notice } from '../../../ui/Notice';
import { useCreateSession } from '../api/createSession';
import { useUpdateSession } from '../api/updateSession';
import { useDeleteSession } from '../api/deleteSession';
import { useCloseSession } from '../api/closeSession';
import { useReopenSession } from '../api/reopenSession';
import { ConfirmButton } from '../components/ConfirmButton';
import { CloseSessionButton } from '../components/CloseSessionButton';
import { GoToPart } from '../components/GoToPart';
import { archersOnTargets } from '../components/archersOnTargets';
import { keepUnits } from '../components/formProblems';
import { localStart } from '../../../ui/localStart';
import { SessionForm } from './SessionForm';

const linkButton = 'inline-flex min-h-14 items-center rounded-lg bg-moss px-5 text-lg font-bold text-white';

function SessionCard({ summary, session }: { summary: EventSummary; session: EventSession }) {
  const eventId = summary.event.id;
  const [editing, setEditing] = useState(false);
  const update = useUpdateSession(eventId);
  const remove = useDeleteSession(eventId);
  const close = useCloseSession(eventId);
  const reopen = useReopenSession(eventId);
  const error = remove.error ?? close.error ?? reopen.error;

  if (editing) {
    return (
      <SessionForm
        divisions={summary.divisions}
        session={session}
        pending={update.isPending}
        error={update.error}
        onSubmit={(input) =>
          update.mutate({ sessionId: session.id, ...input }, { onSuccess: () => setEditing(false) })
        }
        onCancel={() => setEditing(false)}
      />
    );
  }
  return (
    <li className="surface space-y-3 rounded-xl border border-line bg-card p-4">
      <div>
        <h3 className="text-xl font-bold">{session.name}</h3>
        <p>
          {localStart(session.startsAt)} ·{' '}
          {session.closedAt ? (
            <strong>
              <span aria-hidden="true">✓ </span>Closed
            </strong>
          ) : (
            <span>
              <span aria-hidden="true">● </span>Open
            </span>
          )}
        </p>
        <p className="text-base text-ink-soft">
          {session.assignedCount === 0
            ? 'No archers on targets yet'
            : archersOnTargets(session.assignedCount, session.targetCount)}
        </p>
      </div>
      {session.rounds.length === 0 ? (
        <p>No division shoots in this session yet. Edit it to choose rounds.</p>
      ) : (
        <ul className="space-y-1">
          {session.rounds.map((r) => (
            <li key={r.divisionId}>
              <strong>{r.divisionName}:</strong> {keepUnits(r.round.name)}
              {r.round.custom && ' (custom)'} · {r.round.arrows} arrows ·{' '}
              {keepUnits([...new Set(r.round.distances.map((d) => d.faceLabel))].join(', then '))}
            </li>
          ))}
        </ul>
      )}
      <div className="flex flex-wrap gap-2">
        <Link to={`/events/${eventId}/sessions/${session.id}/targets`} className={linkButton}>
          Targets & printing
        </Link>
        {!session.closedAt && (
          <Button variant="secondary" onClick={() => setEditing(true)}>
            Edit
          </Button>
        )}
        {session.closedAt ? (
          <Button variant="secondary" onClick={() => reopen.mutate(session.id)} disabled={reopen.isPending}>
            Reopen
          </Button>
        ) : (
          <CloseSessionButton
            eventId={eventId}
            sessionId={session.id}
            name={session.name}
            onClose={() => close.mutate(session.id)}
          />
        )}
        {!session.closedAt && (
          <ConfirmButton
            question={`Delete ${session.name} with its targets and join codes?`}
            confirmLabel="Yes, delete"
            onConfirm={() => remove.mutate(session.id)}
          >
            Delete
          </ConfirmButton>
        )}
      </div>
      {error && <Notice tone="error">{error.message}</Notice>}
    </li>
  );
}

/** Sessions of shooting: when, and which round each division shoots. */
export function SessionsPart({ summary }: { summary: EventSummary }) {
  const create = useCreateSession(summary.event.id);
  const [formKey, setFormKey] = useState(0);
  if (summary.divisions.length === 0) {
    return (
      <GoToPart
        title="Sessions & rounds"
        text="Add the divisions first: each session says which round every division shoots."
        part="divisions"
        label="Go to divisions"
      />
    );
  }
  return (
    <>
      <h2 className="text-2xl font-bold">Sessions & rounds</h2>
      {summary.sessions.length === 0 ? (
        <p data-testid="no-sessions">
          No sessions yet. Add one below: a name, a start time and the round each division shoots.
        </p>
      ) : (
        <ul className="space-y-3">
          {summary.sessions.map((s) => (
            <SessionCard key={s.id} summary={summary} session={s} />
          ))}
        </ul>
      )}
      <SessionForm
        key={formKey}
        divisions={summary.divisions}
        pending={create.isPending}
        error={create.error}
        onSubmit={(input) => create.mutate(input, { onSuccess: () => setFormKey((k) => k + 1) })}
      />
    </>
  );
}
