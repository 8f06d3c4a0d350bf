import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

export const joinRoutes: RouteObject[] = [
  { path: 'join', element: lazyScreen(async () => (await import('./JoinScreen')).JoinScreen) },
];
