import { Link, useParams } from 'react-router-dom';
import { useEventBrackets } from '../../api/eventBrackets';
import { matchStatus, roundName } from '../../ui/bracketLabels';
import { Notice } from '../../ui/Notice';
import { SyncLine } from '../../ui/scorecard/SyncLine';
import { JudgeOnly } from './JudgeOnly';

const sideName = (s: { archers: { name: string }[]; seed: number } | undefined) =>
  s ? `${s.archers.map((a) => a.name).join(', ')} (${s.seed})` : 'to be decided';

function OpenMatches({ eventId }: { eventId: number }) {
  const query = useEventBrackets(eventId);
  if (!query.data)
    return query.isError ? (
      <Notice tone="error">
        {query.error.message} Open this screen once with signal to see the matches.
      </Notice>
    ) : (
      <p>Loading the matches…</p>
    );
  const open = query.data.brackets.flatMap((b) =>
    b.matches.filter((m) => !m.winner && m.sides.a && m.sides.b).map((m) => ({ bracket: b, match: m })),
  );
  if (open.length === 0)
    return (
      <p>
        No match is waiting for a judge. The organizer creates the brackets on the event screen once the
        standings are final.
      </p>
    );
  return (
    <ul className="space-y-2">
      {open.map(({ bracket, match }) => (
        <li key={match.id}>
          <Link
            to={`/desk/${eventId}/matches/${match.id}`}
            className="surface block min-h-16 rounded-xl border-2 border-ink bg-card p-3"
            data-testid={`desk-match-${match.id}`}
          >
            <span className="block text-xl font-bold">
              {match.targetNumber !== null ? `Target ${match.targetNumber} · ` : ''}
              {bracket.divisionName} ·{' '}
              {match.bronze ? 'Bronze match' : roundName(match.round, bracket.rounds)}
            </span>
            <span className="block">
              {sideName(match.sides.a)} against {sideName(match.sides.b)}
            </span>
            <span className="block text-ink-soft">{matchStatus(match)} ▸</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}

/** The judge's open matches of the event, each opening its match card. */
export function MatchesScreen() {
  const eventId = Number(useParams().eventId);
  return (
    <div className="space-y-4">
      <h1 className="text-3xl font-bold">Matches</h1>
      <Link to={`/desk/${eventId}`} className="inline-flex min-h-12 items-center font-bold underline">
        ◂ Judge desk
      </Link>
      <JudgeOnly eventId={eventId} only="Only the event's judges score matches.">
        {() => <OpenMatches eventId={eventId} />}
      </JudgeOnly>
      <SyncLine />
    </div>
  );
}
