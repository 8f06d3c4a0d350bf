import type { ArrowValue } from '../../core';
import { arrowLook } from '../../ui/scorecard/arrowLook';

/** One end's values in entry order, with empty boxes for the arrows still to come. */
export function EndValues({
  values,
  slots,
  label,
}: {
  values: readonly ArrowValue[];
  slots: number;
  label: string;
}) {
  return (
    <ol className="grid grid-cols-6 gap-1.5" aria-label={label}>
      {Array.from({ length: Math.max(slots, values.length) }, (_, i) => {
        const value = values[i];
        return (
          <li
            key={i}
            className={`flex h-12 items-center justify-center rounded-lg text-2xl font-bold ${
              value ? arrowLook(value) : 'border-2 border-dashed border-line text-ink-soft'
            }`}
          >
            {value ?? <span aria-label="not shot yet">·</span>}
          </li>
        );
      })}
    </ol>
  );
}
