import type { RouteObject } from 'react-router-dom';

/** The organizer's screens, each its own lazily loaded chunk (phones on the field never download them). */
export const eventRoutes: RouteObject[] = [
  { path: 'events', lazy: async () => ({ Component: (await import('./EventsScreen')).EventsScreen }) },
  { path: 'events/:eventId', lazy: async () => ({ Component: (await import('./EventScreen')).EventScreen }) },
  {
    path: 'events/:eventId/sessions/:sessionId/targets',
    lazy: async () => ({ Component: (await import('./TargetsScreen')).TargetsScreen }),
  },
];
