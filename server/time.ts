/** Timestamps are stored as ISO 8601 UTC strings: portable across SQLite and PostgreSQL. */
export const nowIso = (): string => new Date().toISOString();
