import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import type { Me } from '../contract/auth';
import { Notice } from '../ui/Notice';
import { useMe } from '../local/me';
import { signInThenBack } from './nextPath';

/** Renders its children for a signed-in person, otherwise sends them to sign in and back. */
export function RequireSignIn({ children }: { children: (me: Me) => ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.data) return <>{children(me.data)}</>;
  // A stored "signed out" may be older than a sign-in a moment ago: ask the server before sending anyone away.
  if (me.data === null && me.isFetching) return <p>Checking your sign-in…</p>;
  if (me.data === null) {
    return <Navigate to={signInThenBack(location.pathname + location.search)} replace />;
  }
  if (me.isPending) return <p>Checking your sign-in…</p>;
  return (
    <Notice tone="error">
      {me.error?.message ?? 'Your sign-in could not be checked.'} Try again when you have signal.
    </Notice>
  );
}
