import Database from 'better-sqlite3';

const file = () => `${process.env.E2E_DATA_DIR ?? '.tmp/e2e-4317'}/ringcall.sqlite`;

/** Reads the browser-test server's database directly (read-only) for facts a test needs to look up. */
export function readDemoDb<T>(query: string, ...params: unknown[]): T {
  const db = new Database(file(), { readonly: true, fileMustExist: true });
  try {
    return db.prepare(query).get(...params) as T;
  } finally {
    db.close();
  }
}

export function readDemoRows<T>(query: string, ...params: unknown[]): T[] {
  const db = new Database(file(), { readonly: true, fileMustExist: true });
  try {
    return db.prepare(query).all(...params) as T[];
  } finally {
    db.close();
  }
}

/** A demo target's join code, session, event and archers (with their accounts' e-mail), in position order. */
export function demoTarget(target: number) {
  const { code, session_id: sessionId } = readDemoDb<{ code: string; session_id: number }>(
    'select code, session_id from join_codes where target_number = ? and revoked_at is null',
    target,
  );
  const eventId = readDemoDb<{ event_id: number }>(
    'select event_id from event_sessions where id = ?',
    sessionId,
  ).event_id;
  const archers = readDemoRows<{ entry_id: number; position: string; email: string }>(
    `select t.entry_id, t.position, u.email from target_assignments t join entries e on e.id = t.entry_id
     join users u on u.id = e.user_id where t.session_id = ? and t.target_number = ? order by t.position`,
    sessionId,
    target,
  );
  return { code, sessionId, eventId, archers };
}
