import type { ReactNode } from 'react';
import { arrowPoints, type ArrowValue, type MatchFormat, type Side } from '../../core';
import { endWord } from './endWord';
import type { MatchDto } from '../../contract/matches';
import type { MatchCardView } from '../../local/matchCard';

/*
 * The match card's parts, shared by the judge's match card and the writers' match pad: the
 * score line, the ends, the end being entered (the upper line's three arrows, then the lower's).
 */

export const SIDES: readonly Side[] = ['a', 'b'];
export const ARROWS = 3;
export type Draft = { endIndex: number; a: ArrowValue[]; b: ArrowValue[] };

export const sum = (values: readonly ArrowValue[]) => values.reduce((t, v) => t + arrowPoints(v), 0);
export const nameOf = (match: MatchDto, side: Side) =>
  match.sides[side]?.archers.map((a) => a.name).join(', ') ?? '—';

/** Fills the upper line's three arrows, then the lower line's. */
export function addValues(draft: Draft, values: ArrowValue[], per = ARROWS): Draft {
  const next = { ...draft, a: [...draft.a], b: [...draft.b] };
  for (const v of values) {
    if (next.a.length < per) next.a.push(v);
    else if (next.b.length < per) next.b.push(v);
  }
  return next;
}
export const undoValue = (d: Draft): Draft =>
  d.b.length > 0 ? { ...d, b: d.b.slice(0, -1) } : { ...d, a: d.a.slice(0, -1) };

/** One titled part of the match card. */
export function Panel({
  id,
  title,
  testId,
  strong,
  children,
}: {
  id: string;
  title: string;
  testId?: string;
  strong?: boolean;
  children: ReactNode;
}) {
  return (
    <section
      aria-labelledby={id}
      className={`surface space-y-3 rounded-xl bg-card p-3 ${strong ? 'border-4 border-ink' : 'border-2 border-line'}`}
      data-testid={testId}
    >
      <h2 id={id} className="text-2xl font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}

export function Scoreline({
  match,
  card,
  format,
}: {
  match: MatchDto;
  card: MatchCardView;
  format: MatchFormat;
}) {
  const state = card.state;
  return (
    <div className="grid grid-cols-2 gap-2" data-testid="match-score">
      {SIDES.map((side) => (
        <div
          key={side}
          className="surface rounded-xl border-2 border-line bg-card p-3"
          data-testid={`score-${side}`}
        >
          <p className="font-bold">
            {nameOf(match, side)} <span className="text-ink-soft">({match.sides[side]?.seed})</span>
          </p>
          <p className="text-4xl font-bold" aria-label={format === 'sets' ? 'set points' : 'total'}>
            {state?.score[side] ?? 0}
          </p>
          <p className="text-base">{format === 'sets' ? 'set points' : 'running total'}</p>
          {state?.outlook[side].say && (
            <p className="mt-1 font-bold" data-testid={`outlook-${side}`}>
              {state.outlook[side].say}
            </p>
          )}
        </div>
      ))}
    </div>
  );
}

/** The judge's signature on one end, in words: signed, waiting to sync, or none. */
const SIGNATURE_WORDS = { server: '✓ signed by the judge', waiting: '▲ signature waiting to sync' } as const;

export function EndsTable({
  match,
  card,
  format,
  onCorrect,
  onSign,
}: {
  match: MatchDto;
  card: MatchCardView;
  format: MatchFormat;
  onCorrect?: ((endIndex: number) => void) | undefined;
  /** The judge signs one end (a set in the set system) not signed yet. */
  onSign?: ((endIndex: number) => void) | undefined;
}) {
  const word = endWord(format);
  if (card.ends.length === 0) return <p>No end recorded yet.</p>;
  return (
    <table className="w-full border-collapse text-left" data-testid="match-ends">
      <caption className="sr-only">Ends of the match</caption>
      <thead>
        <tr className="border-b-2 border-line [&>th]:px-1 [&>th]:align-bottom">
          <th scope="col">{format === 'sets' ? 'Set' : 'End'}</th>
          <th scope="col">{nameOf(match, 'a')}</th>
          <th scope="col">{nameOf(match, 'b')}</th>
          <th scope="col">
            <span className="sr-only">State</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {card.ends.map((end, i) => {
          const points = card.state?.ends[i]?.setPoints;
          return (
            <tr key={i} className="border-b border-line" data-testid={`match-end-${i + 1}`}>
              <th scope="row" className="px-1 py-1 align-top">
                {i + 1}
              </th>
              {SIDES.map((side) => (
                <td key={side} className="px-1 py-1 align-top">
                  <span className="block whitespace-nowrap">{end[side].join(' ')}</span>
                  <span className="block">
                    = <span className="font-bold">{sum(end[side])}</span>
                    {points && ` · ${points[side]} pt`}
                  </span>
                </td>
              ))}
              <td className="px-1 py-1 align-top">
                {end.waiting ? '▲ waiting to sync' : '✓ synced'}
                {end.signature && (
                  <span className="block font-bold" data-testid={`end-signature-${i + 1}`}>
                    {SIGNATURE_WORDS[end.signature]}
                  </span>
                )}
                {onSign && !end.signature && (
                  <button
                    type="button"
                    className="mt-1 block min-h-11 min-w-11 rounded-lg border-2 border-ink px-2 font-bold"
                    onClick={() => onSign(i)}
                  >
                    Sign {word} {i + 1}
                  </button>
                )}
                {onCorrect && (
                  <button
                    type="button"
                    className="mt-1 block min-h-11 min-w-11 rounded-lg border-2 border-ink px-2 font-bold"
                    onClick={() => onCorrect(i)}
                    aria-label={`Correct ${word} ${i + 1}`}
                  >
                    Correct
                  </button>
                )}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

export function DraftLines({ match, draft, per }: { match: MatchDto; draft: Draft; per: number }) {
  return (
    <div className="space-y-1" data-testid="match-draft">
      {SIDES.map((side) => (
        <p key={side} className="text-xl">
          <span className="font-bold">{nameOf(match, side)}:</span>{' '}
          {Array.from({ length: per }, (_, i) => draft[side][i] ?? '·').join(' ')}
          {draft[side].length === per && per > 1 && <span> = {sum(draft[side])}</span>}
        </p>
      ))}
    </div>
  );
}
