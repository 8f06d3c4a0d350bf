import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

export const padRoutes: RouteObject[] = [
  {
    path: 'pad/:sessionId/:targetNumber',
    // Works from IndexedDB alone: the field screen loads without the query library.
    element: lazyScreen(async () => (await import('./PadScreen')).PadScreen, { serverData: false }),
  },
];
