import type { RouteObject } from 'react-router-dom';
import { lazyScreen } from '../../app/lazyScreen';

export const authRoutes: RouteObject[] = [
  { path: 'sign-in', element: lazyScreen(async () => (await import('./SignInScreen')).SignInScreen) },
  { path: 'sign-up', element: lazyScreen(async () => (await import('./SignUpScreen')).SignUpScreen) },
  { path: 'invite', element: lazyScreen(async () => (await import('./InviteScreen')).InviteScreen) },
  {
    path: 'forgot-password',
    element: lazyScreen(async () => (await import('./ForgotPasswordScreen')).ForgotPasswordScreen),
  },
  {
    path: 'reset-password',
    element: lazyScreen(async () => (await import('./ResetPasswordScreen')).ResetPasswordScreen),
  },
  {
    path: 'verify-email',
    element: lazyScreen(async () => (await import('./VerifyEmailScreen')).VerifyEmailScreen),
  },
];
