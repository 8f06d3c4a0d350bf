import { useMutation } from '@tanstack/react-query';
import { ApiError, apiRequest } from '../api/request';
import { serverFetch } from '../api/serverFetch';
import type {
  AuthSession,
  ResetPasswordInput,
  SignInInput,
  SignUpInput,
  SignUpPending,
} from '../contract/auth';
import { setSession } from '../api/session';
import { releasePhone } from '../local/phoneOwner';
import { checkMe, setMe } from '../local/me';

/** A sign-up under an unconfirmed account's address: nothing happens until the mailed link is used. */
export const isPending = (answer: AuthSession | SignUpPending): answer is SignUpPending =>
  'confirmByMail' in answer;

async function startSession<A>(path: string, body: unknown): Promise<A> {
  const response = await serverFetch(path, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
    body: JSON.stringify(body),
    credentials: 'same-origin',
  }).catch(() => undefined);
  if (!response)
    throw new Error('No connection to the Ringcall server. Signing in needs signal once; scoring does not.');
  const json = (await response.json().catch(() => undefined)) as
    AuthSession | { error?: { message?: string } } | undefined;
  if (!response.ok)
    throw new Error((json as { error?: { message?: string } })?.error?.message ?? 'Signing in failed.');
  return json as A;
}

function useSessionMutation<T, A extends AuthSession | SignUpPending = AuthSession>(path: string) {
  return useMutation({
    mutationFn: (input: T) => startSession<A>(path, input),
    onSuccess: async (answer) => {
      if (isPending(answer)) return;
      setSession(answer);
      await checkMe();
    },
  });
}

export const useSignIn = () => useSessionMutation<SignInInput>('/api/auth/sign-in');
export const useSignUp = () =>
  useSessionMutation<SignUpInput, AuthSession | SignUpPending>('/api/auth/sign-up');
/** Sets a new password from a mailed link, and signs this phone in (every other one is signed out). */
export const useResetPassword = () => useSessionMutation<ResetPasswordInput>('/api/auth/reset-password');

/**
 * Signs out and takes the person's data off the phone. Needs signal: the server must end the
 * sign-in, or its cookie would sign the next person on this phone in as this one.
 */
export function useSignOut() {
  return useMutation({
    mutationFn: async () => {
      await apiRequest<void>('/api/auth/sign-out', { method: 'POST' }).catch((error: unknown) => {
        if (error instanceof ApiError && error.status === 0)
          throw new Error(
            'Signing out needs a connection to the event server, so that this phone cannot sign you in again by itself. Stay signed in and try again with signal.',
          );
        throw error;
      });
      setSession(undefined);
      const cleared = releasePhone();
      setMe(null);
      await cleared;
    },
  });
}
