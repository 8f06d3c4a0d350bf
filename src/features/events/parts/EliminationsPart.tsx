import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import type { Division, EventSummary } from '../../../contract/events';
import type { BracketDto, MatchDto } from '../../../contract/matches';
import type { MatchFormat, Side } from '../../../core';
import { useEventBrackets } from '../../../api/eventBrackets';
import { matchStatus, roundName } from '../../../ui/bracketLabels';
import { Button } from '../../../ui/Button';
import { Field } from '../../../ui/Field';
import { Notice } from '../../../ui/Notice';
import { SelectField } from '../../../ui/SelectField';
import { useCreateBracket } from '../api/createBracket';
import { usePlaceMatch } from '../api/placeMatch';
import { useRecordWalkover } from '../api/recordWalkover';
import { useMatchJoinCodes } from '../api/matchJoinCodes';
import { BracketAlternation } from './BracketAlternation';
import { MatchScorers } from './MatchScorers';

const SIZES = ['8', '16', '32', '64', 'everyone'] as const;
const FORMAT_NAMES: Record<MatchFormat, string> = {
  sets: 'Set system (3 arrows a set, first to 6 set points)',
  cumulative: 'Cumulative (5 ends of 3 arrows, highest total)',
};
const defaultFormat = (d: Division): MatchFormat => (d.bowStyle === 'compound' ? 'cumulative' : 'sets');

const names = (m: MatchDto, side: Side) => {
  const s = m.sides[side];
  return s ? `${s.archers.map((a) => a.name).join(', ')} (${s.seed})` : 'to be decided';
};

/** The organizer's eliminations: a bracket per division, then each open match placed on a target or decided by a walkover. */
export function EliminationsPart({ summary }: { summary: EventSummary }) {
  const eventId = summary.event.id;
  const query = useEventBrackets(eventId);
  if (!query.data)
    return query.isError ? <Notice tone="error">{query.error.message}</Notice> : <p>Loading the brackets…</p>;
  const brackets = query.data.brackets;
  return (
    <div className="space-y-4">
      <p>
        Once a division’s standings are final, create its bracket here. Judges score the matches from the
        judge desk; everyone follows them on the{' '}
        <Link
          to={`/results/${eventId}/brackets`}
          className="inline-flex min-h-12 items-center font-bold underline"
        >
          Eliminations page
        </Link>
        .
      </p>
      {summary.divisions.length === 0 && <p>Add divisions first: each division gets its own bracket.</p>}
      {summary.divisions.map((d) => {
        const bracket = brackets.find((b) => b.divisionId === d.id);
        return (
          <section
            key={d.id}
            aria-labelledby={`eliminations-${d.id}`}
            className="surface space-y-3 rounded-xl border border-line bg-card p-4"
            data-testid={`eliminations-${d.id}`}
          >
            <h2 id={`eliminations-${d.id}`} className="text-2xl font-bold">
              {d.name}
            </h2>
            {bracket ? (
              <BracketMatches eventId={eventId} bracket={bracket} />
            ) : (
              <NewBracket summary={summary} division={d} />
            )}
          </section>
        );
      })}
    </div>
  );
}

