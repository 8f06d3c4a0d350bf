import { useEffect, useRef, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useLiveQuery } from 'dexie-react-hooks';
import { ARROW_VALUES, arrowPoints, type MatchFormat, type Side } from '../../core';
import type { BracketDto, MatchDto, MatchShootOffArgs } from '../../contract/matches';
import { useEventBrackets } from '../../api/eventBrackets';
import { localDb, type OutboxRow } from '../../local/db';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import { useLocalSave } from '../../local/useLocalSave';
import { countersignedLine, roundName } from '../../ui/bracketLabels';
import { Button } from '../../ui/Button';
import { Field } from '../../ui/Field';
import { Notice } from '../../ui/Notice';
import { ArrowKeypad } from '../../ui/scorecard/ArrowKeypad';
import { SyncLine } from '../../ui/scorecard/SyncLine';
import { SafetyNote } from '../../ui/SafetyNote';
import { RefusedNotice } from '../../ui/scorecard/RefusedNotice';
import { JudgeOnly } from './JudgeOnly';
import { WritersDiffer } from './WritersDiffer';
import { addInOrder, alternateOrder, asksWhoShootsFirst, undoInOrder } from '../../ui/match/alternateEntry';
import { ArrowTurn, WhoShootsFirst } from '../../ui/match/ShootingOrder';
import { endTitle } from '../../ui/match/endWord';
import { chosenFirstShooter } from '../../local/firstShooter';
import { matchCard, matchRowsOf, type MatchCardView } from '../../local/matchCard';
import {
  addValues,
  ARROWS,
  DraftLines,
  EndsTable,
  nameOf,
  Panel,
  Scoreline,
  SIDES,
  undoValue,
  type Draft,
} from '../../ui/match/MatchCardParts';

type Save = (change: Parameters<typeof recordChange>[2]) => void;

/** This judge's match changes on this phone (waiting, delivered or refused). */
const ownMatchRows = (userId: number): Promise<OutboxRow[]> =>
  localDb()
    .outbox.where('userId')
    .equals(userId)
    .filter((r) => r.kind.startsWith('match.'))
    .toArray();

function EndEntry({
  match,
  format,
  card,
  first,
  target,
  draft,
  setDraft,
  save,
}: {
  match: MatchDto;
  format: MatchFormat;
  card: MatchCardView;
  first: ReturnType<typeof chosenFirstShooter>;
  target: { eventId: number; matchId: number };
  draft: Draft;
  setDraft: (d: Draft | undefined) => void;
  save: Save;
}) {
  const complete = draft.a.length === ARROWS && draft.b.length === ARROWS;
  const order = alternateOrder(match, format, card.ends.slice(0, draft.endIndex), first?.side ?? null);
  const chooseFirst = (s: Side) => save({ kind: 'match.firstShooter', args: { ...target, side: s } });
  if (asksWhoShootsFirst(match, first?.side ?? null, card.ends.length === 0 ? draft : null))
    return (
      <Panel id="end-entry" title={endTitle(format, draft.endIndex)}>
        <WhoShootsFirst match={match} onChoose={chooseFirst} />
      </Panel>
    );
  return (
    <Panel id="end-entry" title={endTitle(format, draft.endIndex)}>
      <DraftLines match={match} draft={draft} per={ARROWS} />
      <ArrowTurn match={match} order={order} draft={draft} first={first} onChoose={chooseFirst} />
      <ArrowKeypad
        allowed={ARROW_VALUES}
        disabled={complete}
        onValues={(values) => setDraft(addInOrder(draft, values, order))}
        onUndo={() => setDraft(undoInOrder(draft, order))}
        canUndo={draft.a.length + draft.b.length > 0}
      />
      {complete && (
        <Button
          onClick={() => {
            save({
              kind: 'match.end',
              args: { ...target, endIndex: draft.endIndex, a: draft.a, b: draft.b },
            });
            setDraft(undefined);
          }}
        >
          Save end {draft.endIndex + 1}
        </Button>
      )}
    </Panel>
  );
}

