import { useEffect, useRef, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useLiveQuery } from 'dexie-react-hooks';
import { ARROW_VALUES, type ArrowValue } from '../../core';
import type { ShootOffRecordArgs } from '../../contract/results';
import { localDb, type OutboxRow } from '../../local/db';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import { useLocalSave } from '../../local/useLocalSave';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { ArrowKeypad } from '../../ui/scorecard/ArrowKeypad';
import { SyncLine } from '../../ui/scorecard/SyncLine';
import { RefusedNotice } from '../../ui/scorecard/RefusedNotice';
import { JudgeOnly } from './JudgeOnly';
import { useEventResults } from '../../api/eventResults';
import {
  equalAt,
  shootOffGroups,
  type KnownArrow,
  type ShootOffArcher,
  type ShootOffGroup,
} from './shootOffGroups';

type RecordArrow = (args: ShootOffRecordArgs) => void;

function arrowText(a: KnownArrow): string {
  const how = a.distanceMm !== undefined ? ` · ${a.distanceMm} mm` : a.closer ? ' · closer' : '';
  return `${a.value}${how}`;
}

/** For equal values: the measured distance from the centre, or the judge's "closer" without a measure. */
function Measure({
  archer,
  arrowIndex,
  sessionId,
  onRecord,
}: {
  archer: ShootOffArcher;
  arrowIndex: number;
  sessionId: number;
  onRecord: RecordArrow;
}) {
  const [mm, setMm] = useState('');
  const arrow = archer.arrows[arrowIndex]!;
  const distance = Number(mm.replace(',', '.'));
  const valid = mm.trim() !== '' && Number.isFinite(distance) && distance >= 0 && distance <= 1000;
  const base = { sessionId, entryId: archer.entryId, arrowIndex, value: arrow.value };
  return (
    <div className="space-y-2 rounded-lg border border-line p-2">
      <label className="block">
        <span className="block font-bold">
          {archer.name}, arrow {arrowIndex + 1}: distance from the centre (mm)
        </span>
        <input
          inputMode="decimal"
          value={mm}
          onChange={(e) => setMm(e.target.value)}
          className="surface min-h-14 w-full rounded-lg border-2 border-line bg-card px-3 text-2xl"
        />
      </label>
      <div className="flex flex-wrap gap-2">
        <Button disabled={!valid} onClick={() => onRecord({ ...base, distanceMm: distance, closer: false })}>
          Save distance
        </Button>
        <Button variant="secondary" onClick={() => onRecord({ ...base, closer: true })}>
          {archer.name} was closer
        </Button>
      </div>
    </div>
  );
}

function ArcherRow({
  archer,
  group,
  onPick,
  onRecord,
}: {
  archer: ShootOffArcher;
  group: ShootOffGroup;
  onPick: () => void;
  onRecord: RecordArrow;
}) {
  const last = archer.arrows.length - 1;
  const lastArrow = archer.arrows[last];
  // The latest arrow matches another's value and nothing tells them apart yet.
  const measure =
    lastArrow &&
    equalAt(group, last).has(archer.entryId) &&
    lastArrow.distanceMm === undefined &&
    !lastArrow.closer;
  return (
    <li
      className="space-y-2 border-t border-line pt-2"
      data-testid={`shootoff-${group.sessionId}-${archer.entryId}`}
    >
      <p className="text-xl">
        <span className="font-bold" data-testid="shootoff-place">
          {archer.place}.
        </span>{' '}
        {archer.name} · target {archer.targetNumber}
        {archer.level && <span className="font-bold text-brick"> · ▲ still level</span>}
      </p>
      {archer.arrows.length > 0 && (
        <ol className="flex flex-wrap gap-2">
          {archer.arrows.map((a, i) => (
            <li
              key={i}
              className="rounded-lg border-2 border-line px-2 py-1"
              data-testid={`shootoff-arrow-${i + 1}`}
            >
              Arrow {i + 1}: <span className="font-bold">{arrowText(a)}</span>{' '}
              {a.state === 'waiting' ? '▲ waiting to sync' : '✓ synced'}
            </li>
          ))}
        </ol>
      )}
      {measure && (
        <Measure archer={archer} arrowIndex={last} sessionId={group.sessionId} onRecord={onRecord} />
      )}
      {archer.level && archer.arrows.length <= group.nextArrow && (
        <Button variant="secondary" onClick={onPick}>
          Record arrow {group.nextArrow + 1} of {archer.name}
        </Button>
      )}
    </li>
  );
}

