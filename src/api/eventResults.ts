import { useQuery, useQueryClient } from '@tanstack/react-query';
import { errorFrom } from './request';
import { serverFetch } from './serverFetch';
import type { EventResults } from '../contract/results';
import { accessToken, onSessionChange } from './session';

/** The standings with the tag the server gave them, so the next poll can answer 304. */
export type HeldResults = { etag: string | null; results: EventResults };

export const resultsKey = (eventId: number) => ['results', eventId] as const;

/** How often an open results page asks whether anything changed (a 304 costs almost nothing). */
export const RESULTS_POLL_MS = 10_000;

// A spectator has no sign-in: after one refresh says so, polls stop asking until the sign-in changes.
let noSignIn = false;
onSessionChange(() => {
  noSignIn = false;
});

/**
 * `GET /api/results/:eventId` with If-None-Match: an unchanged event answers 304 and the held
 * copy stays. Sent with the sign-in when there is one (unpublished results for the event's
 * people); without it for everyone else.
 */
export async function fetchEventResults(
  eventId: number,
  held: HeldResults | undefined,
): Promise<HeldResults> {
  const headers = new Headers({ Accept: 'application/json' });
  if (held?.etag) headers.set('If-None-Match', held.etag);
  const token = noSignIn ? undefined : await accessToken().catch(() => undefined);
  noSignIn = !token;
  if (token) headers.set('Authorization', `Bearer ${token}`);
  let response: Response;
  try {
    response = await serverFetch(`/api/results/${eventId}`, { headers, cache: 'no-store' });
  } catch {
    throw new Error('No connection to the Ringcall server right now.');
  }
  if (response.status === 304 && held) return held;
  if (!response.ok) throw await errorFrom(response);
  return { etag: response.headers.get('ETag'), results: (await response.json()) as EventResults };
}

/** The event's results, polled while the page is open; the last copy is kept (and persisted) offline. */
export function useEventResults(eventId: number) {
  const client = useQueryClient();
  return useQuery({
    queryKey: resultsKey(eventId),
    queryFn: () => fetchEventResults(eventId, client.getQueryData<HeldResults>(resultsKey(eventId))),
    refetchInterval: RESULTS_POLL_MS,
    staleTime: 0,
  });
}
