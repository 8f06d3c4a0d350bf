import { useEffect, useRef } from 'react';
import type { ArrowValue } from '../../core';
import { arrowLook } from './arrowLook';
import { LONE_ONE_WAIT_MS, feedKey, flushLoneOne } from './keyEntry';

type Props = {
  allowed: readonly ArrowValue[];
  /** One value per tap; a key sequence can decide two at once ("1" then "9"). */
  onValues: (values: ArrowValue[]) => void;
  onUndo: () => void;
  canUndo: boolean;
  disabled?: boolean;
};

/** The pad's keys: only the values this archer can score on this face, large enough for cold fingers. */
export function ArrowKeypad({ allowed, onValues, onUndo, canUndo, disabled }: Props) {
  // A "1" that may still become 10 (see feedKey), and the wait after which it counts as 1.
  const pending = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout>>(undefined);
  const latest = useRef({ allowed, onValues });
  useEffect(() => {
    latest.current = { allowed, onValues };
  }, [allowed, onValues]);
  useEffect(() => () => clearTimeout(timer.current), []);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (disabled || e.target instanceof HTMLInputElement || e.target instanceof HTMLSelectElement) return;
      if (e.ctrlKey || e.metaKey || e.altKey) return;
      if (e.key === 'Backspace') {
        // Backspace first drops a "1" still waiting, then undoes.
        if (pending.current) {
          pending.current = false;
          clearTimeout(timer.current);
        } else if (canUndo) onUndo();
        e.preventDefault();
        return;
      }
      // Enter and space on a focused button press it: leave them alone unless a "1" is waiting.
      if ((e.key === 'Enter' || e.key === ' ') && !pending.current) return;
      const step = feedKey(pending.current, e.key, allowed);
      if (!step.handled) return;
      e.preventDefault();
      clearTimeout(timer.current);
      pending.current = step.pending;
      if (step.values.length > 0) onValues(step.values);
      if (step.pending)
        timer.current = setTimeout(() => {
          pending.current = false;
          const values = flushLoneOne(latest.current.allowed);
          if (values.length > 0) latest.current.onValues(values);
        }, LONE_ONE_WAIT_MS);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [allowed, onValues, onUndo, canUndo, disabled]);

  // Each key keeps a compositor layer of its own (`will-change-transform`), so the press shrink runs
  // on the compositor: no layer made, painted and dropped again, no repaint of the page, per tap.
  return (
    <div className="grid grid-cols-4 gap-2" role="group" aria-label="Arrow values">
      {allowed.map((value) => (
        <button
          key={value}
          type="button"
          disabled={disabled}
          onClick={() => onValues([value])}
          className={`h-16 min-w-14 rounded-xl text-[32px] font-bold shadow-sm transition-transform will-change-transform active:scale-95 disabled:opacity-40 ${arrowLook(value)}`}
          aria-label={value === 'M' ? 'Miss (M)' : `Arrow ${value}`}
        >
          {value}
        </button>
      ))}
      <button
        type="button"
        onClick={onUndo}
        disabled={!canUndo}
        className="col-span-2 h-16 rounded-xl border-2 border-ink bg-card text-xl font-bold will-change-transform active:scale-95 disabled:opacity-40"
      >
        ↶ Undo
      </button>
    </div>
  );
}
