import { useEffect, useState } from 'react';
import { MATCH_SECONDS_PER_ARROW } from '../../core/matches';

/**
 * A plain countdown of the time for one arrow, started by the judge and free to ignore: it only
 * shows the seconds left and never stops an entry (the judge rules on time, not the phone). Shot
 * alternately, each arrow entered (`restartOn` changes) starts the next archer's time once the
 * clock runs.
 */
export function ArrowCountdown({ restartOn }: { restartOn?: string }) {
  const [left, setLeft] = useState<number>();
  const [arrow, setArrow] = useState(restartOn);
  if (arrow !== restartOn) {
    setArrow(restartOn);
    if (left !== undefined) setLeft(MATCH_SECONDS_PER_ARROW);
  }
  useEffect(() => {
    if (left === undefined || left <= 0) return;
    const timer = setTimeout(() => setLeft(left - 1), 1000);
    return () => clearTimeout(timer);
  }, [left]);
  if (left === undefined)
    return (
      <button
        type="button"
        className="min-h-12 rounded-lg border-2 border-line bg-card px-3 text-base"
        onClick={() => setLeft(MATCH_SECONDS_PER_ARROW)}
      >
        Start the arrow clock ({MATCH_SECONDS_PER_ARROW} s)
      </button>
    );
  return (
    <p className="text-base" role="timer" aria-live="off" data-testid="arrow-clock">
      {left > 0 ? `${left} s left for this arrow.` : 'Time for this arrow is up: the judge decides.'}
    </p>
  );
}
