import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

export const deskRoutes: RouteObject[] = [
  {
    path: 'desk/:eventId',
    element: lazyScreen(async () => (await import('./JudgeDeskScreen')).JudgeDeskScreen),
  },
  {
    // A fixed segment: ranked before the session's number below.
    path: 'desk/:eventId/shoot-offs',
    element: lazyScreen(async () => (await import('./ShootOffsScreen')).ShootOffsScreen),
  },
  {
    path: 'desk/:eventId/matches',
    element: lazyScreen(async () => (await import('./MatchesScreen')).MatchesScreen),
  },
  {
    path: 'desk/:eventId/matches/:matchId',
    element: lazyScreen(async () => (await import('./MatchScreen')).MatchScreen),
  },
  {
    path: 'desk/:eventId/:sessionId',
    element: lazyScreen(async () => (await import('./JudgeDeskScreen')).JudgeDeskScreen),
  },
];
