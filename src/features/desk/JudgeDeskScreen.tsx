import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useLiveQuery } from 'dexie-react-hooks';
import { endsOfRound } from '../../core';
import { endKeyOf, localDb } from '../../local/db';
import { loadSessionEnds } from '../../local/sessionEnds';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import { useLocalSave } from '../../local/useLocalSave';
import { useOnline } from '../../local/online';
import { RequireSignIn } from '../auth/RequireSignIn';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { RulingHistory } from '../../ui/scorecard/RulingHistory';
import { EndArrows } from '../pad/EndArrows';
import { SyncLine } from '../pad/SyncLine';
import { Rejections } from '../pad/Rejections';
import { useEventSummary } from '../events/api/eventSummary';
import { DESK_KIND_LABELS, deskItems, type DeskItem } from './deskItems';
import { RuleForm } from './RuleForm';
import { ImportWaiting } from './ImportWaiting';
import { LateValues } from './LateValues';
import { TargetGroup } from './TargetGroup';
import { PaperCountersigns } from './PaperCountersigns';
import { usePrepareDesk } from './api/prepareDesk';

async function sign(userId: number, items: DeskItem[]) {
  for (const item of items) {
    const archer = item.target.archers[item.archerIndex]!;
    await recordChange(localDb(), userId, {
      kind: 'end.sign',
      args: {
        sessionId: item.target.session.id,
        entryId: archer.entryId,
        endIndex: item.endIndex,
        arrows: item.view.arrows ?? [],
      },
    });
  }
  syncLoop().kick();
}

function DeskItemCard({ item, eventId, userId }: { item: DeskItem; eventId: number; userId: number }) {
  const [ruling, setRuling] = useState(false);
  const { save, problem } = useLocalSave();
  const archer = item.target.archers[item.archerIndex]!;
  const label = DESK_KIND_LABELS[item.kind];
  const perEnd = endsOfRound(archer.round)[item.endIndex]?.arrows ?? 0;
  return (
    <li
      className="surface space-y-2 rounded-xl border-2 border-line bg-card p-3"
      data-testid={`desk-${item.kind}-${item.target.targetNumber}${archer.position}-${item.endIndex + 1}`}
    >
      <h2 className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="text-xl font-bold">
          Target {item.target.targetNumber}
          {archer.position} · {archer.name}
        </span>
        <span className="font-bold">
          End {item.endIndex + 1} · <span aria-hidden="true">{label.mark}</span> {label.word}
        </span>
      </h2>
      <p>{item.detail}</p>
      <RulingHistory steps={item.local.rulings} />
      {item.kind !== 'to-sign' && (
        <div className="space-y-1">
          {([1, 2] as const).map((slot) => {
            const card = item.local.slots[slot];
            return card ? (
              <div key={slot}>
                <p className="font-bold">Writer {slot}</p>
                <EndArrows label={`Writer ${slot}`} arrows={card.arrows} flags={card.flags} slots={perEnd} />
              </div>
            ) : null;
          })}
        </div>
      )}
      {ruling ? (
        <RuleForm item={item} eventId={eventId} userId={userId} onDone={() => setRuling(false)} />
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => setRuling(true)}>
            Rule on this end
          </Button>
          {item.kind === 'to-sign' && (
            <Button onClick={() => save(() => sign(userId, [item]))}>✍ Sign end</Button>
          )}
        </div>
      )}
      {problem && <Notice tone="error">{problem}</Notice>}
    </li>
  );
}

