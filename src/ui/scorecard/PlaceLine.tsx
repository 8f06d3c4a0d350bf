import type { ArcherPlace } from '../../contract/archerPlace';
import type { Trust } from '../../contract/results';
import { useOnline } from '../../local/online';
import { useArcherPlace } from '../../api/archerPlace';

const TRUST_WORDS: Record<Trust, string> = {
  provisional: 'provisional: ends still to be signed',
  signed: 'signed: every end signed by a judge',
  final: 'final: the card is countersigned',
};

const points = (n: number) => (n === 1 ? '1 point' : `${n} points`);
const ordinal = (n: number) => {
  const tens = n % 100;
  if (tens >= 11 && tens <= 13) return `${n}th`;
  return `${n}${{ 1: 'st', 2: 'nd', 3: 'rd' }[n % 10] ?? 'th'}`;
};
const clock = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

function Gaps({ place }: { place: ArcherPlace }) {
  const above = place.toPlaceAbove;
  const below = place.leadOverBelow;
  return (
    <>
      {above !== null && <span className="block">{points(above)} to the place above</span>}
      {below !== null && <span className="block">{points(below)} ahead of the place below</span>}
    </>
  );
}

/**
 * An archer's live place in their division, with the gaps around it and how far it can be
 * trusted. Offline it shows the last copy with its time; before any end counts, says so.
 */
export function PlaceLine({ sessionId, entryId }: { sessionId: number; entryId: number }) {
  const query = useArcherPlace(sessionId, entryId);
  const online = useOnline();
  const place = query.data;
  const asOf = !online && place && (
    <span className="block text-base">Last known, as of {clock(place.computedAt)}: no signal now.</span>
  );
  let body;
  if (!place)
    body = online
      ? query.error
        ? `Your place could not be read: ${query.error.message}`
        : 'Reading your place…'
      : 'Your place shows when the phone has signal.';
  else if (place.place === null)
    body = (
      <>
        No place yet: it shows once one of your ends counts.
        {asOf}
      </>
    );
  else
    body = (
      <>
        <span className="block text-xl font-bold">
          {ordinal(place.place)}
          {place.tied && ' (tied)'} of {place.ranked} in {place.division}
        </span>
        <span className="block">
          {place.total} after {place.endsShot} of {place.totalEnds} ends
        </span>
        <Gaps place={place} />
        <span className="block text-base">Standing {TRUST_WORDS[place.trust]}.</span>
        {asOf}
      </>
    );
  return (
    <p className="block" data-testid={`place-${sessionId}-${entryId}`}>
      {body}
    </p>
  );
}
