import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

/** Eliminations: the brackets of an event, seen like its results. */
export const bracketRoutes: RouteObject[] = [
  {
    path: 'results/:eventId/brackets',
    element: lazyScreen(async () => (await import('./BracketsScreen')).BracketsScreen),
  },
];