function ShootOffEntry({
  match,
  card,
  target,
  save,
  order,
}: {
  match: MatchDto;
  card: MatchCardView;
  target: { eventId: number; matchId: number };
  save: Save;
  /** The shoot-off's order when the match is shot alternately (the core's rule); null otherwise. */
  order: Side[] | null;
}) {
  const saved =
    card.shootOff.a && card.shootOff.b ? { a: [card.shootOff.a.value], b: [card.shootOff.b.value] } : null;
  const [draft, setDraft] = useState<Draft>({ endIndex: -1, a: saved?.a ?? [], b: saved?.b ?? [] });
  const [mm, setMm] = useState<Record<Side, string>>({ a: '', b: '' });
  const complete = draft.a.length === 1 && draft.b.length === 1;
  const level = complete && arrowPoints(draft.a[0]!) === arrowPoints(draft.b[0]!);
  const record = (how: Partial<Record<Side, { distanceMm?: number; closer?: boolean }>>) => {
    const args: MatchShootOffArgs = {
      ...target,
      a: {
        value: draft.a[0]!,
        closer: how.a?.closer ?? false,
        ...(how.a?.distanceMm !== undefined ? { distanceMm: how.a.distanceMm } : {}),
      },
      b: {
        value: draft.b[0]!,
        closer: how.b?.closer ?? false,
        ...(how.b?.distanceMm !== undefined ? { distanceMm: how.b.distanceMm } : {}),
      },
    };
    save({ kind: 'match.shootoff', args });
  };
  const distance = (side: Side) => Number(mm[side].replace(',', '.'));
  const measured = SIDES.every(
    (s) => mm[s].trim() !== '' && Number.isFinite(distance(s)) && distance(s) >= 0 && distance(s) <= 1000,
  );
  return (
    <Panel id="shoot-off" title="Shoot-off: one arrow each" testId="match-shoot-off">
      {card.state?.next === 'judge' && (
        <p className="font-bold">
          ▲ The arrows are level: measure them, or say which one is closer to the centre.
        </p>
      )}
      {order && (
        <p data-testid="shoot-off-first">
          <span className="font-bold">{nameOf(match, order[0]!)}</span> shoots first.
        </p>
      )}
      <DraftLines match={match} draft={draft} per={1} />
      {!complete && (
        <ArrowKeypad
          allowed={ARROW_VALUES}
          onValues={(values) => setDraft(addValues(draft, values, 1))}
          onUndo={() => setDraft(undoValue(draft))}
          canUndo={draft.a.length + draft.b.length > 0}
        />
      )}
      {complete && (
        <Button variant="secondary" onClick={() => setDraft({ endIndex: -1, a: [], b: [] })}>
          Enter the arrows again
        </Button>
      )}
      {complete && !level && <Button onClick={() => record({})}>Save the shoot-off</Button>}
      {level && (
        <div className="space-y-2">
          <p>Equal values: the arrow nearer the centre wins.</p>
          {SIDES.map((side) => (
            <Field
              key={side}
              label={`${nameOf(match, side)}: distance from the centre (mm)`}
              inputMode="decimal"
              value={mm[side]}
              onChange={(e) => setMm({ ...mm, [side]: e.target.value })}
            />
          ))}
          <Button
            disabled={!measured}
            onClick={() => record({ a: { distanceMm: distance('a') }, b: { distanceMm: distance('b') } })}
          >
            Save the distances
          </Button>
          <div className="flex flex-wrap gap-2">
            {SIDES.map((side) => (
              <Button key={side} variant="secondary" onClick={() => record({ [side]: { closer: true } })}>
                {nameOf(match, side)} closer
              </Button>
            ))}
          </div>
        </div>
      )}
    </Panel>
  );
}

function MatchOver({
  match,
  card,
  save,
  target,
}: {
  match: MatchDto;
  card: MatchCardView;
  save: Save;
  target: { eventId: number; matchId: number };
}) {
  const state = card.state!;
  const winner = state.winner!;
  const how = state.decidedBy === 'shoot-off' ? ' in the shoot-off' : '';
  return (
    <Panel id="match-over" title="◆ Match over" testId="match-over" strong>
      <p className="text-xl">
        <span className="font-bold">{nameOf(match, winner)}</span> wins {state.score[winner]}–
        {state.score[winner === 'a' ? 'b' : 'a']}
        {how}.
      </p>
      {card.signed === 'server' ? (
        <p className="font-bold" data-testid="match-signed">
          ✓ Signed. The bracket has moved on.
          <span className="block">{countersignedLine(match)}</span>
        </p>
      ) : card.signed === 'waiting' ? (
        <p className="font-bold" data-testid="match-signed">
          ▲ Signed on this phone, waiting to reach the event server.
        </p>
      ) : (
        <Button onClick={() => save({ kind: 'match.sign', args: target })}>Sign the match</Button>
      )}
    </Panel>
  );
}

