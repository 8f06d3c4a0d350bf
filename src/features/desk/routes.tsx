import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

export const deskRoutes: RouteObject[] = [
  {
    path: 'desk/:eventId',
    element: lazyScreen(async () => (await import('./JudgeDeskScreen')).JudgeDeskScreen),
  },
  {
    path: 'desk/:eventId/:sessionId',
    element: lazyScreen(async () => (await import('./JudgeDeskScreen')).JudgeDeskScreen),
  },
];
