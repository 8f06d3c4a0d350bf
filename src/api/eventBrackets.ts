import { useQuery } from '@tanstack/react-query';
import { apiRequest } from './request';
import type { BracketDto } from '../contract/matches';

export const bracketsKey = (eventId: number) => ['brackets', eventId] as const;

/** How often an open bracket page asks for the latest matches. */
export const BRACKETS_POLL_MS = 15_000;

/** `GET /api/events/:eventId/brackets`: public once the results are published, else for the event's people. */
export const fetchEventBrackets = (eventId: number) =>
  apiRequest<{ brackets: BracketDto[] }>(`/api/events/${eventId}/brackets`);

export function useEventBrackets(eventId: number) {
  return useQuery({
    queryKey: bracketsKey(eventId),
    queryFn: () => fetchEventBrackets(eventId),
    refetchInterval: BRACKETS_POLL_MS,
    // Opening the page always asks: the saved copy only fills the wait (and offline).
    staleTime: 0,
  });
}
