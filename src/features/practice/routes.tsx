import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

export const practiceRoutes: RouteObject[] = [
  {
    // Works from IndexedDB alone, with no account: no query library in its first load.
    path: 'practice',
    element: lazyScreen(async () => (await import('./screens')).PracticeScreen, { serverData: false }),
  },
  {
    path: 'practice/:sessionId',
    element: lazyScreen(async () => (await import('./screens')).PracticeSessionScreen, {
      serverData: false,
    }),
  },
];
