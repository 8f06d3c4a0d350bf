import { memo } from 'react';
import { flagWords, type MarkedArrow } from '../../ui/scorecard/endFlags';

/** The incidents of an end that wait for a judge, in words, on every phone of the target. */
export const FlagNotes = memo(function FlagNotes({ flags }: { flags: readonly MarkedArrow[] }) {
  if (flags.length === 0) return null;
  return (
    <p
      className="surface rounded-lg border-2 border-ink bg-caution-bg p-2 font-bold text-caution-ink"
      data-testid="end-flags"
    >
      <span aria-hidden="true">⚑ </span>
      {flagWords(flags)}. A judge must rule on it: do not pull these arrows until the holes are marked and the
      judge has seen them.
    </p>
  );
});
