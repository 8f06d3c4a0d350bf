import type { RouteObject } from 'react-router-dom';

export const deskRoutes: RouteObject[] = [
  {
    path: 'desk/:eventId',
    lazy: async () => ({ Component: (await import('./JudgeDeskScreen')).JudgeDeskScreen }),
  },
  {
    path: 'desk/:eventId/:sessionId',
    lazy: async () => ({ Component: (await import('./JudgeDeskScreen')).JudgeDeskScreen }),
  },
];
