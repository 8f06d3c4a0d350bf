import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

export const verifyRoutes: RouteObject[] = [
  { path: 'verify', element: lazyScreen(async () => (await import('./VerifyScreen')).VerifyScreen) },
];
