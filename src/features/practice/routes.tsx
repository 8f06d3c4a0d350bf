import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

export const practiceRoutes: RouteObject[] = [
  {
    // Works from IndexedDB alone, with no account: no query library in its first load.
    path: 'practice/*',
    element: lazyScreen(async () => (await import('./PracticeArea')).PracticeArea, { serverData: false }),
  },
];
