/** A session's local start ("2026-12-12T09:30") as the organizer typed it: date and time, no zone shift. */
export const localStart = (startsAt: string): string => startsAt.replace('T', ' at ');
