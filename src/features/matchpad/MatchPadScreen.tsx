import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { useLiveQuery } from 'dexie-react-hooks';
import { ARROW_VALUES, type ArrowValue, type MatchFormat } from '../../core';
import { endTitle, endWord } from '../../ui/match/endWord';
import type { MatchDto } from '../../contract/matches';
import { RequireSignIn } from '../../account/RequireSignIn';
import { localDb, matchPadKeyOf, type JoinedMatch } from '../../local/db';
import { chosenFirstShooter } from '../../local/firstShooter';
import { matchCard } from '../../local/matchCard';
import { matchPadView, type MatchPadView, type WriterEndStatus } from '../../local/matchPadView';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import { useLocalSave } from '../../local/useLocalSave';
import { countersignedLine } from '../../ui/bracketLabels';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { addInOrder, alternateOrder, asksWhoShootsFirst, undoInOrder } from '../../ui/match/alternateEntry';
import { ArrowTurn, WhoShootsFirst } from '../../ui/match/ShootingOrder';
import {
  ARROWS,
  DraftLines,
  EndsTable,
  nameOf,
  Panel,
  Scoreline,
  type Draft,
} from '../../ui/match/MatchCardParts';
import { ArrowKeypad } from '../../ui/scorecard/ArrowKeypad';
import { RefusedNotice } from '../../ui/scorecard/RefusedNotice';
import { SyncLine } from '../../ui/scorecard/SyncLine';
import { SafetyNote } from '../../ui/SafetyNote';
import { useMatchPadRefresh } from './api/matchPad';

const STATUS_WORDS: Record<WriterEndStatus, string> = {
  counted: '✓ Both writers agree: it counts',
  judge: '✓ Settled by the judge',
  waiting: 'Waiting for the other writer',
  mismatch: '▲ The writers differ: sent to the judge',
  stopped: 'Agreed: it counts once the ends before it count',
};

function YourEnds({ match, view, format }: { match: MatchDto; view: MatchPadView; format: MatchFormat }) {
  const written = view.ends.flatMap((e, i) => (e && i !== view.current ? [{ e, i }] : []));
  if (written.length === 0) return null;
  return (
    <Panel id="your-ends" title={`Your ${endWord(format)}s`} testId="writer-ends">
      <ul className="space-y-2">
        {written.map(({ e, i }) => (
          <li key={i} data-testid={`writer-end-${i + 1}`} className="border-b border-line pb-1">
            <span className="font-bold">{endTitle(format, i)}:</span> {nameOf(match, 'a')} {e.a.join(' ')} ·{' '}
            {nameOf(match, 'b')} {e.b.join(' ')}
            <span className="block font-bold">
              {STATUS_WORDS[e.status]}
              {e.signed && ' · signed by the judge'}
              {e.waiting && ' · ▲ waiting to sync'}
            </span>
          </li>
        ))}
      </ul>
    </Panel>
  );
}

function MatchOverPanel({
  pad,
  view,
  onCountersign,
}: {
  pad: JoinedMatch;
  view: MatchPadView;
  onCountersign: () => void;
}) {
  const { match } = pad;
  const winner = match.winner ?? match.state?.winner;
  if (!winner) return null;
  const loser = winner === 'a' ? 'b' : 'a';
  const countersigned = countersignedLine(match);
  return (
    <Panel id="match-over" title="◆ Match over" testId="match-over" strong>
      <p className="text-xl">
        <span className="font-bold">{nameOf(match, winner)}</span> wins {match.state?.score[winner]}–
        {match.state?.score[loser]}
        {match.state?.shootOff ? ' in the shoot-off' : ''}.
      </p>
      {!match.signedAt ? (
        <p>Waiting for the judge’s signature; then both archers countersign.</p>
      ) : (
        <p className="font-bold" data-testid="judge-signed">
          ✓ The judge signed the match card.
        </p>
      )}
      {countersigned && <p data-testid="countersigned-by">{countersigned}</p>}
      {match.signedAt &&
        pad.ownEntryId !== null &&
        (view.countersigned === 'server' ? (
          <p className="font-bold">✓ You countersigned.</p>
        ) : view.countersigned === 'waiting' ? (
          <p className="font-bold">▲ Countersigned on this phone, waiting to reach the event server.</p>
        ) : (
          <Button onClick={onCountersign}>Countersign the match card</Button>
        ))}
    </Panel>
  );
}

/** After a complete end, the next one (empty) is where the next tap goes. */
const typedOrNext = (d: Draft): Draft =>
  d.a.length === ARROWS && d.b.length === ARROWS ? { endIndex: d.endIndex + 1, a: [], b: [] } : d;

