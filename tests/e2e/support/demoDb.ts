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
