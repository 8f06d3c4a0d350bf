import { useParams, useSearchParams } from 'react-router-dom';
import type { EventSummary } from '../../contract/events';
import { RequireSignIn } from '../../account/RequireSignIn';
import { Notice } from '../../ui/Notice';
import { OrganizerGate } from './components/OrganizerGate';
import { SectionNav, type Section } from './components/SectionNav';
import { dateRange } from './components/formProblems';
import { DetailsPart } from './parts/DetailsPart';
import { DivisionsPart } from './parts/DivisionsPart';
import { SessionsPart } from './parts/SessionsPart';
import { EntriesPart } from './parts/EntriesPart';
import { StaffPart } from './parts/StaffPart';
import { TargetsPart } from './parts/TargetsPart';
import { ResultsPart } from './parts/ResultsPart';
import { EliminationsPart } from './parts/EliminationsPart';

/** The next thing to set up, in the order an event is built. */
function nextStep(s: EventSummary): { text: string; part: string } | undefined {
  if (s.counts.divisions === 0)
    return { text: 'Add the divisions that will shoot (bow style and class).', part: 'divisions' };
  if (s.counts.sessions === 0)
    return { text: 'Add a session and choose the round each division shoots.', part: 'sessions' };
  if (s.counts.entries === 0)
    return { text: 'Add the archers: one by one, or upload a CSV file.', part: 'entries' };
  if (s.sessions.some((x) => !x.closedAt && x.assignedCount === 0 && x.rounds.length > 0))
    return { text: 'Assign targets, then print scorecards and target sheets.', part: 'targets' };
  if (s.counts.judges === 0 && s.counts.pendingInvitations === 0)
    return { text: 'Invite the judges.', part: 'staff' };
  return undefined;
}

function Overview({ summary }: { summary: EventSummary }) {
  const [params] = useSearchParams();
  const step = nextStep(summary);
  const current = params.get('part') ?? step?.part ?? 'details';
  const sections: Section[] = [
    { id: 'details', label: 'Details' },
    { id: 'divisions', label: 'Divisions', count: summary.counts.divisions },
    { id: 'sessions', label: 'Sessions & rounds', count: summary.counts.sessions },
    { id: 'entries', label: 'Entry list', count: summary.counts.entries },
    { id: 'staff', label: 'Staff', count: summary.counts.organizers + summary.counts.judges },
    { id: 'targets', label: 'Targets & printing' },
    { id: 'results', label: 'Results' },
    { id: 'eliminations', label: 'Eliminations' },
  ];
  const eventId = summary.event.id;
  return (
    <div className="space-y-5">
      <header>
        <h1 className="text-3xl font-bold leading-tight">{summary.event.name}</h1>
        <p>
          {dateRange(summary.event.startsOn, summary.event.endsOn)}
          {summary.event.venue && ` · ${summary.event.venue}`}
        </p>
      </header>
      {step && <Notice tone="info">Next step: {step.text}</Notice>}
      <SectionNav sections={sections} current={current} />
      <section aria-label={sections.find((s) => s.id === current)?.label ?? 'Details'} className="space-y-4">
        {current === 'divisions' && <DivisionsPart summary={summary} />}
        {current === 'sessions' && <SessionsPart summary={summary} />}
        {current === 'entries' && <EntriesPart summary={summary} />}
        {current === 'staff' && <StaffPart eventId={eventId} />}
        {current === 'targets' && <TargetsPart summary={summary} />}
        {current === 'results' && <ResultsPart summary={summary} />}
        {current === 'eliminations' && <EliminationsPart summary={summary} />}
        {!['divisions', 'sessions', 'entries', 'staff', 'targets', 'results', 'eliminations'].includes(
          current,
        ) && <DetailsPart summary={summary} />}
      </section>
    </div>
  );
}

/** One event's setup for its organizers: details, divisions, sessions, entries, staff, targets. */
export function EventScreen() {
  const eventId = Number(useParams().eventId);
  return (
    <RequireSignIn>
      {() => <OrganizerGate eventId={eventId}>{(summary) => <Overview summary={summary} />}</OrganizerGate>}
    </RequireSignIn>
  );
}
