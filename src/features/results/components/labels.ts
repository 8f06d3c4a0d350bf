import type { StandingRow, Trust } from '../../../contract/results';

/** Each trust level as a word with its own shape, never colour alone. */
export const TRUST_LABEL: Record<Trust, { mark: string; word: string }> = {
  provisional: { mark: '◌', word: 'provisional' },
  signed: { mark: '✓', word: 'signed' },
  final: { mark: '✓✓', word: 'final' },
};

/** "=2" for a shared place. */
export const placeText = (r: { place: number; tied: boolean }) => `${r.tied ? '=' : ''}${r.place}`;

export function shootOffText(r: Pick<StandingRow, 'shootOff' | 'decidedByShootOff'>): string | undefined {
  if (r.shootOff) return 'shoot-off needed';
  if (r.decidedByShootOff) return 'after shoot-off';
  return undefined;
}

/** "as of 14:05:09": when the server computed the standings, in the viewer's time. */
export const asOf = (iso: string) =>
  new Date(iso).toLocaleTimeString(undefined, { hour: '2-digit', minute: '2-digit', second: '2-digit' });
