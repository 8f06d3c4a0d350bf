import type { ReactNode } from 'react';

/** An inline message with a word-bearing shape, never colour alone. */
export function Notice({ tone, children }: { tone: 'error' | 'info' | 'success'; children: ReactNode }) {
  const style = {
    error: 'border-brick bg-brick-bg text-brick',
    info: 'border-ink/40 bg-card text-ink',
    success: 'border-moss bg-card text-moss-dark',
  }[tone];
  const mark = { error: '▲', info: 'ℹ', success: '✓' }[tone];
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={`surface rounded-lg border-2 p-3 font-bold ${style}`}
    >
      <span aria-hidden="true">{mark} </span>
      {children}
    </div>
  );
}
