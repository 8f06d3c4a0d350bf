import { useEffect, useState } from 'react';
import type { ArrowValue, ValuesBefore } from '../../core';
import { apiDownload, messageOf } from '../../api/request';
import { useOnline } from '../../local/online';

export type RulingStep = {
  ruling: {
    arrows: readonly ArrowValue[];
    reason: string;
    judgedByName: string;
    judgedAt: string;
    photoId: number | null;
    pending?: boolean;
  };
  before: ValuesBefore;
};

const when = (at: string) => new Date(at).toLocaleString([], { dateStyle: 'short', timeStyle: 'short' });

function beforeWords(before: ValuesBefore): string {
  if (before.by === 'cards') {
    const card = (arrows: readonly ArrowValue[] | undefined) =>
      arrows?.length ? arrows.join(' ') : 'nothing';
    return `writer 1 had ${card(before.first)}, writer 2 had ${card(before.second)}`;
  }
  const by = {
    writers: 'agreed by both writers',
    caller: 'settled by the caller',
    judge: 'an earlier ruling',
  };
  return `${before.arrows.join(' ')} (${by[before.by]})`;
}

/** A ruling's photo, fetched with the person's sign-in when they ask (photos are not public). */
function RulingPhoto({ photoId }: { photoId: number }) {
  const online = useOnline();
  const [url, setUrl] = useState<string>();
  const [problem, setProblem] = useState<string>();
  useEffect(() => () => (url ? URL.revokeObjectURL(url) : undefined), [url]);
  if (url)
    return (
      <img
        src={url}
        alt="The judge's photo of the target"
        className="max-h-80 rounded-lg border border-line"
      />
    );
  return (
    <p className="space-x-2">
      <button
        type="button"
        disabled={!online}
        className="min-h-12 rounded-lg border-2 border-ink px-3 font-bold disabled:opacity-50"
        onClick={() =>
          void apiDownload(`/api/photos/${photoId}`).then(
            (blob) => setUrl(URL.createObjectURL(blob)),
            (error: unknown) => setProblem(messageOf(error)),
          )
        }
      >
        Show the judge's photo
      </button>
      {!online && <span className="text-base">The photo opens when the phone has signal.</span>}
      {problem && <span className="text-base text-brick">{problem}</span>}
    </p>
  );
}

/** Every ruling on an end, oldest first: who, when, the values before and after, why, and the photo. */
export function RulingHistory({ steps }: { steps: readonly RulingStep[] }) {
  if (steps.length === 0) return null;
  return (
    <ol aria-label="Rulings on this end" className="space-y-2" data-testid="rulings">
      {steps.map(({ ruling, before }, i) => (
        <li key={i} className="surface space-y-1 rounded-lg border-2 border-ink bg-card p-3">
          <p className="font-bold">
            <span aria-hidden="true">⚖ </span>
            Ruled by {ruling.judgedByName === 'you' ? 'you' : `judge ${ruling.judgedByName}`},{' '}
            {when(ruling.judgedAt)}
            {ruling.pending ? ' (waiting to sync)' : ''}: {ruling.arrows.join(' ')}
          </p>
          <p>Before: {beforeWords(before)}.</p>
          <p>Reason: {ruling.reason}</p>
          {ruling.photoId !== null && <RulingPhoto photoId={ruling.photoId} />}
        </li>
      ))}
    </ol>
  );
}
