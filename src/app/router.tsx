import { Suspense, use } from 'react';
import { Outlet, useRoutes, type RouteObject } from 'react-router-dom';
import { Frame } from './Frame';
import { lazyScreen } from './lazyScreen';
import { loadOnce } from './loadOnce';
import { RouteBoundary } from './RouteBoundary';
import { opensOnPad } from '../local/firstScreen';
import { authRoutes } from '../features/auth/routes';
import { joinRoutes } from '../features/join/routes';
import { loadPadScreen, padRoutes } from '../features/pad/routes';
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

const loadAppLayout = loadOnce(async () => (await import('./AppLayout')).AppLayout);
function AppLayout() {
  const Layout = use(loadAppLayout());
  // eslint-disable-next-line react-hooks/static-components -- the same component on every drawing (loadOnce)
  return <Layout />;
}
// Fetched at once (beside the entry) for every page but the public results, which never need it.
if (typeof location !== 'undefined' && !location.pathname.startsWith('/results/')) void loadAppLayout();

/** The longest the app's first drawing waits for the pad it was opened on. */
const FIRST_DRAWING_WAIT_MS = 3_000;

/**
 * When the app's first drawing may start. Opened on the pad (a reload, the phone's home-screen
 * link), it waits for the layout's and the pad's code and the pad's first read, asked for now:
 * the pad is then drawn whole, in one pass. Drawn at once, a slow phone drew the frame, then
 * "Opening…", then the pad, each with its own layout, and React holds back content replacing a
 * fallback for up to 300 ms. Offline, the service worker's copy of the page has no preload hints
 * either: the pad's chunks would be asked for only once the layout had run. Other pages draw at once.
 */
export const firstDrawing: Promise<void> = opensOnPad
  ? Promise.race([
      Promise.all([loadAppLayout(), loadPadScreen()]).then(
        () => undefined,
        // A chunk that cannot load is the screen's to show (RouteError).
        () => undefined,
      ),
      new Promise<void>((resolve) => setTimeout(resolve, FIRST_DRAWING_WAIT_MS)),
    ])
  : Promise.resolve();

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
