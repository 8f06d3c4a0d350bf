import { Link } from 'react-router-dom';
import { endKeyOf, type JoinedTarget } from '../../local/db';
import type { LocalEnd } from '../../local/endFacts';
import { endsOfRound } from '../../core';

/**
 * On a writer's pad, once their card holds every arrow of the round's last end for each archer:
 * the way to the cards they kept and must sign as scorer.
 */
export function CardsToSignLink({
  target,
  slot,
  ends,
}: {
  target: JoinedTarget;
  slot: 1 | 2;
  ends: Map<string, LocalEnd>;
}) {
  const finished = target.archers.every((a) => {
    const last = endsOfRound(a.round).at(-1);
    if (!last) return true;
    const local = ends.get(endKeyOf(target.session.id, a.entryId, last.index));
    return (local?.slots[slot]?.arrows.length ?? 0) >= last.arrows;
  });
  if (!finished) return null;
  return (
    <Link
      to="/cards"
      className="surface flex min-h-14 items-center justify-between rounded-xl border-2 border-ink bg-card p-3 text-lg font-bold"
    >
      <span>✍ Cards to sign as scorer</span>
      <span aria-hidden="true">▸</span>
    </Link>
  );
}
