import { useCallback, useRef, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useLiveQuery } from 'dexie-react-hooks';
import { endKeyOf, localDb, type JoinedTarget } from '../../local/db';
import { loadSessionEnds } from '../../local/sessionEnds';
import { useLocalSave } from '../../local/useLocalSave';
import { useOnline } from '../../local/online';
import { RequireSignIn } from '../../account/RequireSignIn';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { SelectField } from '../../ui/SelectField';
import { SyncLine } from '../../ui/scorecard/SyncLine';
import { Rejections } from '../../ui/scorecard/Rejections';
import { useEventSummary } from '../../api/eventSummary';
import {
  DESK_KIND_LABELS,
  deskItemKey,
  deskItems,
  targetSummaries,
  withoutSigned,
  type DeskItem,
  type DeskItemKind,
} from './deskItems';
import { DeskItemCard } from './DeskItemCard';
import { signEnds } from './signEnds';
import { messageOf } from '../../api/request';
import { ImportWaiting } from './ImportWaiting';
import { LateValues } from './LateValues';
import { TargetGroup } from '../../ui/scorecard/TargetGroup';
import { PaperCountersigns } from './PaperCountersigns';
import { usePrepareDesk } from './api/prepareDesk';
import { localStart } from '../../ui/localStart';

const keyOf = (t: JoinedTarget, entryId: number, endIndex: number) =>
  endKeyOf(t.session.id, entryId, endIndex);

/** What needs a judge on these targets, read from the phone (the server's copies and waiting changes). */
async function readDesk(sessionId: number, userId: number, targets: JoinedTarget[]) {
  const { ends, rejected } = await loadSessionEnds(localDb(), sessionId, userId, targets);
  return { items: deskItems(targets, ends, keyOf), rejected };
}

function SignAll({ userId, ready, suffix }: { userId: number; ready: DeskItem[]; suffix: string }) {
  const { save, problem } = useLocalSave();
  return (
    <>
      {ready.length > 1 && (
        <Button className="w-full" onClick={() => save(() => signEnds(userId, ready))}>
          ✍ Sign all {ready.length} ready ends{suffix}
        </Button>
      )}
      {problem && <Notice tone="error">{problem}</Notice>}
    </>
  );
}

const countWords = (counts: Record<DeskItemKind, number>) =>
  (Object.keys(DESK_KIND_LABELS) as DeskItemKind[])
    .filter((kind) => counts[kind] > 0)
    .map(
      (kind) =>
        `${DESK_KIND_LABELS[kind].mark} ${DESK_KIND_LABELS[kind].word.toLowerCase()}: ${counts[kind]}`,
    )
    .join(' · ');
/**
 * Every target of the session as one summary row, those needing a decision first: a desk of 50
 * targets shows 50 rows, not thousands of ends (the ends of one target open on a tap).
 */
function AllTargets({
  sessionId,
  userId,
  targets,
  onPick,
}: {
  sessionId: number;
  userId: number;
  targets: JoinedTarget[];
  onPick: (targetNumber: number) => void;
}) {
  const data = useLiveQuery(async () => {
    const { items, rejected } = await readDesk(sessionId, userId, targets);
    return {
      summaries: targetSummaries(targets, items),
      ready: items.filter((i) => i.kind === 'to-sign'),
      rejected,
    };
  }, [sessionId, userId, targets]);
  if (!data) return <p>Reading the ends on this phone…</p>;
  const waiting = data.summaries.filter((s) => s.first);
  const quiet = data.summaries.filter((s) => !s.first);
  return (
    <>
      {targets[0] && <Rejections rows={data.rejected} target={targets[0]} />}
      <SignAll userId={userId} ready={data.ready} suffix="" />
      {waiting.length === 0 ? (
        <p>Nothing waits for a judge. Disputes, incidents and ends to sign appear here as phones sync.</p>
      ) : (
        <ul className="space-y-2" data-testid="desk-targets">
          {waiting.map((s) => (
            <li key={s.target.key}>
              <button
                type="button"
                onClick={() => onPick(s.target.targetNumber)}
                className="surface flex min-h-16 w-full flex-wrap items-center justify-between gap-2 rounded-xl border-2 border-ink bg-card p-3 text-left text-lg"
                data-testid={`desk-target-${s.target.targetNumber}`}
              >
                <span className="text-xl font-bold">Target {s.target.targetNumber}</span>
                <span>{countWords(s.counts)} ▸</span>
              </button>
            </li>
          ))}
        </ul>
      )}
      {quiet.length > 0 && waiting.length > 0 && (
        <p>
          Nothing waits on target{quiet.length > 1 ? 's' : ''}{' '}
          {quiet.map((s) => s.target.targetNumber).join(', ')}.
        </p>
      )}
    </>
  );
}

