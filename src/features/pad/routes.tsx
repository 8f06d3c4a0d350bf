import type { RouteObject } from 'react-router-dom';
import { loadedScreen, screenLoader } from '../../app/lazyScreen';

/**
 * The pad's code, and when the app is opened on the pad, its first read of the phone's database
 * (padReadAhead): the pad's first drawing waits for that read, so it is drawn whole.
 * Works from IndexedDB alone: the field screen loads without the query library.
 */
export const loadPadScreen = screenLoader(
  async () => {
    const [{ PadScreen }, { readAheadSettled }] = await Promise.all([
      import('./PadScreen'),
      import('./padReadAhead'),
    ]);
    await readAheadSettled();
    return PadScreen;
  },
  { serverData: false },
);

export const padRoutes: RouteObject[] = [
  { path: 'pad/:sessionId/:targetNumber', element: loadedScreen(loadPadScreen) },
];
