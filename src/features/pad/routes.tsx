import type { RouteObject } from 'react-router-dom';

export const padRoutes: RouteObject[] = [
  { path: 'join', lazy: async () => ({ Component: (await import('../join/JoinScreen')).JoinScreen }) },
  {
    path: 'pad/:sessionId/:targetNumber',
    lazy: async () => ({ Component: (await import('./PadScreen')).PadScreen }),
  },
];
