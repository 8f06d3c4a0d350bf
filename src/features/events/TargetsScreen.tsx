import { useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import type { EventSummary, Position } from '../../contract/events';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { archersOnTargets } from './components/archersOnTargets';
import { useSessionTargets } from '../../api/sessionTargets';
import { useAssignTargets } from './api/assignTargets';
import { useMoveArcher } from './api/moveArcher';
import { useSwapArchers } from './api/swapArchers';
import { useUnassignArcher } from './api/unassignArcher';
import { useCreateJoinCodes } from './api/createJoinCodes';
import { useReissueJoinCode } from './api/reissueJoinCode';
import { useRevokeJoinCode } from './api/revokeJoinCode';
import { useDownloadScorecards } from './api/downloadScorecards';
import { useDownloadTargetSheets } from './api/downloadTargetSheets';
import { ConfirmButton } from './components/ConfirmButton';
import { TasksPanel } from './components/TasksPanel';
import { OrganizerSessionScreen } from './components/OrganizerSessionScreen';
import { LinkAddressNote } from './components/LinkAddressNote';
import { PlacesPanel } from './components/PlacesPanel';
import { TargetCard } from './components/TargetCard';
import { localStart } from '../../ui/localStart';

function Targets({ summary, sessionId }: { summary: EventSummary; sessionId: number }) {
  const eventId = summary.event.id;
  const targets = useSessionTargets(eventId, sessionId);
  const assign = useAssignTargets(eventId, sessionId);
  const move = useMoveArcher(eventId, sessionId);
  const swap = useSwapArchers(eventId, sessionId);
  const unassign = useUnassignArcher(eventId, sessionId);
  const codes = useCreateJoinCodes(eventId, sessionId);
  const reissue = useReissueJoinCode(eventId, sessionId);
  const revoke = useRevokeJoinCode(eventId, sessionId);
  const scorecards = useDownloadScorecards(eventId, sessionId);
  const sheets = useDownloadTargetSheets(eventId, sessionId);
  const [picked, setPicked] = useState<number>();
  // A new key after each change starts the panel afresh, so no stale choice is applied twice.
  const [panelKey, setPanelKey] = useState(0);
  const panelRef = useRef<HTMLElement>(null);
  const session = summary.sessions.find((s) => s.id === sessionId);

  if (targets.isPending) return <p>Loading the targets…</p>;
  if (targets.error) return <Notice tone="error">{targets.error.message}</Notice>;
  const list = targets.data;
  const closed = !!list.session.closedAt;
  const hasTargets = list.targets.length > 0;
  const conflictedTargets = new Set(
    list.conflicts.map((c) => c.targetNumber).filter((n): n is number => n !== null),
  );
  const codeError = codes.error ?? reissue.error ?? revoke.error;
  const printError = scorecards.error ?? sheets.error;

  const changed = {
    onSuccess: () => {
      setPicked(undefined);
      setPanelKey((k) => k + 1);
    },
  };
  const pick = (entryId: number) => {
    setPicked(entryId);
    panelRef.current?.scrollIntoView({ behavior: 'smooth', block: 'start' });
    panelRef.current?.focus({ preventScroll: true });
  };

  return (
    <div className="space-y-5">
      <header>
        <Link
          to={`/events/${eventId}?part=targets`}
          className="inline-flex min-h-12 items-center font-bold underline"
        >
          ← {summary.event.name}
        </Link>
        <h1 className="text-3xl font-bold leading-tight">Targets · {list.session.name}</h1>
        <p>
          {localStart(list.session.startsAt)}
          {hasTargets &&
            ` · ${archersOnTargets(
              list.targets.reduce((n, t) => n + t.archers.length, 0),
              list.targets.length,
            )}`}
        </p>
        {hasTargets && (
          <Link
            to={`/events/${eventId}/sessions/${sessionId}/cards`}
            className="inline-flex min-h-12 items-center font-bold underline"
          >
            Card board: every card's state, targets behind, final cards mailed ▸
          </Link>
        )}
      </header>

      {closed && (
        <Notice tone="info">
          This session is closed, so its layout cannot change. Reopen it under Sessions & rounds to change it.
        </Notice>
      )}
      {session && session.rounds.length === 0 && (
        <Notice tone="info">
          No division shoots in this session yet. Choose rounds under Sessions & rounds first.
        </Notice>
      )}

      {!closed && (
        <div className="space-y-2">
          {hasTargets ? (
            <ConfirmButton
              variant="primary"
              question="Lay out every target again? Hand-made moves are replaced; join codes stay."
              confirmLabel="Yes, assign again"
              onConfirm={() => assign.mutate(undefined)}
            >
              Assign targets automatically
            </ConfirmButton>
          ) : (
            <Button onClick={() => assign.mutate(undefined)} disabled={assign.isPending}>
              {assign.isPending ? 'Assigning…' : 'Assign targets automatically'}
            </Button>
          )}
          <p className="text-base">
            Archers are grouped by round and division, up to four to a target in positions A–D.
          </p>
          {assign.error && <Notice tone="error">{assign.error.message}</Notice>}
        </div>
      )}

      {hasTargets && (
        <section aria-labelledby="print" className="space-y-2">
          <h2 id="print" className="text-2xl font-bold">
            Print
          </h2>
          <div className="flex flex-wrap gap-2">
            <Button variant="secondary" onClick={() => scorecards.mutate()} disabled={scorecards.isPending}>
              {scorecards.isPending ? 'Preparing…' : 'Scorecards (PDF)'}
            </Button>
            <Button variant="secondary" onClick={() => sheets.mutate()} disabled={sheets.isPending}>
              {sheets.isPending ? 'Preparing…' : 'Target sheets (PDF)'}
            </Button>
            {list.targets.some((t) => !t.joinCode) && (
              <Button variant="secondary" onClick={() => codes.mutate(undefined)} disabled={codes.isPending}>
                Issue missing join codes
              </Button>
            )}
          </div>
          <p className="text-base">
            One scorecard per archer; one sheet per target with its join code, QR code and the range cautions.
          </p>
          <LinkAddressNote address={list.linkAddress} />
          {printError && <Notice tone="error">{printError.message}</Notice>}
        </section>
      )}

      {list.conflicts.length > 0 && (
        <section
          aria-labelledby="conflicts"
          className="surface space-y-2 rounded-xl border-2 border-brick bg-brick-bg p-4 text-brick"
          data-testid="conflicts"
        >
          <h2 id="conflicts" className="text-xl font-bold">
            <span aria-hidden="true">▲ </span>
            {list.conflicts.length === 1 ? '1 thing to check' : `${list.conflicts.length} things to check`}
          </h2>
          <ul className="list-disc space-y-1 pl-5">
            {list.conflicts.map((c, i) => (
              <li key={i}>{c.message}</li>
            ))}
          </ul>
        </section>
      )}

      {!hasTargets ? (
        <p data-testid="no-targets">
          No archers are on targets yet.{' '}
          {closed
            ? 'This session is closed.'
            : 'Tap "Assign targets automatically" above, then change places by hand where you need to.'}
        </p>
      ) : (
        <>
          {!closed && (
            <PlacesPanel
              key={panelKey}
              list={list}
              picked={picked}
              onPick={setPicked}
              onMove={(input: { entryId: number; targetNumber: number; position: Position }) =>
                move.mutate(input, changed)
              }
              onSwap={(input) => swap.mutate(input, changed)}
              onUnassign={(entryId) => unassign.mutate(entryId, changed)}
              pending={move.isPending || swap.isPending || unassign.isPending}
              error={move.error ?? swap.error ?? unassign.error}
              panelRef={panelRef}
            />
          )}
          <TasksPanel
            eventId={eventId}
            sessionId={sessionId}
            targetNumbers={list.targets.map((t) => t.targetNumber)}
          />
          {codeError && <Notice tone="error">{codeError.message}</Notice>}
          <ul className="grid gap-4 md:grid-cols-2" aria-label="Targets">
            {list.targets.map((t) => (
              <TargetCard
                key={t.targetNumber}
                target={t}
                conflicted={conflictedTargets.has(t.targetNumber)}
                closed={closed}
                onPick={pick}
                onReissue={() => reissue.mutate(t.targetNumber)}
                onRevoke={() => revoke.mutate(t.targetNumber)}
              />
            ))}
          </ul>
        </>
      )}
    </div>
  );
}

/** One session's targets: automatic layout, changes by hand, conflicts in words, join codes, printouts. */
export function TargetsScreen() {
  return (
    <OrganizerSessionScreen>
      {(summary, sessionId) => <Targets summary={summary} sessionId={sessionId} />}
    </OrganizerSessionScreen>
  );
}
