import type { ReactNode } from 'react';
import { useParams } from 'react-router-dom';
import type { EventSummary } from '../../../contract/events';
import { RequireSignIn } from '../../../account/RequireSignIn';
import { OrganizerGate } from './OrganizerGate';

/** A screen of one session of an event (ids from the address), shown to its organizers only. */
export function OrganizerSessionScreen({
  children,
}: {
  children: (summary: EventSummary, sessionId: number) => ReactNode;
}) {
  const params = useParams();
  const eventId = Number(params.eventId);
  const sessionId = Number(params.sessionId);
  return (
    <RequireSignIn>
      {() => <OrganizerGate eventId={eventId}>{(summary) => children(summary, sessionId)}</OrganizerGate>}
    </RequireSignIn>
  );
}