function NewBracket({ summary, division }: { summary: EventSummary; division: Division }) {
  const eventId = summary.event.id;
  const sessions = summary.sessions.filter((s) => s.rounds.some((r) => r.divisionId === division.id));
  const [sessionId, setSessionId] = useState(String(sessions.at(-1)?.id ?? ''));
  // A division smaller than the smallest bracket offered goes through whole.
  const [size, setSize] = useState<(typeof SIZES)[number]>(division.entryCount >= 8 ? '8' : 'everyone');
  const [format, setFormat] = useState<MatchFormat>(defaultFormat(division));
  const create = useCreateBracket(eventId);
  if (sessions.length === 0)
    return <p>No session shoots this division yet, so there are no standings to seed from.</p>;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    create.mutate({
      sessionId: Number(sessionId),
      divisionId: division.id,
      size: size === 'everyone' ? 'everyone' : Number(size),
      format,
    });
  };
  return (
    <form onSubmit={submit} className="space-y-3">
      {sessions.length > 1 && (
        <SelectField
          label="Seeded from the standings of"
          value={sessionId}
          onChange={(e) => setSessionId(e.target.value)}
        >
          {sessions.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </SelectField>
      )}
      <SelectField
        label="Archers in the bracket"
        value={size}
        onChange={(e) => setSize(e.target.value as (typeof SIZES)[number])}
      >
        {SIZES.map((s) => (
          <option key={s} value={s}>
            {s === 'everyone' ? 'Everyone who qualified' : `Top ${s}`}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Match format"
        hint={`For ${division.bowStyle} the usual format is the ${defaultFormat(division) === 'sets' ? 'set system' : 'cumulative score'}.`}
        value={format}
        onChange={(e) => setFormat(e.target.value as MatchFormat)}
      >
        {(['sets', 'cumulative'] as const).map((f) => (
          <option key={f} value={f}>
            {FORMAT_NAMES[f]}
          </option>
        ))}
      </SelectField>
      {create.error && (
        <Notice tone="error">
          <span data-testid="bracket-refusal">{create.error.message}</span>
        </Notice>
      )}
      <Button type="submit" disabled={create.isPending}>
        Create the bracket of {division.name}
      </Button>
    </form>
  );
}

function BracketMatches({ eventId, bracket }: { eventId: number; bracket: BracketDto }) {
  const open = bracket.matches.filter((m) => !m.winner && m.sides.a && m.sides.b);
  const codes = useMatchJoinCodes(eventId, open.length > 0, open.length).data?.codes;
  return (
    <div className="space-y-3">
      <p>
        {bracket.entrants} archers, bracket of {bracket.size},{' '}
        {bracket.format === 'sets' ? 'set system' : 'cumulative score'}.
      </p>
      <BracketAlternation eventId={eventId} bracket={bracket} />
      {open.length === 0 ? (
        <p>No match is waiting to be shot: the next round opens as matches are signed.</p>
      ) : (
        <ol className="space-y-3">
          {open.map((m) => (
            <OpenMatch
              key={m.id}
              eventId={eventId}
              match={m}
              rounds={bracket.rounds}
              code={codes?.find((c) => c.matchId === m.id)?.code}
            />
          ))}
        </ol>
      )}
    </div>
  );
}

function OpenMatch({
  eventId,
  match,
  rounds,
  code,
}: {
  eventId: number;
  match: MatchDto;
  rounds: number;
  code: string | undefined;
}) {
  const [target, setTarget] = useState(match.targetNumber === null ? '' : String(match.targetNumber));
  const [side, setSide] = useState<Side>('b');
  const [reason, setReason] = useState<'withdrawal' | 'no-show'>('no-show');
  const place = usePlaceMatch(eventId);
  const walkover = useRecordWalkover(eventId);
  const title = `${match.bronze ? 'Bronze match' : roundName(match.round, rounds)}, match ${match.slot + 1}`;
  const error = place.error ?? walkover.error;
  const placeIt = (e: FormEvent) => {
    e.preventDefault();
    place.mutate({ matchId: match.id, targetNumber: target.trim() ? Number(target) : null });
  };
  return (
    <li className="space-y-2 border-t border-line pt-3" data-testid={`open-match-${match.id}`}>
      <h3 className="text-xl font-bold">{title}</h3>
      <p>
        {names(match, 'a')} against {names(match, 'b')}
      </p>
      <p className="text-ink-soft">
        {matchStatus(match)} ·{' '}
        {match.targetNumber === null ? 'no target yet' : `on target ${match.targetNumber}`}
      </p>
      {code && (
        <p data-testid={`match-code-${match.id}`}>
          Join code for the match’s two writers (its archers, on “Join your match”):{' '}
          <span className="font-mono text-xl font-bold tracking-widest">{code}</span>
        </p>
      )}
      <form onSubmit={placeIt} className="flex flex-wrap items-end gap-2">
        <Field
          label={`Target for ${title}`}
          inputMode="numeric"
          value={target}
          onChange={(e) => setTarget(e.target.value.replace(/\D/g, ''))}
          className="w-40"
        />
        <Button type="submit" variant="secondary" disabled={place.isPending}>
          {match.targetNumber === null ? 'Place on target' : 'Move'}
        </Button>
      </form>
      <details>
        <summary className="min-h-12 cursor-pointer py-3 font-bold">Withdrawal or no-show</summary>
        <div className="space-y-2">
          <SelectField
            label="Who does not shoot"
            value={side}
            onChange={(e) => setSide(e.target.value as Side)}
          >
            <option value="a">{names(match, 'a')}</option>
            <option value="b">{names(match, 'b')}</option>
          </SelectField>
          <SelectField
            label="Why"
            value={reason}
            onChange={(e) => setReason(e.target.value as 'withdrawal' | 'no-show')}
          >
            <option value="no-show">No-show</option>
            <option value="withdrawal">Withdrawal</option>
          </SelectField>
          <Button
            variant="danger"
            disabled={walkover.isPending}
            onClick={() => walkover.mutate({ matchId: match.id, side, reason })}
          >
            Record it: {names(match, side === 'a' ? 'b' : 'a')} goes through
          </Button>
        </div>
      </details>
      <MatchScorers eventId={eventId} match={match} names={(s) => names(match, s)} />
      {error && <Notice tone="error">{error.message}</Notice>}
    </li>
  );
}
