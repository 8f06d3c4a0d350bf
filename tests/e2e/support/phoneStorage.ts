import type { Page } from '@playwright/test';

/** Everything the app keeps in this browser: localStorage as text, and every IndexedDB table of its database. */
export async function phoneStorage(
  page: Page,
): Promise<{ local: string; tables: Record<string, unknown[]> }> {
  return page.evaluate(async () => {
    const local = JSON.stringify(
      Object.fromEntries(Object.keys(localStorage).map((k) => [k, localStorage.getItem(k)])),
    );
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const open = indexedDB.open('ringcall');
      open.onsuccess = () => resolve(open.result);
      open.onerror = () => reject(open.error);
    });
    const tables: Record<string, unknown[]> = {};
    for (const name of Array.from(db.objectStoreNames)) {
      tables[name] = await new Promise<unknown[]>((resolve) => {
        const all = db.transaction(name).objectStore(name).getAll();
        all.onsuccess = () => resolve(all.result as unknown[]);
      });
    }
    db.close();
    return { local, tables };
  });
}
