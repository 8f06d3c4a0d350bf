import { memo, useEffect, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { endsOfRound } from '../../core';
import { padEndView } from './padEndView';
import { endKeyOf, type JoinedTarget } from '../../local/db';
import type { WriterSlot } from '../../contract/fieldTerms';
import type { LocalEnd } from '../../local/endFacts';
import { SafetyNote } from '../../ui/SafetyNote';
import { useMe } from '../../local/me';
import { usePhoneOwner } from '../../local/phoneOwner';
import { screenShown } from '../../local/firstScreen';
import { CardsToSignLink } from '../../ui/scorecard/CardsToSignLink';
import { CallerView } from './CallerView';
import { openFlags } from '../../ui/scorecard/endFlags';
import { endLabel } from '../../ui/scorecard/endStateLabel';
import { Rejections } from '../../ui/scorecard/Rejections';
import { HeldForJudge } from './HeldForJudge';
import { LeaveTask } from './LeaveTask';
import { SyncLine } from '../../ui/scorecard/SyncLine';
import { TASK_LABELS } from '../../ui/scorecard/taskNames';
import { TaskNotice } from './TaskNotice';
import { usePadData } from './usePadData';
import { WriterPad } from './WriterPad';

/**
 * Parts of the pad a tap does not change: the re-read after each tap hands them the same props
 * (usePadData keeps the target's identity), so they are not drawn again.
 */
const SteadySafetyNote = memo(SafetyNote);
const SteadySyncLine = memo(SyncLine);
const SteadyRejections = memo(Rejections);
const SteadyHeldForJudge = memo(HeldForJudge);
const SteadyTaskNotice = memo(TaskNotice);
const SteadyLeaveTask = memo(LeaveTask);

/** The most ends any archer of the target shoots (the pad steps through all of them). */
const endCountOf = (target: JoinedTarget) =>
  Math.max(...target.archers.map((a) => endsOfRound(a.round).length));

/** The first end that still needs someone on this target: a card not finished, or cards not agreed yet. */
function firstOpenEnd(target: JoinedTarget, ends: Map<string, LocalEnd>): number {
  const count = endCountOf(target);
  const slot = target.task === 'writer1' ? 1 : target.task === 'writer2' ? 2 : undefined;
  for (let endIndex = 0; endIndex < count; endIndex += 1) {
    const unfinished = target.archers.some((a) => {
      const local = ends.get(endKeyOf(target.session.id, a.entryId, endIndex));
      const perEnd = endsOfRound(a.round)[endIndex]?.arrows ?? 0;
      if (slot && (local?.slots[slot]?.arrows.length ?? 0) < perEnd) return true;
      const state = local ? padEndView(local).state : 'open';
      // A flagged arrow still needs the target's attention (and a judge), even on agreed cards.
      if (openFlags(local).length > 0) return true;
      return state !== 'agreed' && state !== 'settled' && state !== 'signed';
    });
    if (unfinished) return endIndex;
  }
  return count - 1;
}

/**
 * One archer's tab: redrawn only when its own end changes (a tap on another archer's end keeps
 * this end's object, see usePadData) or it is selected.
 */
const ArcherTab = memo(function ArcherTab({
  index,
  position,
  firstName,
  local,
  slot,
  perEnd,
  selected,
  onSelect,
}: {
  index: number;
  position: string;
  firstName: string;
  local: LocalEnd | undefined;
  slot: WriterSlot;
  perEnd: number;
  selected: boolean;
  onSelect: (index: number) => void;
}) {
  const label = endLabel(local && padEndView(local));
  const flagged = openFlags(local).length > 0;
  const count = local?.slots[slot]?.arrows.length ?? 0;
  return (
    <button
      type="button"
      role="tab"
      aria-selected={selected}
      onClick={() => onSelect(index)}
      className={`min-h-16 rounded-lg border-2 px-1 text-left ${selected ? 'border-ink bg-ink text-white' : 'border-line bg-card'}`}
    >
      <span className="block text-xl font-bold">{position}</span>
      <span className="block truncate text-base">{firstName}</span>
      <span className="block text-base">
        <span aria-hidden="true">{label.mark}</span>
        <span className="sr-only">{label.word}</span> {count}/{perEnd}
        {flagged && (
          <>
            <span aria-hidden="true"> ⚑</span>
            <span className="sr-only">, flagged for a judge</span>
          </>
        )}
      </span>
    </button>
  );
});

function Pad({
  target,
  ends,
  rejected,
  held,
  unsent,
}: {
  target: JoinedTarget;
  ends: Map<string, LocalEnd>;
  unsent: number;
  rejected: Parameters<typeof Rejections>[0]['rows'];
  held: Parameters<typeof HeldForJudge>[0]['rows'];
}) {
  const endCount = endCountOf(target);
  // A reload (or a phone woken from sleep) comes back to the end the person was on.
  const memoryKey = `ringcall.pad-end.${target.key}`;
  const [endIndex, setEndIndex] = useState(() => {
    const remembered = Number(localStorage.getItem(memoryKey));
    return localStorage.getItem(memoryKey) !== null && remembered < endCount
      ? remembered
      : firstOpenEnd(target, ends);
  });
  const [archerIndex, setArcherIndex] = useState(0);
  const slot = target.task === 'writer1' ? 1 : target.task === 'writer2' ? 2 : undefined;
  const goToEnd = (i: number) => {
    const next = Math.min(endCount - 1, Math.max(0, i));
    localStorage.setItem(memoryKey, String(next));
    setEndIndex(next);
    setArcherIndex(0);
  };

  return (
    <div className="space-y-4">
      <header className="space-y-2">
        <p className="text-base">
          {target.event.name} · {target.session.name}
        </p>
        <h1 className="text-3xl font-bold">
          Target {target.targetNumber}{' '}
          <span className="text-xl font-normal">· {TASK_LABELS[target.task]}</span>
        </h1>
      </header>
      <SteadyTaskNotice target={target} unsent={unsent} />
      <SteadySafetyNote compact />
      <SteadyRejections rows={rejected} target={target} />
      <SteadyHeldForJudge rows={held} target={target} />

      <nav aria-label="Ends" className="flex items-center gap-2">
        <button
          type="button"
          className="h-14 w-16 rounded-lg border-2 border-ink text-2xl font-bold disabled:opacity-30"
          onClick={() => goToEnd(endIndex - 1)}
          disabled={endIndex === 0}
          aria-label="Previous end"
        >
          ◀
        </button>
        <p className="flex-1 text-center text-2xl font-bold" data-testid="end-number">
          End {endIndex + 1} <span className="text-lg font-normal">of {endCount}</span>
        </p>
        <button
          type="button"
          className="h-14 w-16 rounded-lg border-2 border-ink text-2xl font-bold disabled:opacity-30"
          onClick={() => goToEnd(endIndex + 1)}
          disabled={endIndex >= endCount - 1}
          aria-label="Next end"
        >
          ▶
        </button>
      </nav>

      {slot ? (
        <>
          <div className="grid grid-cols-4 gap-2" role="tablist" aria-label="Archers in card order">
            {target.archers.map((a, i) => (
              <ArcherTab
                key={a.entryId}
                index={i}
                position={a.position}
                firstName={a.name.split(' ')[0] ?? ''}
                local={ends.get(endKeyOf(target.session.id, a.entryId, endIndex))}
                slot={slot}
                perEnd={endsOfRound(a.round)[endIndex]?.arrows ?? 0}
                selected={i === archerIndex}
                onSelect={setArcherIndex}
              />
            ))}
          </div>
          <WriterPad
            target={target}
            slot={slot}
            ends={ends}
            endIndex={endIndex}
            archerIndex={archerIndex}
            onArcherIndex={setArcherIndex}
          />
        </>
      ) : (
        <CallerView target={target} ends={ends} endIndex={endIndex} />
      )}
      <div className="space-y-4">
        {slot && <CardsToSignLink target={target} slot={slot} ends={ends} />}
        <SteadySyncLine />
        <SteadyLeaveTask target={target} unsent={unsent} />
      </div>
    </div>
  );
}

export function PadScreen() {
  const params = useParams();
  const sessionId = Number(params.sessionId);
  const targetNumber = Number(params.targetNumber);
  const me = useMe();
  // After a sign-in ran out, the pad still opens for the person whose phone it is (not for anyone else).
  const owner = usePhoneOwner();
  const data = usePadData(sessionId, targetNumber, me.data?.user.id ?? owner);
  useEffect(() => {
    if (data !== undefined) screenShown();
  }, [data]);
  if (data === undefined) return <p>Opening the pad…</p>;
  if (data === null) {
    return (
      <div className="space-y-4">
        <h1 className="text-2xl font-bold">This phone has not joined target {targetNumber}</h1>
        <p>Scan the join code on your target sheet to start scoring.</p>
        <Link
          to="/join"
          className="inline-flex min-h-14 items-center rounded-lg bg-moss px-5 font-bold text-white"
        >
          Join a target
        </Link>
      </div>
    );
  }
  return (
    <Pad
      key={data.target.key}
      target={data.target}
      ends={data.ends}
      rejected={data.rejected}
      held={data.held}
      unsent={data.unsent}
    />
  );
}
