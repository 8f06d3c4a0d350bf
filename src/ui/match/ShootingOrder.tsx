import type { Side } from '../../core';
import { nextInOrder, other } from '../../core/matches';
import type { MatchDto } from '../../contract/matches';
import { Button } from '../Button';
import { ArrowCountdown } from './ArrowCountdown';
import { ARROWS, nameOf, type Draft } from './MatchCardParts';

/*
 * A match shot alternately, on the writers' pad and the judge's match card: before end 1, who
 * shoots first (the higher-ranked archer decides); then whose arrow is next, with the arrow clock
 * starting again for every arrow. Nothing of this shows for a match that does not alternate.
 */

/** Two large keys, one per archer: the choice goes through the outbox like any change. */
export function WhoShootsFirst({ match, onChoose }: { match: MatchDto; onChoose: (side: Side) => void }) {
  const seeded = (['a', 'b'] as const).reduce((best, s) =>
    (match.sides[s]?.seed ?? Infinity) < (match.sides[best]?.seed ?? Infinity) ? s : best,
  );
  return (
    <div
      role="group"
      aria-labelledby={`who-first-${match.id}`}
      className="space-y-2"
      data-testid="who-shoots-first"
    >
      <h3 id={`who-first-${match.id}`} className="text-2xl font-bold">
        Who shoots first?
      </h3>
      <p>
        The archers shoot one arrow each in turn. {nameOf(match, seeded)}, the higher-ranked archer, decides
        who starts end 1.
      </p>
      <div className="grid grid-cols-2 gap-2">
        {(['a', 'b'] as const).map((side) => (
          <Button key={side} className="min-h-16" onClick={() => onChoose(side)}>
            {nameOf(match, side)}
          </Button>
        ))}
      </div>
    </div>
  );
}

type TurnProps = {
  match: MatchDto;
  /** The order of this end's arrows when shot alternately (core `shootingOrder`). */
  order: Side[] | null;
  draft: Draft;
  /** Who was chosen to shoot first in end 1, and whether the choice still waits to sync. */
  first: { side: Side; waiting: boolean } | null;
  onChoose: (side: Side) => void;
};

/**
 * Whose arrow is next in the end being entered (none once it is complete), the arrow clock started
 * again for each arrow, and, until end 1 begins, who was chosen to start it with a key to change it.
 */
export function NextArrow({
  match,
  order,
  draft,
  first,
  onChoose,
}: TurnProps & { order: Side[] }) {
  const arrowsIn = draft.a.length + draft.b.length;
  const next = nextInOrder(order, draft);
  const canChange = first && draft.endIndex === 0 && arrowsIn === 0 && match.ends.length === 0;
  return (
    <div className="space-y-2">
      {canChange && (
        <div className="flex flex-wrap items-center gap-2">
          <p>
            {nameOf(match, first.side)} shoots first in end 1{first.waiting && ' (▲ waiting to sync)'}.
          </p>
          <Button variant="secondary" onClick={() => onChoose(other(first.side))}>
            {nameOf(match, other(first.side))} first instead
          </Button>
        </div>
      )}
      {next && (
        <>
          <p className="text-2xl font-bold" role="status" data-testid="next-arrow">
            Next arrow: {nameOf(match, next)}
          </p>
          <ArrowCountdown restartOn={`${draft.endIndex}:${arrowsIn}`} />
        </>
      )}
    </div>
  );
}

/**
 * Whose arrows are entered next, on the writers' pad and the judge's match card: in turn when the
 * match is shot alternately (`order`), else the upper line's three then the lower's, with the arrow
 * clock; nothing once the end is complete.
 */
export function ArrowTurn({
  match,
  order,
  draft,
  first,
  onChoose,
}: TurnProps) {
  if (order) return <NextArrow match={match} order={order} draft={draft} first={first} onChoose={onChoose} />;
  if (draft.a.length === ARROWS && draft.b.length === ARROWS) return null;
  const side: Side = draft.a.length < ARROWS ? 'a' : 'b';
  return (
    <>
      <p>
        Arrows of <span className="font-bold">{nameOf(match, side)}</span>, highest first.
      </p>
      <ArrowCountdown key={`${draft.endIndex}:${draft.a.length + draft.b.length}`} />
    </>
  );
}
