import type { ArrowValue } from '../../core';
import type { ArrowFlag } from '../../contract/sync';
import { arrowLook } from './arrowLook';
import { FLAG_LABELS } from './endFlags';

type Props = {
  arrows: readonly ArrowValue[];
  slots: number;
  flags?: { index: number; flag: ArrowFlag }[];
  selected?: number | undefined;
  onSelect?: (index: number) => void;
  /** Positions to mark as differing from the other card. */
  differing?: ReadonlySet<number>;
  label: string;
};

/**
 * One end's values, highest to lowest, in boxes the size of a thumb; empty boxes show what is left.
 * The boxes share one line and narrow a little when the line is short (six arrows at 412 px inside
 * a card), so a six-arrow end never wraps 5 + 1.
 */
export function EndArrows({ arrows, slots, flags = [], selected, onSelect, differing, label }: Props) {
  return (
    <ol className="flex gap-1.5" aria-label={label}>
      {Array.from({ length: Math.max(slots, arrows.length) }, (_, i) => {
        const value = arrows[i];
        const flag = flags.find((f) => f.index === i);
        const differs = differing?.has(i);
        const box = `relative flex h-14 w-full items-center justify-center rounded-lg text-[28px] font-bold ${
          value ? arrowLook(value) : 'border-2 border-dashed border-line text-ink-soft'
        } ${selected === i ? 'ring-4 ring-ink ring-offset-2' : ''} ${differs ? 'outline outline-4 outline-brick' : ''}`;
        const content = (
          <>
            {value ?? '·'}
            {flag && (
              <span
                className="absolute -right-2 -top-3 rounded bg-ink px-1 text-base leading-tight text-white"
                title={FLAG_LABELS[flag.flag]}
              >
                ⚑
              </span>
            )}
            {differs && (
              <span className="absolute -bottom-3 rounded bg-brick px-1 text-base leading-tight text-white">
                ≠
              </span>
            )}
          </>
        );
        return (
          <li key={i} className="min-w-0 max-w-12 flex-1">
            {onSelect && value ? (
              <button
                type="button"
                className={box}
                onClick={() => onSelect(i)}
                aria-label={`Arrow ${i + 1}: ${value}${flag ? `, ${FLAG_LABELS[flag.flag]}` : ''}`}
              >
                {content}
              </button>
            ) : (
              <span className={box}>{content}</span>
            )}
          </li>
        );
      })}
    </ol>
  );
}