/** One target's ends waiting for a judge, in full; only this target's ends are read on each change. */
function OneTarget({
  eventId,
  sessionId,
  userId,
  target,
}: {
  eventId: number;
  sessionId: number;
  userId: number;
  target: JoinedTarget;
}) {
  // Reads begun so far: an end signed on this screen leaves at once (see withoutSigned).
  const reads = useRef(0);
  const data = useLiveQuery(async () => {
    const readNumber = (reads.current += 1);
    return { ...(await readDesk(sessionId, userId, [target])), readNumber };
  }, [sessionId, userId, target]);
  const [signedAt, setSignedAt] = useState<ReadonlyMap<string, number>>(new Map());
  const [problem, setProblem] = useState<string>();
  const onSign = useCallback(
    (item: DeskItem) => {
      const key = deskItemKey(item);
      const mark = (readNumber: number | undefined) =>
        setSignedAt((signed) => {
          const next = new Map(signed);
          if (readNumber === undefined) next.delete(key);
          else next.set(key, readNumber);
          return next;
        });
      // The end leaves in the tap's own frame, not after the database's answer (which waits behind
      // a sync's writes): no read shows it until the signature is stored, then reads begun since do.
      setProblem(undefined);
      mark(Infinity);
      signEnds(userId, [item]).then(
        () => mark(reads.current),
        (error: unknown) => {
          mark(undefined);
          setProblem(
            `The signature on target ${item.target.targetNumber}${item.target.archers[item.archerIndex]?.position ?? ''}, end ${item.endIndex + 1} was not saved on this phone (${messageOf(error)}). Try again.`,
          );
        },
      );
    },
    [userId],
  );
  if (!data) return <p>Reading the ends on this phone…</p>;
  const items = withoutSigned(data.items, signedAt, data.readNumber);
  return (
    <>
      <Rejections rows={data.rejected} target={target} />
      <SignAll
        userId={userId}
        ready={items.filter((i) => i.kind === 'to-sign')}
        suffix={` of target ${target.targetNumber}`}
      />
      {problem && <Notice tone="error">{problem}</Notice>}
      {items.length === 0 ? (
        <p>
          Nothing waits for a judge on this target. Disputes, incidents and ends to sign appear here as phones
          sync.
        </p>
      ) : (
        <ul className="space-y-3">
          {items.map((item) => (
            <DeskItemCard
              key={deskItemKey(item)}
              item={item}
              eventId={eventId}
              userId={userId}
              onSign={onSign}
            />
          ))}
        </ul>
      )}
    </>
  );
}

