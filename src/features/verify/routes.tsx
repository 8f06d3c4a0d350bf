import type { RouteObject } from 'react-router-dom';

export const verifyRoutes: RouteObject[] = [
  { path: 'verify', lazy: async () => ({ Component: (await import('./VerifyScreen')).VerifyScreen }) },
];
