import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

export const matchPadRoutes: RouteObject[] = [
  {
    path: 'join/match',
    element: lazyScreen(async () => (await import('./JoinMatchScreen')).JoinMatchScreen),
  },
  {
    path: 'match/:eventId/:matchId',
    element: lazyScreen(async () => (await import('./MatchPadScreen')).MatchPadScreen),
  },
];
