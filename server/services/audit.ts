import type { Db } from '../db';
import { nowIso } from '../time';

/** Appends one line to the audit log: who did what, in which event. */
export async function audit(
  db: Db,
  entry: { userId: number | null; eventId: number | null; action: string; details?: Record<string, unknown> },
): Promise<void> {
  await db('audit_log').insert({
    at: nowIso(),
    user_id: entry.userId,
    event_id: entry.eventId,
    action: entry.action,
    details: JSON.stringify(entry.details ?? {}),
  });
}
