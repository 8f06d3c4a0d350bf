import type { RouteObject } from 'react-router-dom';

export const cardRoutes: RouteObject[] = [
  { path: 'cards', lazy: async () => ({ Component: (await import('./MyCardsScreen')).MyCardsScreen }) },
  {
    path: 'card/:sessionId/:entryId',
    lazy: async () => ({ Component: (await import('./CardScreen')).CardScreen }),
  },
];
