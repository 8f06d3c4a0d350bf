import type { EndState, EndView } from '../../core';

/** Each state has a word and a mark, never colour alone. */
export const END_STATE_LABELS: Record<EndState, { mark: string; word: string }> = {
  open: { mark: '○', word: 'Open' },
  entered: { mark: '…', word: 'Entered' },
  agreed: { mark: '✓', word: 'Agreed' },
  mismatch: { mark: '≠', word: 'Mismatch' },
  settled: { mark: '✓', word: 'Settled' },
  disputed: { mark: '?', word: 'With a judge' },
  signed: { mark: '✍', word: 'Signed' },
};

/** An end's label as the target's phones show it: a judge's ruling says so, not only "Settled". */
export function endLabel(view: EndView | undefined): { mark: string; word: string } {
  if (view?.state === 'settled' && view.decidedBy === 'judge') return { mark: '⚖', word: 'Ruled by a judge' };
  return END_STATE_LABELS[view?.state ?? 'open'];
}
