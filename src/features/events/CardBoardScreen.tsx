import { Link } from 'react-router-dom';
import type { CardBoard } from '../../contract/cardBoard';
import type { SessionCardItem } from '../../contract/judging';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { OrganizerSessionScreen } from './components/OrganizerSessionScreen';
import { useCardBoard, useSendCardAgain } from '../../api/cardBoard';

const when = (iso: string) =>
  new Date(iso).toLocaleString([], { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

/** A card's state in words, furthest step first: mailed, final, countersigned, ends signed, open ends. */
function cardState(c: SessionCardItem): string {
  if (c.final) return c.mailedAt ? `✓ Final · mailed ${when(c.mailedAt)}` : '✓ Final · not mailed';
  if (c.archerSigned || c.scorerSigned)
    return `✍ Countersigned by the ${c.archerSigned ? 'archer' : 'scorer'}; the ${c.archerSigned ? 'scorer' : 'archer'} has not signed`;
  if (c.needsPaperCountersign)
    return '▲ Every end signed; the archer countersigns on paper (a judge records it)';
  if (c.signedEnds === c.totalEnds) return '✍ Every end signed; waiting for the countersignatures';
  return `○ ${c.totalEnds - c.signedEnds} open ends · ${c.signedEnds} signed`;
}

function SendAgain({ eventId, board, card }: { eventId: number; board: CardBoard; card: SessionCardItem }) {
  const send = useSendCardAgain(eventId, board.sessionId);
  return (
    <div className="space-y-1">
      <Button variant="secondary" disabled={send.isPending} onClick={() => send.mutate(card.entryId)}>
        {send.isPending ? 'Sending…' : `Send the final card again to ${card.name}`}
      </Button>
      {send.data && <Notice tone="success">Sent to {send.data.sentTo}.</Notice>}
      {send.error && <Notice tone="error">{send.error.message}</Notice>}
    </div>
  );
}

function Targets({ board }: { board: CardBoard }) {
  const behind = board.targets.filter((t) => t.behindBy > 0);
  return (
    <section aria-labelledby="behind" className="space-y-2">
      <h2 id="behind" className="text-2xl font-bold">
        Targets behind
      </h2>
      {behind.length === 0 ? (
        <p>
          <span aria-hidden="true">✓ </span>No target is behind: every one has {board.leadingEnds} ends in.
        </p>
      ) : (
        <ul className="space-y-1" data-testid="targets-behind">
          {behind.map((t) => (
            <li key={t.targetNumber} className="font-bold">
              <span aria-hidden="true">▲ </span>Target {t.targetNumber}: {t.endsIn} ends in,{' '}
              {t.behindBy === 1 ? '1 end' : `${t.behindBy} ends`} behind
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function Board({ eventId, sessionId }: { eventId: number; sessionId: number }) {
  const board = useCardBoard(eventId, sessionId);
  if (board.isPending) return <p>Loading the cards…</p>;
  if (board.error) return <Notice tone="error">{board.error.message}</Notice>;
  const b = board.data;
  const final = b.cards.filter((c) => c.final).length;
  return (
    <div className="space-y-5">
      <header>
        <Link
          to={`/events/${eventId}/sessions/${sessionId}/targets`}
          className="inline-flex min-h-12 items-center font-bold underline"
        >
          ← Targets of {b.sessionName}
        </Link>
        <h1 className="text-3xl font-bold leading-tight">Card board · {b.sessionName}</h1>
        <p>
          {final} of {b.cards.length} cards final · the furthest target has {b.leadingEnds} ends in.
        </p>
      </header>
      <Targets board={b} />
      <section aria-labelledby="cards" className="space-y-2">
        <h2 id="cards" className="text-2xl font-bold">
          Cards
        </h2>
        <ul className="space-y-2">
          {b.cards.map((c) => (
            <li
              key={c.entryId}
              className="surface space-y-2 rounded-lg border border-line bg-card p-3"
              data-testid={`board-card-${c.entryId}`}
            >
              <p>
                <strong>
                  {c.targetNumber}
                  {c.position} · {c.name}
                </strong>{' '}
                · {c.division}
                <span className="block">
                  {c.endsWithValues} of {c.totalEnds} ends in · {c.signedEnds} signed by a judge · total{' '}
                  {c.total}
                </span>
                <span className="block font-bold">{cardState(c)}</span>
              </p>
              {c.final && <SendAgain eventId={eventId} board={b} card={c} />}
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}

/** The organizer's view of every card of a session: what is missing, which targets lag, mail sent. */
export function CardBoardScreen() {
  return (
    <OrganizerSessionScreen>
      {(summary, sessionId) => <Board eventId={summary.event.id} sessionId={sessionId} />}
    </OrganizerSessionScreen>
  );
}
