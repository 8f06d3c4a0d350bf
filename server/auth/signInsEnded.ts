/**
 * Counts the times any account's sign-ins were ended (endAllSessions) in this process. A person
 * remembered with their token (requireUser's `remember`) from before the count moved is looked
 * up again, so a password reset refuses the running access tokens at once.
 */
let ended = 0;

export const signInsEndedCount = (): number => ended;

export function noteSignInsEnded(): void {
  ended += 1;
}
