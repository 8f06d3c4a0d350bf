import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ApiError } from '../../../api/request';
import type { EventSummary } from '../../../contract/events';
import { Notice } from '../../../ui/Notice';
import { useEventSummary } from '../../../api/eventSummary';

export const ONLY_ORGANIZERS = "Only the event's organizers can change its setup.";

/** Organizer screens render for organizers; everyone else gets a plain explanation, not a broken screen. */
export function OrganizerGate({
  eventId,
  children,
}: {
  eventId: number;
  children: (summary: EventSummary) => ReactNode;
}) {
  const summary = useEventSummary(eventId);
  if (summary.isPending) return <p>Loading the event…</p>;
  if (summary.error) {
    const status = summary.error instanceof ApiError ? summary.error.status : 0;
    if (status === 403) return <NotOrganizer />;
    return <Notice tone="error">{summary.error.message}</Notice>;
  }
  if (!summary.data.myRoles.includes('organizer'))
    return <NotOrganizer eventName={summary.data.event.name} />;
  return <>{children(summary.data)}</>;
}

function NotOrganizer({ eventName }: { eventName?: string }) {
  return (
    <div className="space-y-4" data-testid="not-organizer">
      {eventName && <h1 className="text-3xl font-bold">{eventName}</h1>}
      <Notice tone="info">{ONLY_ORGANIZERS} If something in it is wrong, ask one of them.</Notice>
      <Link
        to="/"
        className="inline-flex min-h-14 items-center rounded-lg border-2 border-ink px-5 text-lg font-bold"
      >
        Go to start
      </Link>
    </div>
  );
}
