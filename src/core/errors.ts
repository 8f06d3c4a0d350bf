/**
 * Why a scoring operation was refused. The code lets callers (the pad, the sync server) react
 * without parsing the message; the message is written for the person holding the phone.
 */
export type ScoringErrorCode =
  | 'unknown-arrow-value'
  | 'unknown-face'
  | 'unknown-round'
  | 'invalid-round'
  | 'invalid-card'
  | 'invalid-plot'
  | 'invalid-ranking'
  | 'invalid-match'
  | 'invalid-bracket'
  | 'not-canonical-json';

export class ScoringError extends Error {
  override readonly name = 'ScoringError';

  constructor(
    readonly code: ScoringErrorCode,
    message: string,
    /** Every problem found, when there is more than one (custom round validation). */
    readonly problems: readonly string[] = [message],
  ) {
    super(message);
  }
}