function Desk({ eventId, sessionId, userId }: { eventId: number; sessionId: number; userId: number }) {
  const [targetFilter, setTargetFilter] = useState<number | 'all'>('all');
  const prepare = usePrepareDesk(sessionId, userId);
  const online = useOnline();
  const targets = useLiveQuery(
    async () =>
      (await localDb().targets.where('userId').equals(userId).toArray())
        .filter((t) => t.session.id === sessionId)
        .sort((a, b) => a.targetNumber - b.targetNumber),
    [sessionId, userId],
  );

  if (!targets) return <p>Opening the judge desk…</p>;
  const first = targets[0];
  const picked = targetFilter === 'all' ? undefined : targets.find((t) => t.targetNumber === targetFilter);
  return (
    <div className="space-y-4">
      {targets.length === 0 ? (
        <Notice tone="info">
          Load this session's targets onto the phone first; the desk then works without signal.
        </Notice>
      ) : (
        <p className="text-base">
          {targets.length} targets on this phone. {first && `${first.event.name} · ${first.session.name}.`}
        </p>
      )}
      <Button
        variant={targets.length ? 'secondary' : 'primary'}
        disabled={!online || prepare.isPending}
        onClick={() => prepare.mutate()}
      >
        {prepare.isPending
          ? 'Loading targets…'
          : targets.length
            ? 'Reload the targets'
            : 'Load the targets for offline work'}
      </Button>
      {prepare.error && <Notice tone="error">{prepare.error.message}</Notice>}

      <SelectField
        label="Target"
        value={targetFilter}
        onChange={(e) => setTargetFilter(e.target.value === 'all' ? 'all' : Number(e.target.value))}
      >
        <option value="all">All targets</option>
        {targets.map((t) => (
          <option key={t.key} value={t.targetNumber}>
            Target {t.targetNumber}
          </option>
        ))}
      </SelectField>

      {targetFilter !== 'all' && (
        <TargetGroup eventId={eventId} sessionId={sessionId} targetNumber={targetFilter} />
      )}
      {picked ? (
        <OneTarget eventId={eventId} sessionId={sessionId} userId={userId} target={picked} />
      ) : (
        targets.length > 0 && (
          <AllTargets sessionId={sessionId} userId={userId} targets={targets} onPick={setTargetFilter} />
        )
      )}
      <ShootOffsLink eventId={eventId} />
      <MatchesLink eventId={eventId} />
      <LateValues eventId={eventId} sessionId={sessionId} />
      <PaperCountersigns eventId={eventId} sessionId={sessionId} />
      <ImportWaiting eventId={eventId} />
      <SyncLine />
    </div>
  );
}

function ShootOffsLink({ eventId }: { eventId: number }) {
  return (
    <Link
      to={`/desk/${eventId}/shoot-offs`}
      className="surface flex min-h-16 items-center rounded-xl border-2 border-ink bg-card p-3 text-xl font-bold"
    >
      Shoot-offs ▸
    </Link>
  );
}

function MatchesLink({ eventId }: { eventId: number }) {
  return (
    <Link
      to={`/desk/${eventId}/matches`}
      className="surface flex min-h-16 items-center rounded-xl border-2 border-ink bg-card p-3 text-xl font-bold"
    >
      Matches ▸
    </Link>
  );
}

/** Where a judge starts: the event's sessions (the ends to sign), then its shoot-offs and matches. */
function SessionPicker({ eventId }: { eventId: number }) {
  const summary = useEventSummary(eventId);
  if (summary.isPending) return <p>Loading the event…</p>;
  if (summary.error) return <Notice tone="error">{summary.error.message}</Notice>;
  const { event, sessions } = summary.data;
  return (
    <>
      <p className="text-lg">{event.name}</p>
      {sessions.length === 0 && <p>This event has no sessions yet: the organizer sets them up.</p>}
      <ul className="space-y-2">
        {sessions.map((s) => (
          <li key={s.id}>
            <Link
              to={`/desk/${eventId}/${s.id}`}
              className="surface flex min-h-16 flex-col justify-center rounded-xl border-2 border-ink bg-card p-3"
            >
              <span className="text-xl font-bold">{s.name} ▸</span>
              <span>
                {localStart(s.startsAt)}
                {s.closedAt ? ' · closed' : ''}
              </span>
            </Link>
          </li>
        ))}
        <li>
          <ShootOffsLink eventId={eventId} />
        </li>
        <li>
          <MatchesLink eventId={eventId} />
        </li>
      </ul>
    </>
  );
}

/** The judge desk: disputes, incidents, unsettled mismatches and ends to sign, oldest ends first. */
export function JudgeDeskScreen() {
  const params = useParams();
  const eventId = Number(params.eventId);
  const sessionId = params.sessionId ? Number(params.sessionId) : undefined;
  return (
    <div className="space-y-4">
      <h1 className="text-3xl font-bold">Judge desk</h1>
      <RequireSignIn>
        {(me) =>
          !me.roles.some((r) => r.eventId === eventId && r.role === 'judge') ? (
            <Notice tone="error">Only the event's judges can rule and sign.</Notice>
          ) : sessionId ? (
            <Desk eventId={eventId} sessionId={sessionId} userId={me.user.id} />
          ) : (
            <SessionPicker eventId={eventId} />
          )
        }
      </RequireSignIn>
    </div>
  );
}
