import type { CardContent } from './cardContent';

/** One difference between a card as signed and as it is now, in words. */
export type CardChange = { what: string; signed: string; now: string };

const place = (p: CardContent['place']) => (p ? `target ${p.targetNumber}${p.position}` : 'no target');
const arrows = (a: readonly string[] | null) => (a ? a.join(' ') : 'not signed');

/**
 * What differs between the content a card signature covers (as stored with it) and the card as
 * it is now: each printed field that identifies the card, each end, the totals, and each end's
 * judge signature. Empty when nothing does.
 */
export function cardChanges(signed: CardContent, now: CardContent): CardChange[] {
  const changes: CardChange[] = [];
  const compare = (what: string, a: string, b: string) => {
    if (a !== b) changes.push({ what, signed: a, now: b });
  };
  compare('Event', signed.event.name, now.event.name);
  compare(
    'Event dates',
    `${signed.event.startsOn} – ${signed.event.endsOn}`,
    `${now.event.startsOn} – ${now.event.endsOn}`,
  );
  compare('Session', signed.session.name, now.session.name);
  compare('Session start', signed.session.startsAt, now.session.startsAt);
  compare('Archer', signed.archer.name, now.archer.name);
  compare('Club', signed.archer.club, now.archer.club);
  compare('Division', signed.archer.division, now.archer.division);
  // An archer taken off the target list after shooting keeps the card as signed; a move shows.
  if (now.place) compare('Place', place(signed.place), place(now.place));
  compare('Round', signed.round.name, now.round.name);
  const ends = Math.max(signed.ends.length, now.ends.length);
  for (let i = 0; i < ends; i += 1) {
    compare(`End ${i + 1}`, arrows(signed.ends[i] ?? null), arrows(now.ends[i] ?? null));
    if ((signed.endSignatures[i] ?? null) !== (now.endSignatures[i] ?? null) && signed.ends[i] && now.ends[i])
      changes.push({ what: `Judge's signature on end ${i + 1}`, signed: 'as signed', now: 'changed' });
  }
  compare('Total', String(signed.totals.total), String(now.totals.total));
  return changes;
}
