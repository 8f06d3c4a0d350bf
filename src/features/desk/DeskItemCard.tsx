import { memo, useState } from 'react';
import { endsOfRound } from '../../core';
import { Button } from '../../ui/Button';
import { RulingHistory } from '../../ui/scorecard/RulingHistory';
import { EndArrows } from '../../ui/scorecard/EndArrows';
import { DESK_KIND_LABELS, type DeskItem } from './deskItems';
import { RuleForm } from './RuleForm';

type Props = {
  item: DeskItem;
  eventId: number;
  userId: number;
  /** Signs the end (the list hides it and reports a failure); the same function on every render. */
  onSign: (item: DeskItem) => void;
};

function DeskItemCardView({ item, eventId, userId, onSign }: Props) {
  const [ruling, setRuling] = useState(false);
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
            <Button onClick={() => onSign(item)}>
              ✍ Sign end
            </Button>
          )}
        </div>
      )}
    </li>
  );
}

/**
 * One end waiting for a judge. Every change on the phone re-reads the desk's ends, so each card
 * redraws only when its own end changed (its revision), not on every other end's signature.
 */
export const DeskItemCard = memo(
  DeskItemCardView,
  (before, after) =>
    before.item.revision === after.item.revision &&
    before.eventId === after.eventId &&
    before.userId === after.userId &&
    before.onSign === after.onSign,
);