function Desk({ eventId, sessionId, userId }: { eventId: number; sessionId: number; userId: number }) {
  const [targetFilter, setTargetFilter] = useState<number | 'all'>('all');
  const { save, problem } = useLocalSave();
  const prepare = usePrepareDesk(eventId, sessionId, userId);
  const online = useOnline();
  const data = useLiveQuery(async () => {
    const targets = (await localDb().targets.where('userId').equals(userId).toArray())
      .filter((t) => t.session.id === sessionId)
      .sort((a, b) => a.targetNumber - b.targetNumber);
    const { ends, rejected } = await loadSessionEnds(localDb(), sessionId, userId, targets);
    return {
      targets,
      items: deskItems(targets, ends, (t, entryId, endIndex) => endKeyOf(t.session.id, entryId, endIndex)),
      rejected,
    };
  }, [sessionId, userId]);

  if (!data) return <p>Opening the judge desk…</p>;
  const items = data.items.filter((i) => targetFilter === 'all' || i.target.targetNumber === targetFilter);
  const ready = items.filter((i) => i.kind === 'to-sign');
  const first = data.targets[0];
  return (
    <div className="space-y-4">
      {data.targets.length === 0 ? (
        <Notice tone="info">
          Load this session's targets onto the phone first; the desk then works without signal.
        </Notice>
      ) : (
        <p className="text-base">
          {data.targets.length} targets on this phone.{' '}
          {first && `${first.event.name} · ${first.session.name}.`}
        </p>
      )}
      <Button
        variant={data.targets.length ? 'secondary' : 'primary'}
        disabled={!online || prepare.isPending}
        onClick={() => prepare.mutate()}
      >
        {prepare.isPending
          ? 'Loading targets…'
          : data.targets.length
            ? 'Reload the targets'
            : 'Load the targets for offline work'}
      </Button>
      {prepare.error && <Notice tone="error">{prepare.error.message}</Notice>}
      {first && <Rejections rows={data.rejected} target={first} />}

      <label className="block">
        <span className="block font-bold" aria-hidden="true">
          Target
        </span>
        <select
          aria-label="Target"
          value={targetFilter}
          onChange={(e) => setTargetFilter(e.target.value === 'all' ? 'all' : Number(e.target.value))}
          className="surface min-h-14 w-full rounded-lg border-2 border-line bg-card px-3 text-lg"
        >
          <option value="all">All targets</option>
          {data.targets.map((t) => (
            <option key={t.key} value={t.targetNumber}>
              Target {t.targetNumber}
            </option>
          ))}
        </select>
      </label>

      {targetFilter !== 'all' && (
        <TargetGroup eventId={eventId} sessionId={sessionId} targetNumber={targetFilter} />
      )}
      {ready.length > 1 && (
        <Button className="w-full" onClick={() => save(() => sign(userId, ready))}>
          ✍ Sign all {ready.length} ready ends{targetFilter === 'all' ? '' : ` of target ${targetFilter}`}
        </Button>
      )}
      {problem && <Notice tone="error">{problem}</Notice>}
      {items.length === 0 ? (
        <p>
          Nothing waits for a judge{targetFilter === 'all' ? '' : ' on this target'}. Disputes, incidents and
          ends to sign appear here as phones sync.
        </p>
      ) : (
        <ul className="space-y-3">
          {items.map((item) => (
            <DeskItemCard
              key={`${item.target.key}-${item.archerIndex}-${item.endIndex}`}
              item={item}
              eventId={eventId}
              userId={userId}
            />
          ))}
        </ul>
      )}
      <ShootOffsLink eventId={eventId} />
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

function SessionPicker({ eventId }: { eventId: number }) {
  const summary = useEventSummary(eventId);
  if (summary.isPending) return <p>Loading the event…</p>;
  if (summary.error) return <Notice tone="error">{summary.error.message}</Notice>;
  return (
    <ul className="space-y-2">
      <li>
        <ShootOffsLink eventId={eventId} />
      </li>
      {summary.data.sessions.map((s) => (
        <li key={s.id}>
          <Link
            to={`/desk/${eventId}/${s.id}`}
            className="surface flex min-h-16 items-center rounded-xl border-2 border-ink bg-card p-3 text-xl font-bold"
          >
            {s.name} ▸
          </Link>
        </li>
      ))}
    </ul>
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
