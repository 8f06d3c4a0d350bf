import type { ProgressSession } from '../../../core/practice/progress';
import type { PracticeEndRow, PracticeSessionRow } from '../../../local/db';

/** The phone's rows as the core's progress wants them: each session with its ends. */
export function progressSessions(
  sessions: readonly PracticeSessionRow[],
  ends: readonly PracticeEndRow[],
): ProgressSession[] {
  const bySession = new Map<string, PracticeEndRow[]>();
  for (const end of ends) {
    const list = bySession.get(end.sessionId);
    if (list) list.push(end);
    else bySession.set(end.sessionId, [end]);
  }
  return sessions.map((s) => ({
    id: s.id,
    startedAt: s.startedAt,
    bowStyle: s.bowStyle,
    ends: bySession.get(s.id) ?? [],
  }));
}

/** A week's Monday (YYYY-MM-DD, UTC) as a person reads it: "30 Nov 2026". */
export function weekLabel(weekStart: string): string {
  return new Date(`${weekStart}T00:00:00Z`).toLocaleDateString('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    timeZone: 'UTC',
  });
}

export const perArrow = (n: number) => n.toFixed(2);
