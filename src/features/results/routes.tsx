import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

/** Results: public (no sign-in) page per event and its big-screen variant for the field. */
export const resultsRoutes: RouteObject[] = [
  {
    path: 'results/:eventId',
    element: lazyScreen(async () => (await import('./ResultsScreen')).ResultsScreen),
  },
  {
    path: 'results/:eventId/field',
    element: lazyScreen(async () => (await import('./FieldResultsScreen')).FieldResultsScreen),
  },
];
