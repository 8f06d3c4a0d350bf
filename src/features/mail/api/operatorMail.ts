import { useCallback, useEffect, useState } from 'react';
import { errorFrom, messageOf } from '../../../api/request';
import { serverFetch } from '../../../api/serverFetch';
import type { CaughtMailMessage, CaughtMailSummary } from '../../../contract/caughtMail';

/**
 * The operator's inbox is not part of anyone's sign-in: it is opened with the key the server
 * printed at start, sent in a header. The key is kept for this tab only (sessionStorage), and the
 * answers are never put in the persisted query cache, so nothing of it stays on a shared phone.
 */
const KEY_STORE = 'ringcall.operatorMailKey';

/** Takes the key from the address (`#key=…`) once, then hides it from the address bar. */
export function takeOperatorKey(): string | undefined {
  const fromHash = new URLSearchParams(window.location.hash.slice(1)).get('key');
  if (fromHash) {
    sessionStorage.setItem(KEY_STORE, fromHash);
    window.history.replaceState(null, '', window.location.pathname);
    return fromHash;
  }
  return sessionStorage.getItem(KEY_STORE) ?? undefined;
}

export function rememberOperatorKey(key: string | undefined): void {
  if (key) sessionStorage.setItem(KEY_STORE, key);
  else sessionStorage.removeItem(KEY_STORE);
}

async function operatorFetch(path: string, key: string): Promise<Response> {
  let response: Response;
  try {
    response = await serverFetch(path, { headers: { 'X-Operator-Key': key }, cache: 'no-store' });
  } catch {
    throw new Error('No connection to the Ringcall server right now.');
  }
  if (!response.ok) throw await errorFrom(response);
  return response;
}

type Loaded<T> = { data?: T; error?: string; status?: number };

/** Loads `path` now and every `refreshMs` (if given) while mounted. */
function useOperatorData<T>(path: string | undefined, key: string, refreshMs?: number): Loaded<T> {
  const [state, setState] = useState<Loaded<T>>({});
  useEffect(() => {
    if (!path) return;
    let live = true;
    const load = () =>
      operatorFetch(path, key)
        .then((response) => response.json() as Promise<T>)
        .then(
          (data) => live && setState({ data }),
          (error: unknown) =>
            live && setState({ error: messageOf(error), status: (error as { status?: number }).status ?? 0 }),
        );
    void load();
    const timer = refreshMs ? setInterval(() => void load(), refreshMs) : undefined;
    return () => {
      live = false;
      clearInterval(timer);
    };
  }, [path, key, refreshMs]);
  return state;
}

export const useOperatorMailList = (key: string) =>
  useOperatorData<{ messages: CaughtMailSummary[] }>('/api/operator/mail', key, 5_000);

export const useOperatorMail = (key: string, id: number | undefined) =>
  useOperatorData<CaughtMailMessage>(id === undefined ? undefined : `/api/operator/mail/${id}`, key);

export function useSaveAttachment(key: string) {
  return useCallback(
    async (mailId: number, index: number, filename: string) => {
      const response = await operatorFetch(`/api/operator/mail/${mailId}/attachments/${index}`, key);
      const url = URL.createObjectURL(await response.blob());
      const a = document.createElement('a');
      a.href = url;
      a.download = filename;
      a.click();
      URL.revokeObjectURL(url);
    },
    [key],
  );
}