function MatchPad({ pad, userId }: { pad: JoinedMatch; userId: number }) {
  const rows = useLiveQuery(
    () =>
      localDb()
        .outbox.where('userId')
        .equals(userId)
        .filter((r) => 'matchId' in r.args && r.args.matchId === pad.matchId)
        .toArray(),
    [userId, pad.matchId],
  );
  const { save: saveLocal, problem } = useLocalSave();
  const [typed, setTyped] = useState<Draft | null>(null);
  const { match, format } = pad;
  const view = matchPadView(pad, rows ?? []);
  // The score from the ends that count with this phone's writes laid over: a changed end leaves it at once.
  const card = matchCard({ ...match, ends: view.counted }, format, []);
  const ref = { eventId: pad.eventId, matchId: match.id };
  const store = (change: Parameters<typeof recordChange>[2]) =>
    saveLocal(async () => {
      await recordChange(localDb(), userId, change);
      syncLoop().kick();
    });
  const endOf = (i: number): Draft => ({ endIndex: i, a: view.ends[i]?.a ?? [], b: view.ends[i]?.b ?? [] });
  const write = (d: Draft) => {
    setTyped(d);
    store({ kind: 'match.write', args: { ...ref, endIndex: d.endIndex, a: d.a, b: d.b } });
  };
  const stored = view.current !== null ? endOf(view.current) : null;
  // The last tap's end until the stored view catches up: taps quicker than the database never build on an older end.
  const current = stored && typed && typed.endIndex >= stored.endIndex ? typedOrNext(typed) : stored;
  // Shot alternately: the order follows this writer's own ends before the one being written.
  const first = chosenFirstShooter(match, rows ?? []);
  const before = Array.from({ length: current?.endIndex ?? 0 }, (_, i) =>
    typed?.endIndex === i ? typed : view.ends[i]!,
  );
  const order = current && alternateOrder(match, format, before, first?.side ?? null);
  const chooseFirst = (side: 'a' | 'b') => store({ kind: 'match.firstShooter', args: { ...ref, side } });
  return (
    <div className="space-y-4">
      <p className="text-xl">
        {pad.divisionName} · {pad.roundName}
        {match.targetNumber !== null && ` · target ${match.targetNumber}`} ·{' '}
        {format === 'sets' ? 'set system' : 'cumulative'} · you are writer {pad.slot}
      </p>
      <RefusedNotice rows={rows ?? []} save={saveLocal} />
      {problem && <Notice tone="error">{problem}</Notice>}
      <Scoreline match={match} card={card} format={format} />
      <EndsTable match={match} card={card} format={format} />
      {current && (
        <Panel id="end-entry" title={endTitle(format, current.endIndex)} testId="writer-entry">
          <DraftLines match={match} draft={current} per={ARROWS} />
          {asksWhoShootsFirst(match, first?.side ?? null, current) ? (
            <WhoShootsFirst match={match} onChoose={chooseFirst} />
          ) : (
            <>
              <ArrowTurn match={match} order={order} draft={current} first={first} onChoose={chooseFirst} />
              <ArrowKeypad
                allowed={ARROW_VALUES}
                onValues={(values: ArrowValue[]) => write(addInOrder(current, values, order))}
                onUndo={() => {
                  if (current.a.length + current.b.length > 0) write(undoInOrder(current, order));
                  else if (view.undoEnd !== null) {
                    const previous = view.ends.slice(0, view.undoEnd);
                    write(
                      undoInOrder(
                        endOf(view.undoEnd),
                        alternateOrder(match, format, previous, first?.side ?? null),
                      ),
                    );
                  }
                }}
                canUndo={current.a.length + current.b.length > 0 || view.undoEnd !== null}
              />
            </>
          )}
        </Panel>
      )}
      <YourEnds match={match} view={view} format={format} />
      {(match.state?.next === 'shoot-off' || match.state?.next === 'judge') && (
        <Notice tone="info">Shoot-off: one arrow each. The judge records it on the match card.</Notice>
      )}
      <MatchOverPanel
        pad={pad}
        view={view}
        onCountersign={() => store({ kind: 'match.countersign', args: ref })}
      />
    </div>
  );
}

function MatchPadPanel({ eventId, matchId, userId }: { eventId: number; matchId: number; userId: number }) {
  const refresh = useMatchPadRefresh(eventId, matchId, userId);
  const pad = useLiveQuery(() => localDb().matchPads.get(matchPadKeyOf(userId, matchId)), [userId, matchId]);
  if (pad) return <MatchPad pad={pad} userId={userId} />;
  if (refresh.isError) return <Notice tone="error">{refresh.error.message}</Notice>;
  return <p>Loading the match…</p>;
}

/** A writer's pad for one match: both archers' arrows each end, cross-checked with the other writer. */
export function MatchPadScreen() {
  const params = useParams();
  const eventId = Number(params.eventId);
  const matchId = Number(params.matchId);
  return (
    <div className="space-y-4">
      <h1 className="text-3xl font-bold">Match pad</h1>
      <SafetyNote compact />
      <RequireSignIn>
        {(me) => <MatchPadPanel eventId={eventId} matchId={matchId} userId={me.user.id} />}
      </RequireSignIn>
      <SyncLine />
    </div>
  );
}