function GroupCard({ group, onRecord }: { group: ShootOffGroup; onRecord: RecordArrow }) {
  const [picked, setPicked] = useState<ShootOffArcher>();
  const headingId = `shootoff-group-${group.key.replaceAll(':', '-')}`;
  const keyFor = (value: ArrowValue, archer: ShootOffArcher) =>
    onRecord({
      sessionId: group.sessionId,
      entryId: archer.entryId,
      arrowIndex: group.nextArrow,
      value,
      closer: false,
    });
  return (
    <section
      aria-labelledby={headingId}
      className="surface space-y-2 rounded-xl border-2 border-line bg-card p-3"
      data-testid={`shootoff-group-${group.key}`}
    >
      <h2 id={headingId} className="text-xl font-bold">
        {group.divisionName} · total {group.total} · {group.sessionName}
      </h2>
      <p>
        {group.settled
          ? '◆ Settled by the shoot-off.'
          : `▲ Shoot-off: arrow ${group.nextArrow + 1} for archers still level.`}
      </p>
      <ol className="space-y-2">
        {group.archers.map((a) => (
          <ArcherRow
            key={a.entryId}
            archer={a}
            group={group}
            onPick={() => setPicked(a)}
            onRecord={onRecord}
          />
        ))}
      </ol>
      {picked && (
        <div className="space-y-2" data-testid="shootoff-keys">
          <p className="text-xl font-bold">
            Arrow {group.nextArrow + 1} of {picked.name}
          </p>
          <ArrowKeypad
            allowed={ARROW_VALUES}
            onValues={([value]) => {
              if (value) keyFor(value, picked);
              setPicked(undefined);
            }}
            onUndo={() => setPicked(undefined)}
            canUndo={false}
          />
          <Button variant="secondary" onClick={() => setPicked(undefined)}>
            Cancel
          </Button>
        </div>
      )}
    </section>
  );
}

/** This judge's shoot-off changes on this phone, waiting, delivered or refused. */
const ownShootOffs = (userId: number): Promise<OutboxRow[]> =>
  localDb()
    .outbox.where('userId')
    .equals(userId)
    .filter((r) => r.kind === 'shootoff.record')
    .toArray();

function ShootOffs({ eventId, userId }: { eventId: number; userId: number }) {
  const results = useEventResults(eventId);
  const changes = useLiveQuery(() => ownShootOffs(userId), [userId]);
  const { save, problem } = useLocalSave();
  const waiting = changes?.filter((c) => c.status === 'pending').length ?? 0;
  const wasWaiting = useRef(waiting);
  const { refetch } = results;
  // Once this phone's arrows have reached the server, its standings are asked for again.
  useEffect(() => {
    if (waiting < wasWaiting.current) void refetch();
    wasWaiting.current = waiting;
  }, [waiting, refetch]);

  if (!results.data) {
    return results.error ? (
      <Notice tone="error">{results.error.message} Open this screen once with signal to see the ties.</Notice>
    ) : (
      <p>Loading the standings…</p>
    );
  }
  const groups = shootOffGroups(results.data.results, changes ?? []);
  const record: RecordArrow = (args) =>
    save(async () => {
      await recordChange(localDb(), userId, { kind: 'shootoff.record', args });
      syncLoop().kick();
    });
  return (
    <div className="space-y-4">
      <p className="text-base" data-testid="shootoffs-as-of">
        Standings as of {new Date(results.data.results.computedAt).toLocaleTimeString()}; arrows recorded here
        are kept on this phone until they reach the event server.
      </p>
      <RefusedNotice rows={changes ?? []} save={save} />
      {problem && <Notice tone="error">{problem}</Notice>}
      {groups.length === 0 ? (
        <p>No tie waits for a shoot-off in this event.</p>
      ) : (
        groups.map((g) => <GroupCard key={g.key} group={g} onRecord={record} />)
      )}
      <SyncLine />
    </div>
  );
}

/** The judge's shoot-offs: ties that decide the cut or a medal, recorded arrow by arrow on the field. */
export function ShootOffsScreen() {
  const eventId = Number(useParams().eventId);
  return (
    <div className="space-y-4">
      <h1 className="text-3xl font-bold">Shoot-offs</h1>
      <Link to={`/desk/${eventId}`} className="inline-flex min-h-12 items-center font-bold underline">
        ◂ Judge desk
      </Link>
      <JudgeOnly eventId={eventId} only="Only the event's judges record shoot-offs.">
        {(userId) => <ShootOffs eventId={eventId} userId={userId} />}
      </JudgeOnly>
    </div>
  );
}