function MatchCardPanel({
  eventId,
  bracket,
  match,
  userId,
}: {
  eventId: number;
  bracket: BracketDto;
  match: MatchDto;
  userId: number;
}) {
  const rows = useLiveQuery(() => ownMatchRows(userId), [userId]);
  const { save: saveLocal, problem } = useLocalSave();
  const [draft, setDraft] = useState<Draft>();
  const mine = matchRowsOf(rows ?? [], match.id);
  const card = matchCard(match, bracket.format, mine);
  const target = { eventId, matchId: match.id };
  const save: Save = (change) =>
    saveLocal(async () => {
      await recordChange(localDb(), userId, change);
      syncLoop().kick();
    });
  const state = card.state;
  const open = card.signed === null && !match.winner;
  const nextEnd = open && state?.next === 'end' ? card.ends.length : undefined;
  const current = draft ?? (nextEnd !== undefined ? { endIndex: nextEnd, a: [], b: [] } : undefined);
  const shootOff = open && (state?.next === 'shoot-off' || state?.next === 'judge');

  return (
    <div className="space-y-4">
      <p className="text-xl">
        {bracket.divisionName} · {match.bronze ? 'Bronze match' : roundName(match.round, bracket.rounds)}
        {match.targetNumber !== null && ` · target ${match.targetNumber}`} ·{' '}
        {bracket.format === 'sets' ? 'set system' : 'cumulative'}
      </p>
      <RefusedNotice rows={mine} save={saveLocal} />
      {problem && <Notice tone="error">{problem}</Notice>}
      {card.problem && <Notice tone="error">{card.problem}</Notice>}
      <Scoreline match={match} card={card} format={bracket.format} />
      {open && (
        <WritersDiffer
          match={match}
          settle={(end) => save({ kind: 'match.end', args: { ...target, ...end } })}
          enter={(i) => setDraft({ endIndex: i, a: [], b: [] })}
        />
      )}
      <EndsTable
        match={match}
        card={card}
        format={bracket.format}
        onCorrect={open ? (i) => setDraft({ endIndex: i, a: [], b: [] }) : undefined}
        onSign={open ? (i) => save({ kind: 'match.endSign', args: { ...target, endIndex: i } }) : undefined}
      />
      {current && (
        <EndEntry
          match={match}
          format={bracket.format}
          card={card}
          first={chosenFirstShooter(match, mine)}
          target={target}
          draft={current}
          setDraft={setDraft}
          save={save}
        />
      )}
      {!draft && shootOff && (
        <ShootOffEntry
          key={`${card.shootOff.a?.value}:${card.shootOff.b?.value}`}
          match={match}
          card={card}
          target={target}
          save={save}
          order={alternateOrder(
            match,
            bracket.format,
            card.ends,
            chosenFirstShooter(match, mine)?.side ?? null,
          )}
        />
      )}
      {!draft && state?.winner && <MatchOver match={match} card={card} save={save} target={target} />}
    </div>
  );
}

function MatchPanel({ eventId, matchId, userId }: { eventId: number; matchId: number; userId: number }) {
  const query = useEventBrackets(eventId);
  const waiting = useLiveQuery(
    () =>
      localDb()
        .outbox.where('userId')
        .equals(userId)
        .filter((r) => r.status === 'pending' && r.kind.startsWith('match.'))
        .count(),
    [userId],
  );
  const wasWaiting = useRef(waiting ?? 0);
  const { refetch } = query;
  // Once this phone's changes have reached the server, the bracket is asked for again.
  useEffect(() => {
    if (waiting === undefined) return;
    if (waiting < wasWaiting.current) void refetch();
    wasWaiting.current = waiting;
  }, [waiting, refetch]);
  if (!query.data)
    return query.isError ? (
      <Notice tone="error">{query.error.message} Open this screen once with signal to see the match.</Notice>
    ) : (
      <p>Loading the match…</p>
    );
  const bracket = query.data.brackets.find((b) => b.matches.some((m) => m.id === matchId));
  const match = bracket?.matches.find((m) => m.id === matchId);
  if (!bracket || !match) return <Notice tone="error">This match is not in this event’s brackets.</Notice>;
  if (!match.sides.a || !match.sides.b)
    return <p>Both archers of this match are not known yet: earlier matches are still open.</p>;
  return <MatchCardPanel eventId={eventId} bracket={bracket} match={match} userId={userId} />;
}

/** One match on the judge's phone: ends, set points or totals, the shoot-off and the signature, kept on the phone until sent. */
export function MatchScreen() {
  const params = useParams();
  const eventId = Number(params.eventId);
  const matchId = Number(params.matchId);
  return (
    <div className="space-y-4">
      <h1 className="text-3xl font-bold">Match</h1>
      <Link to={`/desk/${eventId}/matches`} className="inline-flex min-h-12 items-center font-bold underline">
        ◂ Matches
      </Link>
      <SafetyNote compact />
      <JudgeOnly eventId={eventId} only="Only the event's judges score matches.">
        {(userId) => <MatchPanel eventId={eventId} matchId={matchId} userId={userId} />}
      </JudgeOnly>
      <SyncLine />
    </div>
  );
}
