import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

/** The organizer's screens, each its own lazily loaded chunk (phones on the field never download them). */
export const eventRoutes: RouteObject[] = [
  { path: 'events', element: lazyScreen(async () => (await import('./EventsScreen')).EventsScreen) },
  { path: 'events/:eventId', element: lazyScreen(async () => (await import('./EventScreen')).EventScreen) },
  {
    path: 'events/:eventId/sessions/:sessionId/targets',
    element: lazyScreen(async () => (await import('./TargetsScreen')).TargetsScreen),
  },
  {
    path: 'events/:eventId/sessions/:sessionId/cards',
    element: lazyScreen(async () => (await import('./CardBoardScreen')).CardBoardScreen),
  },
];
