import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

export const cardRoutes: RouteObject[] = [
  { path: 'cards', element: lazyScreen(async () => (await import('./MyCardsScreen')).MyCardsScreen) },
  {
    path: 'card/:sessionId/:entryId',
    element: lazyScreen(async () => (await import('./CardScreen')).CardScreen),
  },
  {
    path: 'events/:eventId/sessions/:sessionId/cards',
    element: lazyScreen(async () => (await import('./CardBoardScreen')).CardBoardScreen),
  },
];
