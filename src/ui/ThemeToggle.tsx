import { useEffect, useState } from 'react';
import { NARROW_WHILE_WAITING, NARROW_WHILE_WAITING_HIDDEN, NARROW_WHILE_WAITING_SHOWN } from './frameRoom';

const KEY = 'ringcall.theme';

/** The "bright sun" theme: pure black on white for screens read in direct sunlight. */
export function ThemeToggle() {
  const [sun, setSun] = useState(() => localStorage.getItem(KEY) === 'sun');
  useEffect(() => {
    document.documentElement.dataset.theme = sun ? 'sun' : 'field';
    localStorage.setItem(KEY, sun ? 'sun' : 'field');
  }, [sun]);
  return (
    <button
      type="button"
      aria-pressed={sun}
      onClick={() => setSun((s) => !s)}
      // The same width either way, so switching never wraps the header: "on" is the filled look and ✓.
      className={`min-h-12 whitespace-nowrap rounded-lg border-2 border-white/70 px-3 text-base font-bold ${
        sun ? 'bg-white text-ink' : 'text-white'
      }`}
    >
      {/* Where the word gives way (frameRoom.ts), the sun stays: a lone ✓ would not say what is on. */}
      <span aria-hidden="true" className={NARROW_WHILE_WAITING_HIDDEN}>
        {sun ? '✓' : '☀'}
      </span>
      <span aria-hidden="true" className={`hidden ${NARROW_WHILE_WAITING_SHOWN}`}>
        ☀
      </span>{' '}
      <span className={NARROW_WHILE_WAITING}>Sun</span>
    </button>
  );
}
