import type { EndState } from '../../core';

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
