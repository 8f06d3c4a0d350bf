import { Suspense, lazy } from 'react';
import { Outlet, useRoutes, type RouteObject } from 'react-router-dom';
import { Frame } from './Frame';
import { lazyScreen } from './lazyScreen';
import { RouteBoundary } from './RouteBoundary';
import { opensOnPad } from '../local/firstScreen';
import { authRoutes } from '../features/auth/routes';
import { joinRoutes } from '../features/join/routes';
import { padRoutes } from '../features/pad/routes';
import { deskRoutes } from '../features/desk/routes';
import { verifyRoutes } from '../features/verify/routes';
import { cardRoutes } from '../features/cards/routes';
import { eventRoutes } from '../features/events/routes';
import { resultsRoutes } from '../features/results/routes';
import { bracketRoutes } from '../features/brackets/routes';
import { practiceRoutes } from '../features/practice/routes';
import { matchPadRoutes } from '../features/matchpad/routes';

/** The screen area: a screen that throws, or whose chunk cannot be fetched, shows RouteError inside the layout. */
function ScreenArea() {
  return (
    <RouteBoundary>
      <Suspense fallback={<p>Opening…</p>}>
        <Outlet />
      </Suspense>
    </RouteBoundary>
  );
}

const loadAppLayout = async () => ({ default: (await import('./AppLayout')).AppLayout });
const AppLayout = lazy(loadAppLayout);
// Fetched at once (beside the entry) for every page but the public results, which never need it.
if (typeof location !== 'undefined' && !location.pathname.startsWith('/results/')) void loadAppLayout();
// The pad too, when it is the page opened: offline, the service worker's copy of the page has no
// preload hints, and the pad's chunks would otherwise be asked for only once the layout has run.
if (opensOnPad) void import('../features/pad/PadScreen');

/**
 * Each screen is its own lazily loaded chunk, so a phone downloads the pad without the organizer's
 * screens. Declarative routes, not a data router: screens load their data with TanStack Query and
 * Dexie, and the data router's state machine added ~16 KiB gzip to every screen's first load.
 * The query library itself comes with the first screen that needs it (see lazyScreen).
 */
const routes: RouteObject[] = [
  {
    // The public results pages: no sync loop, no phone database, so a spectator's first load is small.
    path: '/',
    element: <Frame />,
    children: [{ element: <ScreenArea />, children: resultsRoutes }],
  },
  {
    path: '/',
    element: (
      <Suspense fallback={null}>
        <AppLayout />
      </Suspense>
    ),
    children: [
      {
        element: <ScreenArea />,
        children: [
          {
            index: true,
            element: lazyScreen(async () => (await import('../features/home/HomeScreen')).HomeScreen),
          },
          ...authRoutes,
          ...joinRoutes,
          ...matchPadRoutes,
          ...padRoutes,
          ...deskRoutes,
          ...verifyRoutes,
          ...cardRoutes,
          ...eventRoutes,
          ...bracketRoutes,
          ...practiceRoutes,
          {
            // The operator's, not an app role's: no sign-in, and nothing of it in the query cache.
            path: 'operator/mail',
            element: lazyScreen(
              async () => (await import('../features/mail/OperatorMailScreen')).OperatorMailScreen,
              { serverData: false },
            ),
          },
          {
            path: '*',
            element: lazyScreen(async () => (await import('./NotFound')).NotFound, { serverData: false }),
          },
        ],
      },
    ],
  },
];

export function AppRoutes() {
  // A layout that throws replaces the whole page with RouteError.
  return <RouteBoundary>{useRoutes(routes)}</RouteBoundary>;
}
