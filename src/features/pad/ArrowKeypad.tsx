import { useEffect } from 'react';
import type { ArrowValue } from '../../core';
import { arrowLook } from './arrowLook';

type Props = {
  allowed: readonly ArrowValue[];
  onValue: (value: ArrowValue) => void;
  onUndo: () => void;
  canUndo: boolean;
  disabled?: boolean;
};

/** Keyboard equivalents on a desktop: x, 0 for 10, 1–9, m; Backspace undoes. */
function keyToValue(key: string, allowed: readonly ArrowValue[]): ArrowValue | undefined {
  const k = key.toUpperCase();
  const value = k === '0' ? '10' : k;
  return allowed.find((a) => a === value);
}

/** The pad's keys: only the values this archer can score on this face, large enough for cold fingers. */
export function ArrowKeypad({ allowed, onValue, onUndo, canUndo, disabled }: Props) {
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (disabled || e.target instanceof HTMLInputElement || e.target instanceof HTMLSelectElement) return;
      if (e.key === 'Backspace' && canUndo) {
        e.preventDefault();
        onUndo();
        return;
      }
      const value = keyToValue(e.key, allowed);
      if (value) {
        e.preventDefault();
        onValue(value);
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [allowed, onValue, onUndo, canUndo, disabled]);

  return (
    <div className="grid grid-cols-4 gap-2" role="group" aria-label="Arrow values">
      {allowed.map((value) => (
        <button
          key={value}
          type="button"
          disabled={disabled}
          onClick={() => onValue(value)}
          className={`h-16 min-w-14 rounded-xl text-[32px] font-bold shadow-sm transition-transform active:scale-95 disabled:opacity-40 ${arrowLook(value)}`}
          aria-label={value === 'M' ? 'Miss (M)' : `Arrow ${value}`}
        >
          {value}
        </button>
      ))}
      <button
        type="button"
        onClick={onUndo}
        disabled={!canUndo}
        className="col-span-2 h-16 rounded-xl border-2 border-ink bg-card text-xl font-bold active:scale-95 disabled:opacity-40"
      >
        ↶ Undo
      </button>
    </div>
  );
}
