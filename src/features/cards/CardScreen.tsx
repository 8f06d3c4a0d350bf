import { Fragment } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useLiveQuery } from 'dexie-react-hooks';
import type { CardSignArgs, CardView } from '../../contract/judging';
import { cardKeyOf, localDb } from '../../local/db';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import { useLocalSave } from '../../local/useLocalSave';
import { RequireSignIn } from '../../account/RequireSignIn';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { RulingHistory } from '../../ui/scorecard/RulingHistory';
import { END_STATE_LABELS } from '../../ui/scorecard/endStateLabel';
import { SyncLine } from '../../ui/scorecard/SyncLine';
import { useCard, useMyCards } from '../../api/card';
import { PlaceLine } from '../../ui/scorecard/PlaceLine';
import { PaperCountersign } from './PaperCountersign';

const CARD_STATE_WORDS: Record<CardView['state'], string> = {
  running: '○ Running',
  countersigned: '✍ Countersigned',
  final: '✓ Final',
};

/** A signature of this card made on this phone (from its outbox row), until the server's card shows it. */
function useOwnSignature(card: CardView, userId: number) {
  const key = `${cardKeyOf(card.session.id, card.archer.entryId)}:card`;
  return useLiveQuery(async () => {
    const rows = await localDb().outbox.where('endKey').equals(key).toArray();
    const row = rows
      .filter((r) => r.userId === userId && r.kind === 'card.sign' && r.status !== 'rejected')
      .pop();
    return { row: row ?? null };
  }, [key, userId]);
}

function Countersign({ card, userId }: { card: CardView; userId: number }) {
  const { save, problem } = useLocalSave();
  const own = useOwnSignature(card, userId);
  // Until the phone has looked, show no button: a reload must never offer a second signature.
  if (own === undefined) return null;
  // A judge's ruling after this signature superseded it: the card must be signed again.
  const superseded = own.row && card.ends.some((e) => e.rulings.some((r) => r.judgedAt > own.row!.at));
  if (own.row && !superseded) {
    const role = (own.row.args as CardSignArgs).role;
    return (
      <Notice tone="success">
        <span data-testid="own-signature">
          {card.canRecordPaperCountersign
            ? 'You recorded the paper countersignature'
            : `You signed this card as ${role}`}{' '}
          on this phone, {new Date(own.row.at).toLocaleString()}.{' '}
          {own.row.status === 'pending'
            ? 'The signature is saved on this phone and goes to the event server with the next sync.'
            : 'The event server has it.'}
        </span>
      </Notice>
    );
  }
  if (card.canRecordPaperCountersign) return <PaperCountersign card={card} userId={userId} />;
  if (!card.canCountersign)
    return card.countersignNote ? <Notice tone="info">{card.countersignNote}</Notice> : null;
  const role = card.canCountersign;
  return (
    <div className="surface space-y-2 rounded-xl border-2 border-ink bg-card p-3">
      <p>
        {role === 'archer'
          ? `Check every end. By signing you agree that ${card.totals.total} is your score for this round.`
          : `You kept this card. By signing as scorer you confirm ${card.totals.total} for ${card.archer.name}.`}
      </p>
      <Button
        className="w-full"
        onClick={() =>
          save(() =>
            recordChange(localDb(), userId, {
              kind: 'card.sign',
              args: {
                sessionId: card.session.id,
                entryId: card.archer.entryId,
                role,
                total: card.totals.total,
              },
            }).then(() => syncLoop().kick()),
          )
        }
      >
        ✍ Sign as {role}
      </Button>
      {problem && <Notice tone="error">{problem}</Notice>}
    </div>
  );
}

/** The live place, on the archer's own card only (another person's place may not be public yet). */
function OwnPlace({ sessionId, entryId }: { sessionId: number; entryId: number }) {
  const mine = useMyCards().data?.cards.some((m) => m.sessionId === sessionId && m.entryId === entryId);
  if (!mine) return null;
  return (
    <section aria-labelledby="own-place" className="surface rounded-xl border-2 border-line bg-card p-3">
      <h2 id="own-place" className="font-bold">
        Your place
      </h2>
      <PlaceLine sessionId={sessionId} entryId={entryId} />
    </section>
  );
}

