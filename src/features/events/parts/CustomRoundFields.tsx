import type { BowStyle, FaceId } from '../../../core';
import type { RoundSummary } from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { Field } from '../../../ui/Field';
import { SelectField } from '../../../ui/SelectField';
import { FaceSelect } from '../../../ui/FaceSelect';

export type DistanceDraft = { distanceM: string; faceId: FaceId; arrows: string; arrowsPerEnd: string };
export type CustomRoundDraft = { name: string; venue: 'outdoor' | 'indoor'; distances: DistanceDraft[] };

export const emptyCustomRound = (): CustomRoundDraft => ({
  name: '',
  venue: 'outdoor',
  distances: [{ distanceM: '30', faceId: 'full-80', arrows: '36', arrowsPerEnd: '6' }],
});

export const customRoundFromSummary = (round: RoundSummary): CustomRoundDraft => ({
  name: round.name,
  venue: round.venue,
  distances: round.distances.map((d) => ({
    distanceM: String(d.distanceM),
    faceId: d.faceId as FaceId,
    arrows: String(d.arrows),
    arrowsPerEnd: String(d.arrowsPerEnd),
  })),
});

const slug = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '') || 'round';

/**
 * The round as the server's core check expects it. Time per end follows the usual 40 seconds an
 * arrow (4 minutes for 6, 2 for 3); a distance shot twice is labelled (1) and (2).
 */
export function customRoundPayload(draft: CustomRoundDraft, bowStyle: BowStyle) {
  const counts = new Map<string, number>();
  for (const d of draft.distances) counts.set(d.distanceM, (counts.get(d.distanceM) ?? 0) + 1);
  const seen = new Map<string, number>();
  return {
    id: `custom-${slug(draft.name)}`,
    name: draft.name.trim(),
    venue: draft.venue,
    bowStyles: [bowStyle],
    distances: draft.distances.map((d) => {
      const n = (seen.get(d.distanceM) ?? 0) + 1;
      seen.set(d.distanceM, n);
      const arrowsPerEnd = Number(d.arrowsPerEnd);
      return {
        label: (counts.get(d.distanceM) ?? 0) > 1 ? `${d.distanceM} m (${n})` : `${d.distanceM} m`,
        distanceM: Number(d.distanceM),
        faceId: d.faceId,
        arrows: Number(d.arrows),
        arrowsPerEnd,
        secondsPerEnd: Math.max(1, arrowsPerEnd * 40),
      };
    }),
  };
}

/** A round made up for this event: a name, indoor or outdoor, and its distances. */
export function CustomRoundFields({
  draft,
  onChange,
  divisionName,
}: {
  draft: CustomRoundDraft;
  onChange: (d: CustomRoundDraft) => void;
  divisionName: string;
}) {
  const setDistance = (i: number, patch: Partial<DistanceDraft>) =>
    onChange({ ...draft, distances: draft.distances.map((d, j) => (j === i ? { ...d, ...patch } : d)) });
  return (
    <fieldset className="space-y-3 rounded-lg border-2 border-dashed border-line p-3">
      <legend className="px-1 font-bold">Custom round for {divisionName}</legend>
      <Field
        label="Round name"
        value={draft.name}
        onChange={(e) => onChange({ ...draft, name: e.target.value })}
      />
      <SelectField
        label="Indoor or outdoor"
        value={draft.venue}
        onChange={(e) => onChange({ ...draft, venue: e.target.value as CustomRoundDraft['venue'] })}
      >
        <option value="outdoor">Outdoor</option>
        <option value="indoor">Indoor</option>
      </SelectField>
      {draft.distances.map((d, i) => (
        <div key={i} className="space-y-2 rounded-lg bg-paper p-3">
          <p className="font-bold">Distance {i + 1}</p>
          <div className="grid grid-cols-2 gap-3">
            <Field
              label="Metres"
              inputMode="numeric"
              value={d.distanceM}
              onChange={(e) => setDistance(i, { distanceM: e.target.value })}
            />
            <FaceSelect value={d.faceId} onChange={(faceId) => setDistance(i, { faceId })} />
            <Field
              label="Arrows"
              inputMode="numeric"
              value={d.arrows}
              onChange={(e) => setDistance(i, { arrows: e.target.value })}
            />
            <Field
              label="Arrows per end"
              inputMode="numeric"
              value={d.arrowsPerEnd}
              onChange={(e) => setDistance(i, { arrowsPerEnd: e.target.value })}
            />
          </div>
          {draft.distances.length > 1 && (
            <Button
              variant="secondary"
              onClick={() => onChange({ ...draft, distances: draft.distances.filter((_, j) => j !== i) })}
            >
              Remove distance {i + 1}
            </Button>
          )}
        </div>
      ))}
      <Button
        variant="secondary"
        onClick={() =>
          onChange({
            ...draft,
            distances: [...draft.distances, { ...draft.distances[draft.distances.length - 1]! }],
          })
        }
      >
        Add a distance
      </Button>
    </fieldset>
  );
}
