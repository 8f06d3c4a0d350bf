import type { RouteObject } from 'react-router-dom';

export const authRoutes: RouteObject[] = [
  { path: 'sign-in', lazy: async () => ({ Component: (await import('./SignInScreen')).SignInScreen }) },
  { path: 'sign-up', lazy: async () => ({ Component: (await import('./SignUpScreen')).SignUpScreen }) },
  { path: 'invite', lazy: async () => ({ Component: (await import('./InviteScreen')).InviteScreen }) },
  {
    path: 'verify-email',
    lazy: async () => ({ Component: (await import('./VerifyEmailScreen')).VerifyEmailScreen }),
  },
];