function Card({ sessionId, entryId, userId }: { sessionId: number; entryId: number; userId: number }) {
  const card = useCard(sessionId, entryId);
  if (card.isPending) return <p>Loading the card…</p>;
  if (card.error) return <Notice tone="error">{card.error.message}</Notice>;
  const c = card.data;
  return (
    <div className="space-y-4">
      <header>
        <p className="text-base">
          {c.event.name} · {c.session.name} · {c.round.name}
        </p>
        <h1 className="text-3xl font-bold">{c.archer.name}</h1>
        <p>
          {c.archer.division} · target {c.archer.targetNumber}
          {c.archer.position} · <strong data-testid="card-state">{CARD_STATE_WORDS[c.state]}</strong>
        </p>
      </header>
      <p className="text-2xl" data-testid="card-totals">
        Total <strong>{c.totals.total}</strong> · 10s {c.totals.tens} · Xs {c.totals.xs} · hits{' '}
        {c.totals.hits}
      </p>
      <p>
        {c.signedEnds} of {c.totalEnds} ends signed by a judge.
      </p>
      <OwnPlace sessionId={sessionId} entryId={entryId} />
      <table className="w-full border-collapse text-left">
        <thead>
          <tr className="border-b-2 border-ink">
            <th className="py-2">End</th>
            <th>Arrows</th>
            <th className="text-right">End</th>
            <th className="text-right">Total</th>
          </tr>
        </thead>
        <tbody>
          {c.ends.map((e) => (
            <Fragment key={e.endIndex}>
              <tr className="border-b border-line">
                <td className="py-2 font-bold">{e.endIndex + 1}</td>
                <td>
                  {e.arrows ? e.arrows.join(' ') : '—'}{' '}
                  <span className="text-base">
                    {END_STATE_LABELS[e.state].mark} {END_STATE_LABELS[e.state].word}
                    {e.rulings.length > 0 && ' · ⚖ ruled'}
                  </span>
                  {e.transcribedBy && (
                    <span className="block text-base">
                      ▲ Transcribed by judge {e.transcribedBy} from a file
                    </span>
                  )}
                </td>
                <td className="text-right">{e.total ?? ''}</td>
                <td className="text-right font-bold">{e.runningTotal ?? ''}</td>
              </tr>
              {e.rulings.length > 0 && (
                <tr className="border-b border-line">
                  <td colSpan={4} className="pb-2">
                    <RulingHistory steps={e.rulings.map(({ before, ...ruling }) => ({ ruling, before }))} />
                  </td>
                </tr>
              )}
            </Fragment>
          ))}
        </tbody>
      </table>
      {c.signatures.length > 0 && (
        <ul className="space-y-1">
          {c.signatures.map((s) => (
            <li key={s.role}>
              ✍ {s.role === 'archer' ? 'Archer' : 'Scorer'}: {s.name}, {new Date(s.at).toLocaleString()}
              {s.phoneAt && (
                <span className="text-base"> (phone time {new Date(s.phoneAt).toLocaleString()})</span>
              )}
              {s.onPaper && <span className="block text-base">{s.onPaper}</span>}
            </li>
          ))}
        </ul>
      )}
      {c.final && c.signatures[0] && (
        <Link
          to={`/verify?sig=${encodeURIComponent(c.signatures[0].jws)}`}
          className="inline-flex min-h-12 items-center font-bold underline"
        >
          Check this card's signature
        </Link>
      )}
      <Countersign card={c} userId={userId} />
      <SyncLine />
    </div>
  );
}

/** An archer's whole card: every end, totals, signatures, and countersigning when it is ready. */
export function CardScreen() {
  const params = useParams();
  return (
    <RequireSignIn>
      {(me) => (
        <Card sessionId={Number(params.sessionId)} entryId={Number(params.entryId)} userId={me.user.id} />
      )}
    </RequireSignIn>
  );
}
