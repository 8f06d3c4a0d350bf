import { createBrowserRouter } from 'react-router-dom';
import { AppLayout } from './AppLayout';
import { RouteError } from './RouteError';
import { authRoutes } from '../features/auth/routes';
import { padRoutes } from '../features/pad/routes';
import { deskRoutes } from '../features/desk/routes';
import { verifyRoutes } from '../features/verify/routes';
import { cardRoutes } from '../features/cards/routes';
import { eventRoutes } from '../features/events/routes';

/** Each screen is its own lazily loaded chunk, so a phone downloads the pad without the organizer's screens. */
export const router = createBrowserRouter([
  {
    path: '/',
    element: <AppLayout />,
    errorElement: <RouteError />,
    children: [
      {
        errorElement: <RouteError />,
        children: [
          {
            index: true,
            lazy: async () => ({ Component: (await import('../features/home/HomeScreen')).HomeScreen }),
          },
          ...authRoutes,
          ...padRoutes,
          ...deskRoutes,
          ...verifyRoutes,
          ...cardRoutes,
          ...eventRoutes,
          {
            path: 'mail',
            lazy: async () => ({
              Component: (await import('../features/mail/CaughtMailScreen')).CaughtMailScreen,
            }),
          },
          { path: '*', lazy: async () => ({ Component: (await import('./NotFound')).NotFound }) },
        ],
      },
    ],
  },
]);
