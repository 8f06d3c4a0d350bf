import { useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { MatchJoinCodeDto } from '../../../contract/matches';

/** `GET /api/events/:eventId/matches/join-codes`: the open matches' codes for their two writers. */
export const useMatchJoinCodes = (eventId: number, enabled: boolean, openMatches: number) =>
  useQuery({
    // Asked again when matches open (a new round): their codes are made when first asked for.
    queryKey: ['match-join-codes', eventId, openMatches],
    queryFn: () => apiRequest<{ codes: MatchJoinCodeDto[] }>(`/api/events/${eventId}/matches/join-codes`),
    enabled,
  });
